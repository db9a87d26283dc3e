import { defineProject } from 'vitest/config';

export default defineProject({
  test: { name: 'jobs-domain', include: ['src/**/*.test.ts'], environment: 'node' },
});
