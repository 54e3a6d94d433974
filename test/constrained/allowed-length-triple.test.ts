import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { AllowedLengthBoltzmann } from '../../src/core/partitions/constrained/allowed-length-boltzmann.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

/**
 * allowed-length-boltzmann with each kind of determined triple forced (the planner's choice
 * depends on the tilts): the size-0 site determined or free, the smallest size determined or
 * free, tilts with x > 1 (mean part above the list's middle), sizes with a common divisor.
 * Pearson chi-square over the enumerated family, |family| - 1 degrees of freedom, 200 samples
 * per member (the families are small), fixed seeds; false-alarm probability alpha = 1e-4 per test (project convention).
 */
const ALPHA = 1e-4;
const PER_MEMBER = 200;

type Case = [name: string, values: number[], n: number, parts: number, atMost: boolean, triple: [number, number, number] | undefined];

const cases: Case[] = [
  ['exactly k, triple without the smallest size', [1, 2, 5, 10, 20], 50, 11, false, [2, 10, 20]],
  ['exactly k, triple of the smallest sizes', [1, 2, 5, 10, 20], 50, 11, false, [1, 2, 5]],
  ['exactly k, mean part above the middle (x > 1)', [1, 2, 3, 5, 6, 7, 8], 40, 6, false, [1, 5, 8]],
  ['exactly k, sizes with gcd 3', [3, 6, 9, 15, 21], 48, 6, false, [3, 9, 21]],
  ['at most K, size-0 site determined', [1, 2, 5, 10], 40, 9, true, [0, 2, 10]],
  ['at most K, size-0 site free', [1, 2, 5, 10], 40, 9, true, [1, 5, 10]],
  ['at most K, size-0 site free, x > 1', [2, 3, 5, 6, 7, 8], 44, 7, true, [2, 5, 8]],
  ['at most K, the estimated cheapest triple', [1, 2, 4, 7, 12], 50, 8, true, undefined],
  ['exactly k, three sizes (no free site)', [3, 7, 11], 48, 8, false, undefined],
];

describe('allowed-length-boltzmann with three determined sites is exact', () => {
  for (const [name, values, n, parts, atMost, triple] of cases) {
    it(`${name}: n = ${n}, ${atMost ? 'at most' : 'exactly'} ${parts} parts from ${values.join(',')}`, () => {
      const family: PartitionFamily = { kind: 'partition', n, allowed: values, ...(atMost ? { maxLength: parts } : { length: parts }) };
      const sampler = new AllowedLengthBoltzmann(values, n, parts, atMost, triple);
      if (triple !== undefined) expect(sampler.determined).toEqual(triple);
      const result = chiSquareUniform(family, sampler, `triple-${name.replace(/[^A-Za-z0-9]+/g, '-')}`.slice(0, 64), PER_MEMBER);
      // 4 members for three sizes (3 i + 7 j + 11 l = 48, i + j + l = 8), 9 to 32 for the others.
      expect(result.members).toBeGreaterThanOrEqual(4);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }

  it('two sizes, exactly k parts: the only member', () => {
    const sampler = new AllowedLengthBoltzmann([3, 8], 50, 10, false);
    // 3 i + 8 j = 50, i + j = 10: j = 4, i = 6.
    expect(sampler.sample({ nextUint32: () => 0, nextDouble: () => 0.5 })).toEqual({ sizes: [8, 3], multiplicities: [4, 6] });
  });

  it('refuses a forced triple that is not three increasing sites', () => {
    expect(() => new AllowedLengthBoltzmann([1, 2, 5, 10], 40, 9, false, [0, 2, 10])).toThrow(RangeError);
    expect(() => new AllowedLengthBoltzmann([1, 2, 5, 10], 40, 9, false, [5, 2, 10])).toThrow(RangeError);
  });
});
