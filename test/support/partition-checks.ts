import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import type { Partition } from '../../src/core/partition.js';
import { partsOf } from '../../src/core/partition.js';
import type { RandomSource } from '../../src/core/random.js';
import { enumeratePartitions, partsKey } from './enumerate-partitions.js';

/** Throws unless the partition is in valid multiplicity form (sizes strictly descending, positive integers) of size n. */
export function assertValidPartition(partition: Partition, n: number): void {
  const { sizes, multiplicities } = partition;
  if (sizes.length !== multiplicities.length) throw new Error('sizes and multiplicities differ in length');
  let total = 0;
  for (let i = 0; i < sizes.length; i++) {
    const s = sizes[i];
    const m = multiplicities[i];
    if (!Number.isSafeInteger(s) || s < 1) throw new Error(`bad size ${s}`);
    if (!Number.isSafeInteger(m) || m < 1) throw new Error(`bad multiplicity ${m} of size ${s}`);
    if (i > 0 && !(sizes[i - 1] > s)) throw new Error(`sizes not strictly descending at ${i}: ${sizes[i - 1]}, ${s}`);
    total += s * m;
  }
  if (total !== n) throw new Error(`size ${total}, expected ${n}`);
}

/**
 * Chi-square over ALL partitions of n against the uniform law: 100,000 samples per case, fixed
 * seeds; each case fails with probability alpha = 1e-4 when the sampler is exactly uniform
 * (DEVELOPERS.md, "Statistical tests").
 */
export const UNIFORMITY_ALPHA = 1e-4;
export const UNIFORMITY_SAMPLES = 100_000;

/** p(n) for the enumerated sizes: p(10) = 42, p(12) = 77, p(15) = 176, p(20) = 627 (OEIS A000041). */
export const PARTITION_NUMBERS = new Map([
  [10, 42],
  [12, 77],
  [15, 176],
  [20, 627],
]);

/**
 * Pearson chi-square of `samples` draws over all p(n) partitions of n against the uniform law;
 * returns the upper-tail p-value (chi-square with p(n) − 1 degrees of freedom, via
 * @stdlib/stats-base-dists-chisquare-cdf) and the number of cells.
 */
export function uniformityPValue(
  n: number,
  samples: number,
  source: RandomSource,
  sample: (source: RandomSource) => Partition,
): { pValue: number; cells: number } {
  const all = enumeratePartitions(n);
  const counts = new Map<string, number>();
  for (const parts of all) counts.set(partsKey(parts), 0);
  for (let i = 0; i < samples; i++) {
    const partition = sample(source);
    assertValidPartition(partition, n);
    const key = partsKey(partsOf(partition));
    const c = counts.get(key);
    if (c === undefined) throw new Error(`sample ${key} is not a partition of ${n}`);
    counts.set(key, c + 1);
  }
  const expected = samples / all.length;
  let stat = 0;
  for (const c of counts.values()) stat += ((c - expected) * (c - expected)) / expected;
  return { pValue: 1 - chisquareCdf(stat, all.length - 1), cells: all.length };
}

/** Two-sided p-value of a z-score: z² is chi-square with 1 degree of freedom. */
export function zPValue(z: number): number {
  return 1 - chisquareCdf(z * z, 1);
}
