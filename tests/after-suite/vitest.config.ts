import { defineProject } from 'vitest/config';
import { fileURLToPath } from 'node:url';
import tsconfigPaths from 'vite-tsconfig-paths';

const root = fileURLToPath(new URL('../..', import.meta.url));

export default defineProject({
  // The @latchwork/* aliases of tsconfig.base.json, as the apps' bundler resolves them.
  plugins: [tsconfigPaths({ root, projects: ['tsconfig.base.json'] })],
  test: {
    name: 'after-suite',
    root: fileURLToPath(new URL('.', import.meta.url)),
    include: ['**/*.test.ts'],
    environment: 'node',
    testTimeout: 120_000,
    hookTimeout: 30_000,
  },
});
