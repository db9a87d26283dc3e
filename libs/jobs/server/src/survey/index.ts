/**
 * What other features and the demo use of the site survey: the warnings a quote shows, and the
 * functions that record a survey the way the API does (the demo data goes through them).
 */
export { surveyWarningsForJob, type JobSurveyWarnings } from './survey-warnings-for-job';
export { firmSlabLimits } from './slab-limits.repository';
export { recordReading, type ReadingInput } from './slab-readings.repository';
export { saveSurvey, type SurveyDetails } from './survey.repository';
export { saveVersion, summaryOf, type TakeoffSummary } from './takeoff-versions';
