import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import { DistinctBoltzmann } from '../../src/core/partitions/constrained/distinct-boltzmann.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

/**
 * The Boltzmann methods (normally used at large n) forced at small n, so that their rejection
 * steps are tested for exactness against the enumerated family. Pearson chi-square, fixed seeds,
 * false-alarm probability alpha = 1e-4 per test (project convention).
 */
const ALPHA = 1e-4;

function check(family: PartitionFamily, sampler: PartitionSampler, seed: string, expectedMethod: string): void {
  expect(sampler.method).toBe(expectedMethod);
  const result = chiSquareUniform(family, sampler, seed);
  expect(result.members).toBeGreaterThan(5);
  expect(result.strangers).toBe(0);
  expect(result.pValue).toBeGreaterThan(ALPHA);
}

describe('distinct-boltzmann is exact', () => {
  const family: PartitionFamily = { kind: 'partition', n: 30, distinct: true };
  it('with the smallest size alone in the counted block', () => {
    // Block cell limit 5 admits only size 1 (cells 1 + 2).
    check(family, new DistinctBoltzmann({ kind: 'interval', lo: 1, hi: 30 }, 30, 5), 'db-one', 'distinct-boltzmann/1');
  });
  it('with sizes 1..4 in the counted block', () => {
    check(family, new DistinctBoltzmann({ kind: 'interval', lo: 1, hi: 30 }, 30, 30), 'db-four', 'distinct-boltzmann/1');
  });
  it('with minPart and maxPart', () => {
    const f: PartitionFamily = { kind: 'partition', n: 34, distinct: true, minPart: 2, maxPart: 13 };
    check(f, new DistinctBoltzmann({ kind: 'interval', lo: 2, hi: 13 }, 34, 12), 'db-bounds', 'distinct-boltzmann/1');
  });
  it('above half the sum of the allowed sizes (tilt x > 1)', () => {
    // Sizes 1..9 sum to 45; n = 36 needs x > 1.
    const f: PartitionFamily = { kind: 'partition', n: 36, distinct: true, maxPart: 9 };
    check(f, new DistinctBoltzmann({ kind: 'interval', lo: 1, hi: 9 }, 36, 10), 'db-heavy', 'distinct-boltzmann/1');
  });
  it('over an allowed list', () => {
    const values = [2, 3, 5, 6, 7, 9, 10, 12, 13];
    const f: PartitionFamily = { kind: 'partition', n: 30, distinct: true, allowed: values };
    check(f, new DistinctBoltzmann({ kind: 'list', values }, 30, 8), 'db-list', 'distinct-boltzmann/1');
  });
  it('through the planner', () => {
    const f: PartitionFamily = { kind: 'partition', n: 26, distinct: true, minPart: 2 };
    check(f, constrainedPartitionSampler(f, { method: 'distinct-boltzmann' }), 'db-plan', 'distinct-boltzmann/1');
  });
});

describe('bounded-boltzmann and allowed-boltzmann are exact', () => {
  const cases: Array<[string, PartitionFamily, string]> = [
    ['parts <= 5', { kind: 'partition', n: 25, maxPart: 5 }, 'bounded-boltzmann/1'],
    ['parts >= 3 (sizes 3 and 4 determined by the residual)', { kind: 'partition', n: 33, minPart: 3 }, 'bounded-boltzmann/1'],
    ['parts in [2, 7]', { kind: 'partition', n: 28, minPart: 2, maxPart: 7 }, 'bounded-boltzmann/1'],
    ['parts in {3, 5, 7, 8}', { kind: 'partition', n: 40, allowed: [3, 5, 7, 8] }, 'allowed-boltzmann/1'],
    ['parts in {1, 2, 5, 10}', { kind: 'partition', n: 35, allowed: [1, 2, 5, 10] }, 'allowed-boltzmann/1'],
    ['parts in {4, 6, 9, 15} (gcd of the two smallest is 2)', { kind: 'partition', n: 40, allowed: [4, 6, 9, 15] }, 'allowed-boltzmann/1'],
    ['parts in {2, 3} (both sizes determined)', { kind: 'partition', n: 33, allowed: [2, 3] }, 'allowed-boltzmann/1'],
    ['at most 4 parts (conjugate of parts <= 4)', { kind: 'partition', n: 22, maxLength: 4 }, 'bounded-boltzmann/1+conjugate'],
    ['exactly 4 parts >= 2 (conjugate)', { kind: 'partition', n: 30, length: 4, minPart: 2 }, 'bounded-boltzmann/1+conjugate'],
    ['exactly 4 distinct parts (staircase, conjugate)', { kind: 'partition', n: 30, distinct: true, length: 4 }, 'bounded-boltzmann/1+conjugate'],
  ];
  for (const [name, family, method] of cases) {
    it(name, () => {
      const forced = method.startsWith('allowed') ? 'allowed-boltzmann' : 'bounded-boltzmann';
      check(family, constrainedPartitionSampler(family, { method: forced }), `mb-${name.replace(/[^a-z0-9]/gi, '-')}`, method);
    });
  }
});
