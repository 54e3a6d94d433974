import { defineConfig } from 'vitest/config';

// Heavy statistical checks: large samples at large n against published limit laws.
export default defineConfig({
  test: {
    include: ['test/verify/**/*.verify.ts'],
    reporters: ['default', './test/support/closing-line-reporter.ts'],
    testTimeout: 600_000,
    hookTimeout: 600_000,
  },
});
