/** Site surveys, their areas and takeoff versions, slab readings and file links. */
// Filled by the survey migration.
export type SurveyTables = Record<never, never>;
