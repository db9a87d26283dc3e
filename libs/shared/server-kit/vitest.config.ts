import { defineProject } from 'vitest/config';

export default defineProject({
  test: { name: 'shared-server-kit', include: ['src/**/*.test.ts'], environment: 'node' },
});
