import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['test/verify/**', 'node_modules/**'],
    reporters: ['default', './test/support/closing-line-reporter.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
