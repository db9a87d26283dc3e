/** Stock counts as services, for callers outside the HTTP layer (the demo, the worker). */
export { startCount } from './count-start';
export { cancelCount, saveEntries, saveReasons, submitCount } from './count-workflow';
export { approveCount, postCount, reviewCount } from './count-posting';
