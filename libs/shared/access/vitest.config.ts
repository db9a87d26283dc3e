import { defineProject } from 'vitest/config';

export default defineProject({
  test: { name: 'shared-access', include: ['src/**/*.test.ts'], environment: 'node' },
});
