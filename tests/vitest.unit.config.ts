import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Unit tests: pure and in-process tests of the libraries (no services needed). Tests that
// need the running stack are in tests/vitest.config.ts. The web app's component tests run
// through Angular's unit-test builder (nx run web:test).
export default defineConfig({
  test: {
    root: fileURLToPath(new URL('..', import.meta.url)),
    projects: ['libs/**/vitest.config.ts'],
  },
});
