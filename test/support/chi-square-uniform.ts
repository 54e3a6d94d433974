import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import type { PartitionFamily } from '../../src/core/family.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import { sampleSource } from '../../src/core/seeding.js';
import { enumerateFamily, partitionKey } from './enumerate-constrained.js';

export interface UniformityResult {
  readonly members: number;
  readonly samples: number;
  /** Samples that are not members of the family (must be 0). */
  readonly strangers: number;
  readonly statistic: number;
  readonly pValue: number;
}

/**
 * Pearson's chi-square test of uniformity over the brute-force enumerated family: draws
 * `perMember` x |family| samples (>= 20 per cell, common practice for the chi-square
 * approximation) and returns the upper-tail p-value with |family| - 1 degrees of freedom.
 */
export function chiSquareUniform(
  family: PartitionFamily,
  sampler: PartitionSampler,
  seed: string,
  perMember = 25,
): UniformityResult {
  const members = enumerateFamily(family);
  const counts = new Map<string, number>(members.map((m) => [m, 0]));
  const samples = perMember * members.length;
  let strangers = 0;
  for (let i = 0; i < samples; i++) {
    const key = partitionKey(sampler.sample(sampleSource(seed, i, 'chi-square')));
    const seen = counts.get(key);
    if (seen === undefined) strangers++;
    else counts.set(key, seen + 1);
  }
  let statistic = 0;
  for (const observed of counts.values()) statistic += (observed - perMember) ** 2 / perMember;
  const pValue = members.length > 1 ? 1 - chisquareCdf(statistic, members.length - 1) : 1;
  return { members: members.length, samples, strangers, statistic, pValue };
}
