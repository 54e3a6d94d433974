import { describe, expect, it } from 'vitest';
import { LogDistinctPartitionNumbers } from '../../src/core/counting/log-distinct-partition-number.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { DistinctOddProposal } from '../../src/core/partitions/distinct-odd-proposal.js';
import {
  DistinctSelfSimilarEngine,
  DistinctSelfSimilarSampler,
  DistinctSelfSimilarTables,
  distinctLogX,
  logZ3,
  type DistinctSelfSimilarStats,
} from '../../src/core/partitions/distinct-self-similar.js';
import { DistinctPartitionTable } from '../../src/core/partitions/distinct-table.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';
import { assertValidPartition, zPValue } from '../support/partition-checks.js';

const ALPHA = 1e-4; // false-alarm probability per statistical check (project convention)
const logQ = new LogDistinctPartitionNumbers();
const tables = new DistinctSelfSimilarTables(new DistinctPartitionTable(60), logQ);

describe('distinct-self-similar internals', () => {
  it('finds the exact argmax of q(m)·x^{2m} over 0 <= m <= n/2', () => {
    const engine = new DistinctSelfSimilarEngine({ baseThreshold: 0, table: tables.table, logQ });
    const bruteForce = (n: number, logX: number): number => {
      let best = 0;
      for (let m = 1; m <= Math.floor(n / 2); m++) if (logQ.logRatio(m, best) + 2 * (m - best) * logX > 0) best = m;
      return best;
    };
    for (let n = 1; n <= 5000; n += n < 300 ? 1 : 37) {
      const logX = distinctLogX(n);
      expect(engine.maximiser(n, logX), `n = ${n}`).toBe(bruteForce(n, logX));
    }
    for (const n of [10_000, 123_457, 1e6, 99_999_999, 1e9]) {
      const logX = distinctLogX(n);
      const m = engine.maximiser(n, logX);
      const f = (k: number): number => logQ.logRatio(k, m) + 2 * (k - m) * logX;
      expect(f(m - 1)).toBeLessThanOrEqual(0);
      expect(f(m + 1)).toBeLessThanOrEqual(0);
      expect(Math.abs(m / (n / 4) - 1)).toBeLessThan(5 / Math.sqrt(n));
    }
  });

  it('log Z3 by its closed form agrees with the direct sum', () => {
    for (const t of [0.2, 0.1, 0.05, 0.02]) {
      let direct = 0;
      for (let k = 3; k * t < 60; k += 2) direct += Math.log1p(Math.exp(-k * t));
      expect(Math.abs(logZ3(-t) - direct) / direct).toBeLessThan(1e-13);
    }
  });

  it('the odd proposal includes each size with probability x^k/(1 + x^k), through both phases', () => {
    // At log x = −0.05: sizes up to ~21 in the direct phase, the rest by thinning. z-test per size.
    const logX = -0.05;
    const proposal = new DistinctOddProposal();
    const source = sampleSource('odd-proposal', 0, 'test');
    const draws = 40_000;
    const hits = new Map<number, number>();
    let ascending = true;
    for (let i = 0; i < draws; i++) {
      proposal.draw(source, logX, 3, 2, Infinity);
      for (let j = 0; j < proposal.count; j++) hits.set(proposal.sizes[j], (hits.get(proposal.sizes[j]) ?? 0) + 1);
      for (let j = 1; j < proposal.count; j++) if (!(proposal.sizes[j] > proposal.sizes[j - 1])) ascending = false;
    }
    expect(ascending).toBe(true);
    const checked = [3, 5, 11, 21, 23, 25, 31, 41, 61, 81, 101];
    for (const k of checked) {
      const p = 1 / (1 + Math.exp(-k * logX));
      const z = ((hits.get(k) ?? 0) - draws * p) / Math.sqrt(draws * p * (1 - p));
      // Bonferroni over the checked sizes.
      expect(zPValue(z), `size ${k}`).toBeGreaterThan(ALPHA / checked.length);
    }
    for (const k of hits.keys()) expect(k % 2).toBe(1);
  });

  it.each([1000, 20_000])('accepts at the exact rate at n = %i', (n) => {
    // The top-level proposals per sample are geometric with success probability
    // P = q(n)x^n / (Z3(x)·M) (derivation in distinct-self-similar.ts). z-test of the mean.
    const sampler = new DistinctSelfSimilarSampler(n, tables, 60);
    const engine = new DistinctSelfSimilarEngine({ baseThreshold: 60, table: tables.table, logQ });
    const acc = engine.acceptanceRate(n);
    // A ratio of Gaussian widths, 1/√2 in the limit.
    expect(acc).toBeGreaterThan(0.6);
    expect(acc).toBeLessThan(Math.SQRT1_2);
    const source = sampleSource(`distinct-acceptance-${n}`, 0, 'test');
    const stats: DistinctSelfSimilarStats = { topProposals: 0, proposals: 0, visited: 0 };
    const samples = n > 10_000 ? 10_000 : 30_000;
    for (let i = 0; i < samples; i++) sampler.sample(source, stats);
    const sd = Math.sqrt(1 - acc) / acc;
    const z = (stats.topProposals / samples - 1 / acc) / (sd / Math.sqrt(samples));
    expect(zPValue(z)).toBeGreaterThan(ALPHA);
  });

  it('returns valid partitions into distinct parts at large n', () => {
    for (const n of [1001, 65_537, 1e6 + 3, 1e8, 1e9]) {
      const sampler = new DistinctSelfSimilarSampler(n);
      for (let i = 0; i < 2; i++) {
        const p = sampler.sample(sampleSource('distinct-valid', i, String(n)));
        assertValidPartition(p, n);
        expect(p.multiplicities.every((m) => m === 1)).toBe(true);
      }
    }
  });
});

describe('distinct-self-similar is exactly uniform (chi-square over the enumerated family)', () => {
  // Each base threshold puts the table's hand-over at a different level, so every level's
  // rejection step and the merge are exercised: 0 (the recursion down to m = 0), 3, 9, and the
  // table alone (threshold >= n).
  const cases: Array<[number, number]> = [
    [30, 0],
    [30, 3],
    [41, 9],
    [44, 0],
    [36, 60],
  ];
  for (const [n, base] of cases) {
    it(`n = ${n}, base threshold ${base}`, () => {
      const family: PartitionFamily = { kind: 'partition', n, distinct: true };
      const sampler = new DistinctSelfSimilarSampler(n, tables, base);
      const result = chiSquareUniform(family, sampler, `dss-${n}-${base}`);
      expect(result.members).toBeGreaterThan(100);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
  it('through the planner (method forced)', () => {
    const family: PartitionFamily = { kind: 'partition', n: 38, distinct: true };
    const sampler = constrainedPartitionSampler(family, { method: 'distinct-self-similar' });
    expect(sampler.method).toBe('distinct-self-similar/1');
    const result = chiSquareUniform(family, sampler, 'dss-plan');
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(ALPHA);
  });
});
