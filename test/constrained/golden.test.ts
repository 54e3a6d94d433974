import { describe, expect, it } from 'vitest';
import { familyKey, type PartitionFamily } from '../../src/core/family.js';
import { partsOf } from '../../src/core/partition.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';

/**
 * Golden vectors: what seed "golden" gives for samples 0..2 of a few families under
 * ALGORITHM_VERSION 3. Recorded from this implementation (not an outside source): they pin
 * reproducibility, so a change here means the algorithm version must be bumped.
 */
const cases: Array<{ family: PartitionFamily; method: string; parts: number[][] }> = [
  { family: { kind: 'partition', n: 30, distinct: true }, method: 'table-lengths/1', parts: [[13, 7, 6, 3, 1], [17, 11, 2], [12, 11, 7]] },
  {
    family: { kind: 'partition', n: 40, allowed: [1, 2, 5, 10], maxLength: 8 },
    method: 'table-sizes-lengths/1',
    parts: [[5, 5, 5, 5, 5, 5, 5, 5], [10, 10, 10, 5, 2, 2, 1], [10, 5, 5, 5, 5, 5, 5]],
  },
  {
    family: { kind: 'partition', n: 50, length: 5, minPart: 3 },
    method: 'table-lengths/1',
    parts: [[14, 13, 9, 9, 5], [22, 13, 6, 5, 4], [24, 11, 5, 5, 5]],
  },
];

/** Larger families: number of parts and the five largest. */
const large: Array<{ family: PartitionFamily; method: string; heads: Array<[number, number[]]> }> = [
  {
    family: { kind: 'partition', n: 2000, distinct: true, maxPart: 300 },
    method: 'distinct-boltzmann/1',
    heads: [[32, [186, 179, 167, 142, 134]], [31, [190, 158, 144, 119, 116]], [30, [202, 196, 131, 127, 122]]],
  },
  {
    family: { kind: 'partition', n: 5000, maxPart: 12 },
    method: 'table-sizes/1',
    heads: [[1296, [12, 12, 12, 12, 12]], [969, [12, 12, 12, 12, 12]], [1746, [12, 12, 12, 12, 12]]],
  },
  // The length branch's methods (ALGORITHM_VERSION 3).
  {
    family: { kind: 'partition', n: 1_000_000_000, length: 1000, maxPart: 2_000_000 },
    method: 'box-subset/1',
    heads: [[1000, [1995662, 1995307, 1994960, 1994068, 1993600]], [1000, [1999421, 1999323, 1999147, 1997732, 1996851]], [1000, [1999353, 1997608, 1996193, 1993181, 1990222]]],
  },
  {
    family: { kind: 'partition', n: 100_000, distinct: true, maxLength: 100 },
    method: 'box-mixture/1',
    heads: [[100, [6214, 3686, 3608, 3572, 3028]], [100, [5545, 4715, 3586, 3320, 2757]], [100, [5520, 3628, 3626, 3104, 2976]]],
  },
  {
    family: { kind: 'partition', n: 10_000, allowed: [3, 7, 11], length: 1000 },
    method: 'allowed-length-boltzmann/1',
    heads: [[1000, [11, 11, 11, 11, 11]], [1000, [11, 11, 11, 11, 11]], [1000, [11, 11, 11, 11, 11]]],
  },
  {
    family: { kind: 'partition', n: 1_000_000, minPart: 10, maxLength: 500 },
    method: 'box-mixture/1',
    heads: [[500, [14949, 10897, 10668, 8871, 8394]], [500, [13591, 10642, 10566, 10370, 10226]], [500, [10094, 9547, 9111, 8718, 8388]]],
  },
];

describe('golden vectors (seed "golden", samples 0..2)', () => {
  for (const { family, method, parts } of cases) {
    it(familyKey(family), () => {
      const sampler = constrainedPartitionSampler(family);
      expect(sampler.method).toBe(method);
      expect([0, 1, 2].map((i) => partsOf(sampler.sample(sampleSource('golden', i, familyKey(family)))))).toEqual(parts);
    });
  }
  for (const { family, method, heads } of large) {
    it(familyKey(family), () => {
      const sampler = constrainedPartitionSampler(family);
      expect(sampler.method).toBe(method);
      const got = [0, 1, 2].map((i) => {
        const p = partsOf(sampler.sample(sampleSource('golden', i, familyKey(family))));
        return [p.length, p.slice(0, 5)];
      });
      expect(got).toEqual(heads);
    });
  }
});
