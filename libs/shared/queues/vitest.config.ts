import { defineProject } from 'vitest/config';

export default defineProject({
  test: { name: 'shared-queues', include: ['src/**/*.test.ts'], environment: 'node' },
});
