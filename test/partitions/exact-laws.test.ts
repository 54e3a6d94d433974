import { describe, expect, it } from 'vitest';
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import { PartitionNumbers } from '../../src/core/counting/partition-numbers.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import { DivideAndConquerSampler } from '../../src/core/partitions/divide-and-conquer.js';
import { SelfSimilarSampler } from '../../src/core/partitions/self-similar.js';
import { RestrictedPartitionTable } from '../../src/core/partitions/table-recursive.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';
import { assertValidPartition, zPValue } from '../support/partition-checks.js';

// Exact laws of a uniform partition of n, computed in BigInt here, against sample statistics.
// Identities (Andrews 1976, ch. 1; remove j parts of size 1 / conjugate the Ferrers diagram):
//   P(X_1 >= j) = p(n − j)/p(n), so E[X_1] = Σ_{j>=1} p(n − j)/p(n) and
//   E[X_1²] = Σ_{j>=1} (2j − 1)·p(n − j)/p(n);
//   P(largest part <= m) = p(n, parts <= m)/p(n) (OEIS A026820 / A008284 row sums).
// Each check is a two-sided z-test with the EXACT variance; it fails with probability
// alpha = 1e-4 for an exact sampler (project convention), p-value from chi-square(1) of z².
const ALPHA = 1e-4;

const exact = new PartitionNumbers();

/** p(n, parts <= m) for all m, exact, by p(r, ≤k) = p(r, ≤k−1) + p(r − k, ≤k). */
function restrictedCounts(n: number): bigint[] {
  // row[r] holds p(r, ≤k) for the current k; after step k it is updated in place.
  const row: bigint[] = new Array(n + 1).fill(0n);
  row[0] = 1n;
  const atN: bigint[] = [0n];
  for (let k = 1; k <= n; k++) {
    for (let r = k; r <= n; r++) row[r] += row[r - k];
    atN.push(row[n]);
  }
  return atN; // atN[m] = p(n, parts <= m)
}

/** Exact ratio of BigInts as a double (scaled so both fit). */
function ratio(a: bigint, b: bigint): number {
  const scale = 10n ** 30n;
  return Number((a * scale) / b) / 1e30;
}

function exactOnesMoments(n: number): { mean: number; variance: number } {
  const pn = exact.get(n);
  let first = 0n;
  let second = 0n;
  for (let j = 1; j <= n; j++) {
    const pj = exact.get(n - j);
    first += pj;
    second += BigInt(2 * j - 1) * pj;
  }
  const mean = ratio(first, pn);
  return { mean, variance: ratio(second, pn) - mean * mean };
}

const table = new RestrictedPartitionTable();
const logP = new LogPartitionNumbers();

const cases: Array<[string, number, number, () => PartitionSampler | { sample: PartitionSampler['sample'] }]> = [
  ['planner (table method)', 100, 200_000, () => unrestrictedPartitionSampler(100)],
  ['planner (table method, its largest n)', 1000, 100_000, () => unrestrictedPartitionSampler(1000)],
  ['planner (self-similar, table base at 1000)', 3000, 30_000, () => unrestrictedPartitionSampler(3000)],
  ['self-similar, no table base', 100, 100_000, () => new SelfSimilarSampler(100, { baseThreshold: 0, table, logP })],
  ['self-similar, base 20', 1000, 100_000, () => new SelfSimilarSampler(1000, { baseThreshold: 20, table, logP })],
  ['divide-and-conquer', 1000, 30_000, () => new DivideAndConquerSampler(1000)],
];

describe.each(cases)('exact laws: %s at n = %i', (name, n, samples, make) => {
  it('mean number of 1s and P(largest part <= m) match the exact values', () => {
    const sampler = make();
    const source = sampleSource(`laws-${n}-${name.replace(/[^a-z0-9]/g, '')}`, 0, 'test');
    const { mean, variance } = exactOnesMoments(n);
    const largestCdf = restrictedCounts(n);
    const pn = exact.get(n);
    // m near the median of the largest part, and one in each tail region.
    const probes = [0.2, 0.5, 0.8].map((q) => {
      let m = 1;
      while (ratio(largestCdf[m], pn) < q) m++;
      return { m, prob: ratio(largestCdf[m], pn), hits: 0 };
    });
    let ones = 0;
    for (let i = 0; i < samples; i++) {
      const partition = sampler.sample(source);
      assertValidPartition(partition, n);
      const last = partition.sizes.length - 1;
      if (last >= 0 && partition.sizes[last] === 1) ones += partition.multiplicities[last];
      const largest = partition.sizes[0];
      for (const probe of probes) if (largest <= probe.m) probe.hits++;
    }
    const zOnes = (ones / samples - mean) / Math.sqrt(variance / samples);
    expect(zPValue(zOnes)).toBeGreaterThan(ALPHA);
    for (const probe of probes) {
      const z = (probe.hits / samples - probe.prob) / Math.sqrt((probe.prob * (1 - probe.prob)) / samples);
      expect(zPValue(z)).toBeGreaterThan(ALPHA);
    }
  });
});

describe('exact-law reference values', () => {
  it('match OEIS-checked quantities', () => {
    // p(10, parts <= 3) = 14 (OEIS A001399: partitions of n into at most 3 parts, n = 10).
    expect(restrictedCounts(10)[3]).toBe(14n);
    // p(10, parts <= 10) = p(10) = 42 (OEIS A000041).
    expect(restrictedCounts(10)[10]).toBe(42n);
    // E[X_1] at n = 3: partitions 3, 2+1, 1+1+1 have 0, 1, 3 ones: mean 4/3 (by hand).
    expect(exactOnesMoments(3).mean).toBeCloseTo(4 / 3, 12);
  });
});
