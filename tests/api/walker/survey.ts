import type { WalkerFixture } from './fixture';

// Filled as the routes land.
export const surveyWalk: WalkerFixture = {
  prepare: async () => ({}),
  bodies: {},
};
