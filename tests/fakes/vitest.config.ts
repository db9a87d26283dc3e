import { fileURLToPath } from 'node:url';
import { defineProject } from 'vitest/config';

// Tests of the local fakes in docker-free-dev/. Each test file starts its fake in-process on
// port 0 with a temporary data folder and talks to it with the real client library.
export default defineProject({
  // `include` is resolved against the project root: make that this folder, wherever vitest
  // is started from (`npx vitest run --config tests/fakes/vitest.config.ts`).
  root: fileURLToPath(new URL('.', import.meta.url)),
  // keep vite's cache in the workspace's node_modules, not a new one in this folder
  cacheDir: fileURLToPath(new URL('../../node_modules/.vite/fakes', import.meta.url)),
  test: {
    name: 'fakes',
    include: ['**/*.test.ts'],
    environment: 'node',
    testTimeout: 20_000,
    hookTimeout: 20_000,
  },
});
