import { describe, expect, it } from 'vitest';
import { binomial } from '../../src/core/counting/binomial.js';
import { binnedChiSquare } from '../../src/core/pictures/statistics.js';
import { stirlingColumn } from '../../src/core/set-partitions/counts.js';
import { planSetPartitionSampler } from '../../src/core/set-partitions/plan.js';
import { blockSizesOf } from '../../src/core/set-partitions/set-partition.js';
import { stamLaw } from '../../src/core/set-partitions/stam-law.js';
import { sampleSource } from '../../src/core/seeding.js';
import { blockCounts, lambertW, ratio } from '../set-partitions/support.js';

/**
 * Heavy checks of set partitions at large n (npm run verify). Each test fails a correct sampler
 * with probability about 1e-4 (fixed seeds; z-tests at 3.89 standard errors, chi-square
 * p-values against 1e-4 with cells pooled to expect >= 5).
 */
const Z = 3.89;

describe('the number of blocks of a uniform set partition at large n', () => {
  for (const [n, samples] of [[1e5, 200], [1e6, 60]] as const) {
    it(`n = ${n}: sample mean against B_(n+1)/B_n − 1 (Dobinski), and that mean against n/W(n) − 1 and n/log n`, () => {
      const { law } = stamLaw(n);
      const mean = law.mean - 1; // E[K] = B_(n+1)/B_n − 1
      const sd = Math.sqrt(law.variance - 1); // Var K = Var M − 1
      const counts = blockCounts(planSetPartitionSampler({ kind: 'set-partition', n }), samples, 'verify-mean', `n-${n}`);
      const observed = counts.reduce((s, c, k) => s + c * k, 0) / samples;
      expect(Math.abs(observed - mean)).toBeLessThan((Z * sd) / Math.sqrt(samples));
      // B_(n+1)/B_n ~ n/W(n) (de Bruijn, Asymptotic Methods in Analysis 1958, §6.2 — from memory):
      // within 0.1 here; and so mean ~ n/log n, the ratio falling slowly towards 1 (1.24, 1.21).
      expect(Math.abs(mean - (n / lambertW(n) - 1))).toBeLessThan(0.1);
      const ratioToLog = mean / (n / Math.log(n));
      expect(ratioToLog).toBeGreaterThan(1);
      expect(ratioToLog).toBeLessThan(1.25);
    });
  }

  it('n = 1000: the whole law of the number of blocks, S(n, k)/B_n, Stam\'s algorithm (20,000 samples)', () => {
    const n = 1000;
    const column = stirlingColumn(n, n);
    const bell = column.reduce((a, b) => a + b, 0n);
    const law = column.map((s) => ratio(s, bell));
    const counts = blockCounts(planSetPartitionSampler({ kind: 'set-partition', n }), 20_000, 'verify-law', 'n-1000');
    expect(binnedChiSquare(law.map((_, k) => counts[k] ?? 0), law).pValue).toBeGreaterThan(1e-4);
  });
});

describe('exactly k blocks at larger n: the block of item 1 has s items with probability C(n−1, s−1)·S(n−s, k−1)/S(n, k)', () => {
  const n = 2000;
  const k = 100;
  for (const method of ['uniform-maps', 'poisson-urns'] as const) it(`n = ${n}, k = ${k}, ${method}, 20,000 samples`, () => {
    // S(m, k − 1) for every m <= n: one pass of the column recurrence per m would be n² work;
    // instead the column of S(·, j) for j <= k is advanced once and S(m, k − 1) recorded.
    const below: bigint[] = [];
    const col: bigint[] = new Array(k + 1).fill(0n);
    col[0] = 1n;
    below.push(0n);
    for (let m = 1; m <= n; m++) {
      for (let j = Math.min(m, k); j >= 1; j--) col[j] = BigInt(j) * col[j] + col[j - 1];
      col[0] = 0n;
      below.push(col[k - 1]);
    }
    const total = col[k];
    const law = Array.from({ length: n - k + 2 }, (_, s) => (s === 0 ? 0 : ratio(binomial(n - 1, s - 1) * below[n - s], total)));
    const sampler = planSetPartitionSampler({ kind: 'set-partition', n, blocks: k }, { method });
    const observed = law.map(() => 0);
    for (let i = 0; i < 20_000; i++) observed[blockSizesOf(sampler.sample(sampleSource('verify-first', i, method)))[0]]++;
    expect(binnedChiSquare(observed, law).pValue).toBeGreaterThan(1e-4);
  });
});
