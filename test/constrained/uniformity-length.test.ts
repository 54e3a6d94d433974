import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler, planCandidates } from '../../src/core/partitions/constrained/plan.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

/**
 * The length branch's methods (normally used at large n) forced through the planner's `method`
 * option at small n, one case per constraint shape each method serves, against the enumerated
 * family: Pearson chi-square with |family| - 1 degrees of freedom, 25 samples per member, fixed
 * seeds; false-alarm probability alpha = 1e-4 per test (project convention).
 */
const ALPHA = 1e-4;

type Case = [name: string, family: Omit<PartitionFamily, 'kind'>, method: string];

function check([name, spec, method]: Case): void {
  it(`${name}: ${JSON.stringify(spec)}`, () => {
    const family = { kind: 'partition', ...spec } as PartitionFamily;
    const sampler = constrainedPartitionSampler(family, { method });
    expect(sampler.method.replace(/\/\d+/g, '')).toBe(method);
    const result = chiSquareUniform(family, sampler, `len-${name.replace(/[^A-Za-z0-9]+/g, '-')}`.slice(0, 64));
    expect(result.members).toBeGreaterThan(5);
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(ALPHA);
  });
}

describe('box-subset (stars-and-bars subset design, last element determined) is exact', () => {
  const cases: Case[] = [
    ['exactly k parts <= m (complemented box)', { n: 24, length: 5, maxPart: 8 }, 'box-subset'],
    ['exactly k parts in [lo, hi], box half full (x = 1)', { n: 30, length: 4, minPart: 3, maxPart: 12 }, 'box-subset'],
    ['exactly k distinct parts <= m (staircase)', { n: 40, distinct: true, length: 5, maxPart: 16 }, 'box-subset'],
    ['exactly k distinct parts >= lo, no bound (open box)', { n: 45, distinct: true, length: 4, minPart: 3 }, 'box-subset'],
    ['exactly k parts, no bound (open box)', { n: 30, length: 5 }, 'box-subset'],
    ['at most K parts <= m (complemented)', { n: 30, maxLength: 6, maxPart: 9 }, 'box-subset'],
    ['at most K parts <= m with m < K (conjugated box)', { n: 26, maxLength: 9, maxPart: 5 }, 'box-subset'],
  ];
  for (const c of cases) check(c);
});

describe('box-mixture (restart the number of parts after each failed proposal) is exact', () => {
  const cases: Case[] = [
    ['at most K distinct parts', { n: 30, distinct: true, maxLength: 4 }, 'box-mixture'],
    ['at most K distinct parts <= m', { n: 36, distinct: true, maxLength: 5, maxPart: 14 }, 'box-mixture'],
    ['at most K parts >= lo', { n: 34, minPart: 3, maxLength: 5 }, 'box-mixture'],
    ['at most K parts in [lo, hi]', { n: 38, minPart: 2, maxPart: 11, maxLength: 6 }, 'box-mixture'],
    ['at most K distinct parts in [lo, hi]', { n: 40, distinct: true, minPart: 2, maxPart: 15, maxLength: 4 }, 'box-mixture'],
    ['distinct parts >= lo, no length constraint (at most n / lo parts fit)', { n: 40, distinct: true, minPart: 4 }, 'box-mixture'],
    ['parts >= lo, no length constraint', { n: 40, minPart: 6 }, 'box-mixture'],
  ];
  for (const c of cases) check(c);
});

describe('allowed-length-boltzmann (two tilts, two sizes determined) is exact', () => {
  const cases: Case[] = [
    ['exactly k parts from a list', { n: 45, allowed: [1, 2, 3, 5, 10], length: 12 }, 'allowed-length-boltzmann'],
    ['at most K parts from a list (size-0 site)', { n: 40, allowed: [1, 2, 5, 10], maxLength: 9 }, 'allowed-length-boltzmann'],
    ['exactly k parts, sizes with gcd 2', { n: 44, allowed: [2, 4, 6, 10, 14], length: 8 }, 'allowed-length-boltzmann'],
    ['at most K parts, sizes with gcd 3', { n: 42, allowed: [3, 6, 9, 12, 15], maxLength: 7 }, 'allowed-length-boltzmann'],
    ['exactly k parts, list cut by minPart', { n: 40, allowed: [1, 3, 4, 6, 9, 11], minPart: 3, length: 6 }, 'allowed-length-boltzmann'],
  ];
  for (const c of cases) check(c);
});

describe('allowed-subset (subset design over an allowed list, last element determined) is exact', () => {
  const cases: Case[] = [
    ['exactly k distinct parts from a list', { n: 38, distinct: true, allowed: [1, 2, 4, 5, 7, 9, 10, 12, 13, 15, 16, 18, 20], length: 4 }, 'allowed-subset'],
    ['sum above the middle (reflected sizes)', { n: 38, distinct: true, allowed: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14], length: 4 }, 'allowed-subset'],
    ['reflected, list with a gap', { n: 36, distinct: true, allowed: [2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 15, 16], length: 4 }, 'allowed-subset'],
    ['odd sizes (span 2)', { n: 36, distinct: true, allowed: [1, 3, 5, 7, 9, 11, 13, 15, 17, 19, 21, 23], length: 4 }, 'allowed-subset'],
  ];
  for (const c of cases) check(c);
});

describe('samplers of the family without one constraint, with rejection, are exact', () => {
  const cases: Case[] = [
    ['exactly k parts, box with no binding side (unrestricted + shift)', { n: 40, length: 28 }, 'table-recursive+box-filter'],
    ['at most K parts, part bound rarely binding', { n: 30, maxLength: 4, maxPart: 29 }, 'bounded-boltzmann+conjugate+box-filter'],
    ['parts <= m, length bound rarely binding', { n: 30, maxPart: 4, maxLength: 29 }, 'bounded-boltzmann+box-filter'],
  ];
  for (const c of cases) check(c);

  it('at most K distinct parts, K rarely binding: the no-length method plus a length filter', () => {
    const family: PartitionFamily = { kind: 'partition', n: 30, distinct: true, maxLength: 6 };
    const filter = planCandidates(family, true).find((c) => c.method.endsWith('+length-filter'));
    expect(filter).toBeDefined();
    const sampler = constrainedPartitionSampler(family, { method: filter!.method.replace(/\/\d+/g, '') });
    const result = chiSquareUniform(family, sampler, 'length-filter-distinct');
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(ALPHA);
  });
});
