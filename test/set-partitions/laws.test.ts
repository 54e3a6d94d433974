import { describe, expect, it } from 'vitest';
import { binnedChiSquare } from '../../src/core/pictures/statistics.js';
import { blockTable, stirlingColumn } from '../../src/core/set-partitions/counts.js';
import { planSetPartitionSampler, type SetPartitionMethod } from '../../src/core/set-partitions/plan.js';
import { stamLaw } from '../../src/core/set-partitions/stam-law.js';
import { blockSizesOf } from '../../src/core/set-partitions/set-partition.js';
import { sampleSource } from '../../src/core/seeding.js';
import { binomial } from '../../src/core/counting/binomial.js';
import { blockCounts, lambertW, ratio } from './support.js';

/**
 * Beyond enumeration: the number of blocks of samples against its exact law from the counts
 * (P(k blocks) = T(n, k) / total), and at large n its mean against the exact mean
 * B_(n+1)/B_n − 1 and the asymptotics. Pearson chi-square with cells pooled to expect >= 5
 * (common practice), or z-tests; fixed seeds; each test fails a correct sampler with probability
 * about 1e-4. Heavier versions: test/verify/set-partitions.verify.ts.
 */
const ALPHA = 1e-4;
const Z = 3.89; // two-sided normal quantile for alpha = 1e-4

function blockLawTest(method: SetPartitionMethod | undefined, family: { n: number; blocks?: number; maxBlocks?: number; minBlockSize?: number; maxBlockSize?: number }, law: number[], samples: number) {
  const sampler = planSetPartitionSampler({ kind: 'set-partition', ...family }, method ? { method } : {});
  const counts = blockCounts(sampler, samples, `law-${method}`, JSON.stringify(family));
  const observed = law.map((_, k) => counts[k] ?? 0);
  expect(counts.length).toBeLessThanOrEqual(law.length);
  return binnedChiSquare(observed, law).pValue;
}

describe('the number of blocks follows its exact law (n = 300)', () => {
  const n = 300;
  it('every set partition: P(k) = S(n, k)/B_n, Stam\'s algorithm', () => {
    const column = stirlingColumn(n, n);
    const bell = column.reduce((a, b) => a + b, 0n);
    expect(blockLawTest('stam', { n }, column.map((s) => ratio(s, bell)), 4000)).toBeGreaterThan(ALPHA);
  });
  for (const method of ['poisson-urns', 'poisson-sizes', 'table'] as const) {
    it(`no singletons: P(k) = T(n, k)/sum (associated Stirling numbers), ${method}`, () => {
      const table = blockTable(n, n, 2, n);
      const total = table[n].reduce((a, b) => a + b, 0n);
      expect(blockLawTest(method, { n, minBlockSize: 2 }, table[n].map((t) => ratio(t, total)), 3000)).toBeGreaterThan(ALPHA);
    });
    it(`blocks of at most 4 items, at most 80 blocks (binding: the free model has ~90): ${method}`, () => {
      const table = blockTable(n, 80, 1, 4);
      const total = table[n].reduce((a, b) => a + b, 0n);
      expect(blockLawTest(method, { n, maxBlockSize: 4, maxBlocks: 80 }, table[n].map((t) => ratio(t, total)), 3000)).toBeGreaterThan(ALPHA);
    });
  }
});

describe('exactly k blocks: the size of the block holding item 1 follows C(n−1, s−1)·S(n−s, k−1)/S(n, k)', () => {
  const n = 200;
  const k = 10;
  const column = (m: number) => stirlingColumn(m, k - 1)[k - 1];
  const total = stirlingColumn(n, k)[k];
  const law = Array.from({ length: n - k + 2 }, (_, s) => (s === 0 ? 0 : ratio(binomial(n - 1, s - 1) * column(n - s), total)));
  for (const method of ['uniform-maps', 'poisson-urns', 'table'] as const) {
    it(method, () => {
      const sampler = planSetPartitionSampler({ kind: 'set-partition', n, blocks: k }, { method });
      const observed = law.map(() => 0);
      for (let i = 0; i < 3000; i++) observed[blockSizesOf(sampler.sample(sampleSource('first-block', i, method)))[0]]++;
      expect(binnedChiSquare(observed, law).pValue).toBeGreaterThan(ALPHA);
    });
  }
});

describe('the mean number of blocks at large n', () => {
  it('n = 10^4: the sample mean of Stam\'s algorithm against B_(n+1)/B_n − 1 (Dobinski) within 3.89 standard errors', () => {
    const n = 10_000;
    const { law } = stamLaw(n);
    const mean = law.mean - 1; // E[K] = E[M] − 1 = B_(n+1)/B_n − 1
    const sd = Math.sqrt(law.variance - 1); // Var K = Var M − 1 (from E[M^2] = B_(n+2)/B_n)
    const samples = 300;
    const counts = blockCounts(planSetPartitionSampler({ kind: 'set-partition', n }), samples, 'mean', 'n1e4');
    const observed = counts.reduce((s, c, k) => s + c * k, 0) / samples;
    expect(Math.abs(observed - mean)).toBeLessThan((Z * sd) / Math.sqrt(samples));
    // The exact mean against the asymptotics: ~ n/W(n) − 1 (de Bruijn 1958, from memory), hence ~ n/log n.
    expect(Math.abs(mean - (n / lambertW(n) - 1))).toBeLessThan(0.1);
    expect(mean / (n / Math.log(n))).toBeGreaterThan(1);
    expect(mean / (n / Math.log(n))).toBeLessThan(1.3);
  });
});
