import type { WalkerFixture } from './fixture';

// Filled as the routes land.
export const customersWalk: WalkerFixture = {
  prepare: async () => ({}),
  bodies: {},
};
