import { defineProject } from 'vitest/config';

export default defineProject({
  test: { name: 'stock-domain', include: ['src/**/*.test.ts'], environment: 'node' },
});
