import type { WalkerFixture } from './fixture';

// Filled as the routes land.
export const filesWalk: WalkerFixture = {
  prepare: async () => ({}),
  bodies: {},
};
