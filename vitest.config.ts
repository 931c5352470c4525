import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    environment: 'node',
    include: ['test/core/**/*.test.ts', 'test/cli/**/*.test.ts', 'test/props/**/*.test.ts', 'test/ui/**/*.test.ts'],
    testTimeout: 60000,
  },
});
