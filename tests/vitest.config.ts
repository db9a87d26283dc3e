import { defineConfig } from 'vitest/config';

// Tests against the running stack (PostgreSQL, Redis, the fakes, the built app), started by
// tests/run-all.mjs on the test profile's own ports.
export default defineConfig({ test: { projects: ['tests/*/vitest.config.ts'] } });
