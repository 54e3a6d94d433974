import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { DEFAULT_LIMITS } from '../../src/http/limits.js';
import { formatMs, jobMs, sampleMs } from '../../src/http/work-budget.js';
import { compositionFamily } from '../../src/library/compositions.js';
import { partitionFamily } from '../../src/library/partitions.js';

/**
 * The work budget in time. Nothing here runs samplers for long or reads a clock: HEAD requests
 * go through every limit and answer without drawing a sample, and the figures the refusals
 * state are compared with the planner's estimate priced by the cost table (a pure function of
 * the family), so these tests mean the same on slow and fast machines.
 */
const app = createApp();
const head = (path: string) => app.fetch(new Request(`http://x${path}`, { method: 'HEAD' }));
const get = (path: string, application = app) => application.fetch(new Request(`http://x${path}`));

describe('the work budget (2 s by default, measured per method)', () => {
  it('is stated in time', () => {
    expect(DEFAULT_LIMITS.workBudgetMs).toBe(2000);
    expect(formatMs(2000)).toBe('2 s');
    expect(formatMs(3400)).toBe('3.4 s');
    expect(formatMs(450.4)).toBe('450 ms');
    expect(formatMs(0.234)).toBe('0.23 ms');
  });

  it("serves the issue's request: 5,000 samples of n = 10^6 as multiplicities", async () => {
    const family = partitionFamily({ n: 1_000_000 });
    const estimate = jobMs({ sampler: family.sampler, numbersPerSample: 2 * family.sampler.expectedDistinct, count: 5000 });
    expect(estimate).toBeLessThan(DEFAULT_LIMITS.workBudgetMs);
    const response = await head('/v1/partitions?n=1000000&count=5000&as=multiplicities&format=ndjson&seed=abort');
    expect(response.status).toBe(200);
    expect(response.headers.get('partsmith-method')).toBe('self-similar/1');
  });

  it('refuses a request over the budget with its time, the limit, and a count and start that fit', async () => {
    const family = partitionFamily({ n: 1_000_000, distinct: true });
    const each = sampleMs({ sampler: family.sampler, numbersPerSample: family.sampler.expectedLength });
    const fits = Math.floor(DEFAULT_LIMITS.workBudgetMs / each);
    expect(fits).toBeGreaterThan(1);
    expect(fits).toBeLessThan(10_000);
    const path = '/v1/partitions?n=1000000&distinct=true&seed=big';
    const response = await get(`${path}&count=10000&start=7`);
    expect(response.status).toBe(422);
    const problem = await response.json();
    expect(problem.detail).toContain(`needs about ${formatMs(10_000 * each)} of work (10,000 samples at about ${formatMs(each)} each); the limit is 2 s of work per request.`);
    expect(problem.detail).toContain(`Ask for count=${fits}, then page with start=${7 + fits}, start=${7 + 2 * fits}`);
    expect(problem.errors).toEqual([{ param: 'count', message: expect.stringContaining(`at most ${fits} samples`) }]);
    // The advice is true: that count is accepted, from the first page and from the next.
    expect((await head(`${path}&count=${fits}&start=7`)).status).toBe(200);
    expect((await head(`${path}&count=${fits}&start=${7 + fits}`)).status).toBe(200);
    expect((await head(`${path}&count=${fits + 1}&start=7`)).status).toBe(422);
  });

  it('when not even one sample fits, says so and what to change about the family, never "at most 0"', async () => {
    // 300,000 parts of at most 5 summing to 10^6: seconds of work for a single sample.
    const family = compositionFamily({ n: 1_000_000, maxPart: 5, length: 300_000 });
    const each = sampleMs({ sampler: family.sampler, numbersPerSample: family.sampler.expectedLength });
    expect(each).toBeGreaterThan(2 * DEFAULT_LIMITS.workBudgetMs);
    const response = await get('/v1/compositions?n=1000000&maxPart=5&length=300000&seed=x');
    expect(response.status).toBe(422);
    const problem = await response.json();
    expect(problem.detail).toContain(`One sample of this family needs about ${formatMs(each)} of work; the limit is 2 s of work per request, so not even one sample fits.`);
    expect(problem.detail).toMatch(/smaller n/);
    expect(problem.detail).toMatch(/fewer parts \(a smaller length or maxLength\)/);
    expect(problem.detail).not.toMatch(/at most 0/);
    expect(problem.errors[0].param).toBe('n');
  });

  it("answers the issue's composition request by the estimate, and never with \"at most 0\"", async () => {
    const family = compositionFamily({ n: 1_000_000, allowed: [3, 7, 11], length: 100_000 });
    const each = sampleMs({ sampler: family.sampler, numbersPerSample: family.sampler.expectedLength });
    const response = await head('/v1/compositions?n=1000000&allowed=3,7,11&length=100000&seed=x');
    expect(response.status).toBe(each <= DEFAULT_LIMITS.workBudgetMs ? 200 : 422);
    if (response.status === 422) {
      const problem = await (await get('/v1/compositions?n=1000000&allowed=3,7,11&length=100000&seed=x')).json();
      expect(problem.detail).toMatch(/not even one sample fits\. Ask for a smaller n .*, or ask for fewer parts/);
      expect(problem.detail).not.toMatch(/at most 0/);
    }
  });

  it('suggests as=multiplicities where it would make a partition fit the response size', async () => {
    const small = createApp({ limits: { maxNumbers: 100 } });
    const parts = await (await get('/v1/partitions?n=10000&seed=x', small)).json();
    expect(parts.status).toBe(422);
    expect(parts.detail).toMatch(/One sample of this family holds about [\d,]+ numbers; the limit is 100 per response, so not even one sample fits\. Ask for as=multiplicities/);
    expect(parts.errors[0].param).toBe('as');
    const compositions = await (await get('/v1/compositions?n=1000&seed=x', small)).json();
    expect(compositions.detail).toMatch(/not even one sample fits\. Ask for a smaller n\.$/);
    expect(compositions.errors[0].param).toBe('n');
    for (const body of [parts, compositions]) expect(body.detail).not.toMatch(/at most 0/);
  });

  it('the check and diagram endpoints use the same budget and say when not even one sample fits', async () => {
    const tiny = createApp({ limits: { workBudgetMs: 0.001 } });
    for (const path of ['/v1/partitions/check?n=100000&samples=10&seed=a', '/v1/compositions/check?n=100000&samples=10&seed=a', '/v1/partitions/diagram?n=30000&seed=a&index=0']) {
      const response = await get(path, tiny);
      expect(response.status, path).toBe(422);
      const detail = (await response.json()).detail;
      expect(detail, path).toMatch(/of work; the limit is 0.001 ms per request, so not even one sample fits: ask for a smaller n/);
    }
  });
});
