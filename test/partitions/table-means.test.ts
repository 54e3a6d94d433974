import { describe, expect, it } from 'vitest';
import { RestrictedPartitionTable, rowStart, TableRecursiveSampler } from '../../src/core/partitions/table-recursive.js';

const table = new RestrictedPartitionTable();

/** Every partition of n (parts non-increasing, each at most `max`), by direct recursion. */
function* partitions(n: number, max = n): Generator<number[]> {
  if (n === 0) {
    yield [];
    return;
  }
  for (let first = Math.min(n, max); first >= 1; first--) for (const rest of partitions(n - first, first)) yield [first, ...rest];
}

describe('table-recursive expected length and distinct sizes', () => {
  it('equal the means over all partitions of n (full enumeration, n <= 40)', () => {
    for (let n = 0; n <= 40; n++) {
      let count = 0;
      let parts = 0;
      let distinct = 0;
      for (const p of partitions(n)) {
        count++;
        parts += p.length;
        distinct += new Set(p).size;
      }
      const sampler = new TableRecursiveSampler(n, table);
      expect(sampler.expectedLength).toBeCloseTo(n === 0 ? 0 : parts / count, 10);
      expect(sampler.expectedDistinct).toBeCloseTo(n === 0 ? 0 : distinct / count, 10);
    }
  });

  it('equal the sums Σ_k Σ_j p(n − jk)/p(n) and Σ_k p(n − k)/p(n) (Andrews 1976, ch. 1) up to n = 1000', () => {
    table.ensure(1000);
    const t = table.triangle();
    const p = (m: number) => t[rowStart(m) + m];
    for (const n of [1, 2, 7, 100, 577, 999, 1000]) {
      let length = 0;
      let distinct = 0;
      for (let k = 1; k <= n; k++) {
        distinct += p(n - k);
        for (let rest = n - k; rest >= 0; rest -= k) length += p(rest);
      }
      const sampler = new TableRecursiveSampler(n, table);
      expect(Math.abs(sampler.expectedLength / (length / p(n)) - 1)).toBeLessThan(1e-12);
      expect(Math.abs(sampler.expectedDistinct / (distinct / p(n)) - 1)).toBeLessThan(1e-12);
    }
  });
});
