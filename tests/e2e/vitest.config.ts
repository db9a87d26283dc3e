import { fileURLToPath } from 'node:url';
import { defineProject } from 'vitest/config';
import tsconfigPaths from 'vite-tsconfig-paths';

const root = fileURLToPath(new URL('../..', import.meta.url));

// Browser end-to-end tests against the built app behind the gateway (LW_APP_URL). One file at a
// time: each launches its own chromium, and two at once would crowd a 2-core machine.
export default defineProject({
  // The @latchwork/* aliases of tsconfig.base.json (the tests read the permission table).
  plugins: [tsconfigPaths({ root, projects: ['tsconfig.base.json'] })],
  test: {
    name: 'e2e',
    root: fileURLToPath(new URL('.', import.meta.url)),
    include: ['**/*.e2e.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
