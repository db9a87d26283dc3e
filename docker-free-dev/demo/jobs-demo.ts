import type { DemoStep } from './demo-context';

// Filled as the feature lands.
export const jobsDemo: DemoStep = async () => '';
