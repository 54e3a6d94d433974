import { describe, expect, it } from 'vitest';
import { planCompositionSampler } from '../../src/core/compositions/plan.js';
import type { CompositionSampler } from '../../src/core/sampler.js';
import { createApp } from '../../src/http/app.js';
import { DEFAULT_LIMITS } from '../../src/http/limits.js';
import { runCompositionCheck } from '../../src/http/routes/composition-check.js';
import { elementsNamed, parseXml } from './support/xml.js';

/**
 * GET /v1/compositions/check: the numbers of parts of the API's own samples against the exact
 * law 1 + Binomial(n − 1, 1/2) (Stanley, Enumerative Combinatorics I, §1.2: C(n−1, k−1) of the
 * 2^(n−1) compositions of n have k parts). Fixed seeds; alpha = 1e-4 per test: a correct sampler
 * fails a given seed's check with probability 1e-4.
 */
const ALPHA = 1e-4;
const app = createApp({ drawSeed: () => 'drawn' });

async function json(path: string): Promise<{ status: number; body: Record<string, any> }> {
  const response = await app.request(path);
  return { status: response.status, body: await response.json() };
}

describe('GET /v1/compositions/check', () => {
  it('passes the service sampler: statistic, pValue, test, passed, and the API samples are the ones checked', async () => {
    const { status, body } = await json('/v1/compositions/check?n=40&samples=4000&seed=comp-check');
    expect(status).toBe(200);
    expect(body).toMatchObject({ family: { kind: 'composition', n: 40 }, seed: 'comp-check', samples: 4000, quantity: 'number of parts', law: 'exact', test: 'chi-square', alpha: ALPHA });
    expect(body.pValue).toBeGreaterThan(ALPHA);
    expect(body.passed).toBe(true);
    // The very samples GET /v1/compositions returns for the seed: tally their numbers of parts.
    const api = await (await app.request('/v1/compositions?n=40&count=4000&seed=comp-check')).json();
    expect(body.method).toBe(api.method);
    const observed: number[] = Array(body.parts.observed.length).fill(0);
    for (const parts of api.samples as number[][]) observed[parts.length - body.parts.offset]++;
    expect(body.parts.observed).toEqual(observed);
  });

  it('fails a biased generator fed through the same code (re-draws 30% of samples with an even number of parts)', () => {
    const real = planCompositionSampler({ kind: 'composition', n: 40 });
    const biased: CompositionSampler = {
      ...real,
      method: 'biased-test/1',
      sample(source) {
        const first = real.sample(source);
        return first.length % 2 === 0 && source.nextDouble() < 0.3 ? real.sample(source) : first;
      },
    };
    // P(even number of parts) drops from 1/2 to 0.425: for this seed chi-square = 93.4 on 19 df, p = 8e-12 (the unbiased sampler: 17.4, p = 0.56).
    const check = runCompositionCheck(40, 4000, 'comp-check', DEFAULT_LIMITS, biased);
    expect(check.report.pValue!).toBeLessThan(ALPHA);
    // The unbiased sampler on the same seed, through the same function, passes.
    expect(runCompositionCheck(40, 4000, 'comp-check', DEFAULT_LIMITS).report.pValue!).toBeGreaterThan(ALPHA);
  });

  it('passes at large n, where the binomial law is pooled into cells', async () => {
    const { body } = await json('/v1/compositions/check?n=20000&samples=300&seed=big');
    expect(body.passed).toBe(true);
    expect(body.parts.degreesOfFreedom).toBeGreaterThan(3);
  });

  it('draws the plot as well-formed SVG with one bar per observed number of parts', async () => {
    const response = await app.request('/v1/compositions/check?n=12&samples=800&seed=plot&format=svg');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('image/svg+xml; charset=utf-8');
    expect(response.headers.get('cache-control')).toContain('immutable');
    const svg = await response.text();
    const root = parseXml(svg);
    expect(elementsNamed(root, 'svg')).toHaveLength(2);
    expect(svg).toContain('number of parts');
    expect(svg).not.toMatch(/style/);
  });

  it('n = 1 leaves nothing to test; an unseeded check reports the seed it drew', async () => {
    const { body } = await json('/v1/compositions/check?n=1&samples=10');
    expect(body).toMatchObject({ seed: 'drawn', pValue: null, passed: null });
  });

  it('refuses bad parameters (400), constraints it has no exact law for (400) and oversized work (422)', async () => {
    for (const query of ['n=0', 'n=1000001', 'n=10&samples=20001', 'n=10&maxPart=3', 'n=10&length=3', 'n=10&format=text']) {
      expect((await app.request(`/v1/compositions/check?${query}`)).status, query).toBe(400);
    }
    const small = createApp({ limits: { workBudgetMs: 100 } });
    const refused = await small.request('/v1/compositions/check?n=100000&samples=20000&seed=a');
    expect(refused.status).toBe(422);
    expect((await refused.json()).detail).toMatch(/ask for at most \d+ samples/);
  });

  it('is in the OpenAPI document with its parameters', async () => {
    const spec = await (await app.request('/openapi.json')).json();
    const operation = spec.paths['/v1/compositions/check'].get;
    expect(operation.parameters.map((p: { name: string }) => p.name)).toEqual(['n', 'samples', 'seed', 'format']);
  });
});
