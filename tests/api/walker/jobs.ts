import type { WalkerFixture } from './fixture';

// Filled as the routes land.
export const jobsWalk: WalkerFixture = {
  prepare: async () => ({}),
  bodies: {},
};
