import type { WalkerFixture } from './fixture';

// Filled as the routes land.
export const stockWalk: WalkerFixture = {
  prepare: async () => ({}),
  bodies: {},
};
