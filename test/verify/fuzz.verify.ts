import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { runFuzz, STILL_CLOCK } from '../abuse/support/run-fuzz.js';

/**
 * The long fuzz run of issue 7: 50,000 seeded query strings in five independent streams of
 * 10,000, against the same contract as test/abuse/fuzz.test.ts. The work budget is lowered so
 * that the run stays in the minutes (the contract is the same at any budget).
 */
describe('fuzzed queries, long run', () => {
  it.each(['verify-1', 'verify-2', 'verify-3', 'verify-4', 'verify-5'])('keep the contract for 10,000 queries of stream %s', async (seed) => {
    const app = createApp({ limits: { workBudgetMs: 1000 }, clock: STILL_CLOCK });
    const report = await runFuzz(app, `partsmith-fuzz-${seed}`, 10_000);
    expect(report.failures, `${report.failureCount} failing cases; statuses ${JSON.stringify(report.byStatus)}`).toEqual([]);
    expect(report.byStatus[200] ?? 0).toBeGreaterThan(1000);
  });
});
