import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { runFuzz, STILL_CLOCK } from './support/run-fuzz.js';

/**
 * Seeded fuzzing of every endpoint (issue 7): 2,500 random and adversarial query strings
 * (random keys and values; huge, negative, float, exponent and non-ASCII-digit numbers; empty
 * values; repeats; 10 kB values; percent-encoding garbage; prototype-named keys). Every
 * response must keep the contract checked in support/check-response.ts. The work budget is
 * lowered so that accepted requests stay cheap; the checks do not depend on which families the
 * samplers currently serve (a 422 "not available" is a valid answer naming its limit).
 * A longer run (50,000 cases, several seeds) is test/verify/fuzz.verify.ts.
 */
describe('fuzzed queries', () => {
  it('get only 2xx/4xx answers: problem details naming a parameter or limit, or samples of the family', async () => {
    const app = createApp({ limits: { workBudgetMs: 200 }, clock: STILL_CLOCK, drawSeed: () => 'fuzz-drawn-seed' });
    const report = await runFuzz(app, 'partsmith-fuzz-1', 2500);
    expect(report.failures, `${report.failureCount} failing cases; statuses ${JSON.stringify(report.byStatus)}`).toEqual([]);
    // The fuzz must reach both sides of the contract, not only the validator.
    expect(report.byStatus[200] ?? 0).toBeGreaterThan(report.total * 0.1);
    expect(report.byStatus[400] ?? 0).toBeGreaterThan(report.total * 0.3);
    expect(report.byStatus[414] ?? 0).toBeGreaterThan(0);
    expect(report.byStatus[422] ?? 0).toBeGreaterThan(0);
  });

  it.each([
    ['reversed partitions', /non-increasing/, (path: string) => path === '/v1/partitions', 150],
    ['problems without parameter names', /names neither a parameter nor a limit/, () => true, 1000],
    ['listings out of order', /not in the documented order/, (path: string) => path.endsWith('/list'), 300],
  ] as const)('would catch a service that breaks the contract: %s', async (breakage, symptom, only, cases) => {
    const app = createApp({ limits: { workBudgetMs: 200 }, clock: STILL_CLOCK });
    const broken = {
      async fetch(request: Request): Promise<Response> {
        const response = await app.fetch(request);
        const url = new URL(request.url);
        if (breakage === 'reversed partitions' && response.status === 200 && url.pathname === '/v1/partitions' && !/format=|as=/.test(url.search)) {
          const body = await response.json();
          body.samples = body.samples.map((s: number[]) => [...s].reverse()); // ascending is not a partition's form
          return new Response(JSON.stringify(body), response);
        }
        if (breakage === 'listings out of order' && response.status === 200 && url.pathname.endsWith('/list') && !/format=|as=/.test(url.search)) {
          const body = await response.json();
          const parts = body.members.map((m: { parts: number[] }) => m.parts).reverse(); // ranks kept, members swapped
          body.members = body.members.map((m: { rank: string }, i: number) => ({ rank: m.rank, parts: parts[i] }));
          return new Response(JSON.stringify(body), response);
        }
        if (breakage === 'problems without parameter names' && response.status === 400) {
          const body = await response.json();
          return new Response(JSON.stringify({ ...body, errors: undefined, detail: 'bad' }), response);
        }
        return response;
      },
    };
    // The cases cycle over the endpoints the breakage touches (all of them for problems).
    const report = await runFuzz(broken, 'partsmith-fuzz-2', cases, only);
    expect(report.failureCount).toBeGreaterThan(5);
    expect(report.failures.join('\n')).toMatch(symptom);
  });
});
