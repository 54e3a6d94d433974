import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import type { Partition } from '../../src/core/partition.js';
import { constrainedPartitionSampler, planCandidates } from '../../src/core/partitions/constrained/plan.js';
import type { NarrowRangeMixture } from '../../src/core/partitions/narrow-range-mixture.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { pooled } from '../support/distinct-part-count-law.js';
import { countsByParts, distinctCountsByParts } from '../support/narrow-range-counts.js';

/**
 * narrow-range-mixture (the union over the number of parts k of boxes, box-rotation at the
 * central k and box-subset elsewhere) where tables still work: the law of the number of parts
 * (and, at n = 1e5, of the largest part) against the exact law from the knapsack counts (test/support/narrow-range-counts.ts). Parts in
 * [601, 637] at n = 1e5, where the planner already takes it over the size table that still fits,
 * and distinct parts in [400, 700] at n = 2e4 through the staircase (forced: the planner offers it
 * for distinct parts only where nothing else fits, e.g. n = 3.5e8, parts in [50318, 69965]).
 * Pearson chi-square, cells pooled to expect >= 20 samples (common practice), fixed seeds,
 * false-alarm probability alpha = 1e-4 per test.
 */
const ALPHA = 1e-4;

/** Chi-square p-value of `statistic` (an index into `counts`) over `samples` samples against the law ∝ counts. */
function lawPValue(family: PartitionFamily, sampler: NarrowRangeMixture, statistic: (p: Partition) => number, counts: number[], samples: number, seed: string): number {
  const total = counts.reduce((x, y) => x + y, 0);
  const law = counts.map((c) => c / total);
  const observed = new Array<number>(law.length).fill(0);
  for (let i = 0; i < samples; i++) observed[statistic(sampler.sample(sampleSource(seed, i, JSON.stringify(family))))]++;
  const bins = pooled(observed, law, samples);
  expect(bins.probabilities.length).toBeGreaterThan(3);
  return chiSquareTest(bins.observed, bins.probabilities).pValue;
}

const parts = (p: Partition) => p.multiplicities.reduce((x, y) => x + y, 0);

/**
 * Partitions of n by largest part t in [a, b] (index t − a): F(t) − F(t − 1), F(t) the partitions
 * into parts in [a, t] (countsByParts summed over k; F(a) = 1 when a divides n).
 */
function countsByLargest(n: number, a: number, b: number): number[] {
  const F = [n % a === 0 ? 1 : 0];
  for (let t = a + 1; t <= b; t++) F.push(countsByParts(n, a, t).reduce((x, y) => x + y, 0));
  return F.map((f, i) => (i === 0 ? f : f - F[i - 1]));
}

describe('narrow-range-mixture: the law of the number of parts from exact counts', () => {
  it('parts in [601, 637] at n = 1e5 (the planner takes it; the size table still fits)', () => {
    const family = { kind: 'partition', n: 100_000, minPart: 601, maxPart: 637 } as PartitionFamily;
    expect(planCandidates(family).some((c) => c.method === 'table-sizes/1' && c.fits)).toBe(true);
    const sampler = constrainedPartitionSampler(family) as NarrowRangeMixture;
    expect(sampler.method).toBe('narrow-range-mixture/1');
    expect(sampler.rotated.some(Boolean) && sampler.rotated.some((r) => !r)).toBe(true);
    expect(lawPValue(family, sampler, parts, countsByParts(100_000, 601, 637), 60_000, 'verify-narrow')).toBeGreaterThan(ALPHA);
    expect(lawPValue(family, sampler, (p) => p.sizes[0] - 601, countsByLargest(100_000, 601, 637), 60_000, 'verify-narrow-largest')).toBeGreaterThan(ALPHA);
  }, 600_000);

  it('distinct parts in [400, 700] at n = 2e4 (forced)', () => {
    const family = { kind: 'partition', n: 20_000, distinct: true, minPart: 400, maxPart: 700 } as PartitionFamily;
    const sampler = constrainedPartitionSampler(family, { method: 'narrow-range-mixture' }) as NarrowRangeMixture;
    expect(sampler.rotated.some(Boolean) && sampler.rotated.some((r) => !r)).toBe(true);
    expect(lawPValue(family, sampler, parts, distinctCountsByParts(20_000, 400, 700), 40_000, 'verify-narrow-distinct')).toBeGreaterThan(ALPHA);
  }, 600_000);
});
