import { describe, expect, it } from 'vitest';
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import { DivideAndConquerSampler } from '../../src/core/partitions/divide-and-conquer.js';
import { PlainRejectionSampler } from '../../src/core/partitions/plain-rejection.js';
import { SelfSimilarSampler } from '../../src/core/partitions/self-similar.js';
import { RestrictedPartitionTable, TableRecursiveSampler } from '../../src/core/partitions/table-recursive.js';
import { TABLE_METHOD_UP_TO, unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { LimitExceededError } from '../../src/core/errors.js';
import { sampleSource } from '../../src/core/seeding.js';
import { assertValidPartition } from '../support/partition-checks.js';

describe('every sample is a partition of n in valid multiplicity form', () => {
  const sizes = [
    0, 1, 2, 3, 4, 5, 7, 26, 27, 63, 64, 128, TABLE_METHOD_UP_TO - 1, TABLE_METHOD_UP_TO, TABLE_METHOD_UP_TO + 1,
    2 * TABLE_METHOD_UP_TO + 1, 4 * TABLE_METHOD_UP_TO + 3, 999, 1000, 4001, 12345, 100_000, 1_000_000, 1_000_001,
  ];
  it.each(sizes)('planner, n = %i', (n) => {
    const sampler = unrestrictedPartitionSampler(n);
    const source = sampleSource('valid', n, 'test');
    for (let i = 0; i < (n > 100_000 ? 20 : 200); i++) assertValidPartition(sampler.sample(source), n);
  });

  it('planner at n = 1e9 and 1e9 − 1 (a few samples)', () => {
    for (const n of [1_000_000_000, 999_999_999]) {
      const sampler = unrestrictedPartitionSampler(n);
      const source = sampleSource('valid-big', 0, 'test');
      for (let i = 0; i < 3; i++) assertValidPartition(sampler.sample(source), n);
    }
  });

  it('self-similar with every small base threshold, and the baselines', () => {
    const table = new RestrictedPartitionTable();
    const logP = new LogPartitionNumbers();
    const source = sampleSource('valid-methods', 0, 'test');
    for (let base = 0; base <= 6; base++) {
      for (let n = 0; n <= 60; n++) {
        const s = new SelfSimilarSampler(n, { baseThreshold: base, table, logP });
        for (let i = 0; i < 5; i++) assertValidPartition(s.sample(source), n);
      }
    }
    for (const n of [0, 1, 2, 3, 10, 100, 5000]) {
      assertValidPartition(new DivideAndConquerSampler(n).sample(source), n);
      assertValidPartition(new PlainRejectionSampler(n).sample(source), n);
      if (n <= RestrictedPartitionTable.MAX_N) assertValidPartition(new TableRecursiveSampler(n, table).sample(source), n);
    }
  });

  it('n = 0 gives the empty partition', () => {
    expect(unrestrictedPartitionSampler(0).sample(sampleSource('zero', 0, 'test'))).toEqual({ sizes: [], multiplicities: [] });
  });
});

describe('planner', () => {
  it('picks the table method for small n and the self-similar method above', () => {
    expect(unrestrictedPartitionSampler(10).method).toBe('table-recursive/1');
    expect(unrestrictedPartitionSampler(TABLE_METHOD_UP_TO).method).toBe('table-recursive/1');
    expect(unrestrictedPartitionSampler(TABLE_METHOD_UP_TO + 1).method).toBe('self-similar/1');
    expect(unrestrictedPartitionSampler(1_000_000_000).method).toBe('self-similar/1');
  });

  it('rejects n outside 0..1e9 with a RangeError', () => {
    for (const n of [-1, 1.5, Number.NaN, Infinity, 1_000_000_001]) {
      expect(() => unrestrictedPartitionSampler(n)).toThrow(RangeError);
    }
  });

  it('baselines refuse sizes over their limits', () => {
    expect(() => new PlainRejectionSampler(PlainRejectionSampler.MAX_N + 1)).toThrow(LimitExceededError);
    expect(() => new DivideAndConquerSampler(-3)).toThrow(RangeError);
  });

  it('states expected lengths and distinct sizes that match samples', () => {
    // Exact for the table method (sums of p(n − jk)/p(n)); asymptotic above. Loose 10% bound: these
    // are planning figures, not distribution tests (common practice for estimates).
    for (const n of [50, 400, 5000, 200_000]) {
      const sampler = unrestrictedPartitionSampler(n);
      const source = sampleSource('estimates', n, 'test');
      let length = 0;
      let distinct = 0;
      const reps = 400;
      for (let i = 0; i < reps; i++) {
        const p = sampler.sample(source);
        distinct += p.sizes.length;
        for (const m of p.multiplicities) length += m;
      }
      expect(Math.abs(length / reps / sampler.expectedLength - 1)).toBeLessThan(0.1);
      expect(Math.abs(distinct / reps / sampler.expectedDistinct - 1)).toBeLessThan(0.1);
      expect(sampler.expectedWork).toBeGreaterThan(0);
    }
    // p(4) = 5 partitions: 4, 31, 22, 211, 1111 -> 12 parts and 1+2+1+2+1 = 7 distinct sizes in total.
    const four = unrestrictedPartitionSampler(4);
    expect(four.expectedLength).toBeCloseTo(12 / 5, 12);
    expect(four.expectedDistinct).toBeCloseTo(7 / 5, 12);
  });
});
