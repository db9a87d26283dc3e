import { defineProject } from 'vitest/config';

export default defineProject({
  test: { name: 'identity-domain', include: ['src/**/*.test.ts'], environment: 'node' },
});
