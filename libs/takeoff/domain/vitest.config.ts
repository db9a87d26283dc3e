import { defineProject } from 'vitest/config';

export default defineProject({
  test: { name: 'takeoff', include: ['src/**/*.test.ts'], environment: 'node' },
});
