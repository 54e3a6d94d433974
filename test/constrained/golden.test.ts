import { describe, expect, it } from 'vitest';
import { familyKey, type PartitionFamily } from '../../src/core/family.js';
import { partsOf } from '../../src/core/partition.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';

/**
 * Golden vectors: what seed "golden" gives for samples 0..2 of a few families under
 * ALGORITHM_VERSION 2. Recorded from this implementation (not an outside source): they pin
 * reproducibility, so a change here means the algorithm version must be bumped.
 */
const cases: Array<{ family: PartitionFamily; method: string; parts: number[][] }> = [
  { family: { kind: 'partition', n: 30, distinct: true }, method: 'table-lengths/1', parts: [[14, 9, 7], [16, 7, 5, 2], [12, 9, 5, 4]] },
  {
    family: { kind: 'partition', n: 40, allowed: [1, 2, 5, 10], maxLength: 8 },
    method: 'table-sizes-lengths/1',
    parts: [[10, 10, 5, 5, 5, 2, 2, 1], [10, 10, 10, 5, 2, 1, 1, 1], [5, 5, 5, 5, 5, 5, 5, 5]],
  },
  {
    family: { kind: 'partition', n: 50, length: 5, minPart: 3 },
    method: 'table-lengths/1',
    parts: [[23, 12, 6, 5, 4], [22, 15, 5, 4, 4], [13, 13, 9, 8, 7]],
  },
];

/** Larger families: number of parts and the five largest. */
const large: Array<{ family: PartitionFamily; method: string; heads: Array<[number, number[]]> }> = [
  {
    family: { kind: 'partition', n: 2000, distinct: true, maxPart: 300 },
    method: 'distinct-boltzmann/1',
    heads: [[36, [278, 177, 129, 116, 97]], [32, [267, 193, 153, 111, 97]], [32, [235, 151, 136, 126, 123]]],
  },
  {
    family: { kind: 'partition', n: 5000, maxPart: 12 },
    method: 'table-sizes/1',
    heads: [[1027, [12, 12, 12, 12, 12]], [1790, [12, 12, 11, 11, 11]], [1032, [12, 12, 12, 12, 12]]],
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
