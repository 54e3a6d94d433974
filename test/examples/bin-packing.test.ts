import { fc, test } from '@fast-check/vitest';
import { describe, expect, test as plainTest } from 'vitest';
import { partitionFamily } from 'partsmith';
import { partitionArb } from 'partsmith/fast-check';
import { firstFitDecreasing, firstFitDecreasingWrong, type Bins } from './bin-packing.js';

/**
 * Property tests of a first-fit-decreasing packer with partsmith's arbitraries. A day's parcels
 * are a partition of its total weight n, with no parcel heavier than a van (maxPart): exactly
 * the days that can happen, each equally likely at its n, with n from 0 to 200.
 */
const CAPACITY = 10;
const days = partitionArb({ n: { min: 0, max: 200 }, maxPart: CAPACITY });

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

/** Every parcel packed exactly once, no van over capacity. */
function validPacking(items: readonly number[], bins: Bins): boolean {
  const packed = bins.flat().sort((a, b) => b - a);
  return JSON.stringify(packed) === JSON.stringify([...items].sort((a, b) => b - a)) && bins.every((bin) => sum(bin) <= CAPACITY);
}

/**
 * First fit: no parcel could have gone into an earlier van. A van's load only grows, so for vans
 * i < j every parcel in van j is heavier than van i's final free space.
 */
function firstFit(bins: Bins): boolean {
  return bins.every((later, j) => bins.slice(0, j).every((earlier) => Math.min(...later) > CAPACITY - sum(earlier)));
}

describe('first-fit decreasing on uniformly random days', () => {
  test.prop([days], { seed: 2024, numRuns: 300 })('packs every parcel, never overloads a van, and is first fit', (items) => {
    const bins = firstFitDecreasing(items, CAPACITY);
    expect(validPacking(items, bins)).toBe(true);
    expect(firstFit(bins)).toBe(true);
    // Lower bound: no packing uses fewer than ceil(n / capacity) vans.
    expect(bins.length).toBeGreaterThanOrEqual(Math.ceil(sum(items) / CAPACITY));
  });

  test.prop([days], { seed: 2024, numRuns: 300 })('the wrong variant passes the obvious property too', (items) => {
    expect(validPacking(items, firstFitDecreasingWrong(items, CAPACITY))).toBe(true);
  });

  plainTest('the wrong variant fails first fit, and the shrunk counterexample is two parcels of 5 (n = 10)', () => {
    for (const seed of [2024, 1, 7]) {
      const result = fc.check(fc.property(days, (items) => firstFit(firstFitDecreasingWrong(items, CAPACITY))), { seed, numRuns: 300 });
      expect(result.failed).toBe(true);
      // The simplest failing day: the least total weight that fills a van exactly (10 kg), in
      // the fewest parcels (2), with the fewest distinct weights (1): [5, 5] goes into two vans.
      expect(result.counterexample![0]).toEqual([5, 5]);
      // The report names the partsmith sample the failure was shrunk from, and the member's rank:
      // 5+5 comes 13th among the partitions of 10 in reverse lexicographic order (10, 9+1, 8+2,
      // 8+1+1, 7+3, 7+2+1, 7+1+1+1, 6+4, 6+3+1, 6+2+2, 6+2+1+1, 6+1+1+1+1, 5+5; OEIS A080577), rank 12.
      expect(fc.stringify(result.counterexample![0])).toMatch(/^\[5,5\] \/\* partition of 10 \(rank 12 of \{"kind":"partition","n":10,"maxPart":10\}\); shrunk from sample \d+ of seed "fast-check" of \{"kind":"partition","n":\d+,"maxPart":10\} \*\/$/);
    }
  });
});

/**
 * The vitest fixture pattern: a fixed seed in the test file, the samples drawn once for the
 * whole file (scope: 'file'), the same days on every run and on every machine — and the same as
 * GET /v1/partitions?n=120&maxPart=10&seed=bins-fixture&count=200.
 */
const FIXTURE_SEED = 'bins-fixture';
const fixtureTest = plainTest.extend<{ workload: number[][] }>({
  workload: [
    // eslint-disable-next-line no-empty-pattern
    async ({}, use) => {
      await use([...partitionFamily({ n: 120, maxPart: CAPACITY }).samples(FIXTURE_SEED, 0, 200)]);
    },
    { scope: 'file' },
  ],
});

describe('first-fit decreasing on a fixed workload', () => {
  fixtureTest('leaves at most one van half full or less, so uses fewer than 2n / capacity + 1 vans', ({ workload }) => {
    expect(workload).toHaveLength(200);
    for (const items of workload) {
      const bins = firstFitDecreasing(items, CAPACITY);
      expect(validPacking(items, bins)).toBe(true);
      // The standard first-fit argument: a later van's first parcel would have fitted into an
      // earlier van that was at most half full. With k - 1 vans over half full, n > (k - 1) c / 2.
      expect(bins.filter((bin) => 2 * sum(bin) <= CAPACITY).length).toBeLessThanOrEqual(1);
      expect(bins.length).toBeLessThan((2 * sum(items)) / CAPACITY + 1 + 1e-9);
    }
  });

  fixtureTest('the fixture is loaded once and replays', ({ workload }) => {
    expect(workload.slice(0, 3)).toEqual([...partitionFamily({ n: 120, maxPart: CAPACITY }).samples(FIXTURE_SEED, 0, 3)]);
  });
});
