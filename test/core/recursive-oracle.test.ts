import { describe, expect, it } from 'vitest';
import { PartitionNumbers } from '../../src/core/counting/partition-numbers.js';
import { partsOf, sizeOf } from '../../src/core/partition.js';
import { RecursiveOracle } from '../../src/core/partitions/recursive-oracle.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { enumeratePartitions, partsKey } from '../support/enumerate-partitions.js';

/** All partitions of n as keys "5,4,1" (parts largest first). */
function allPartitionKeys(n: number): string[] {
  return enumeratePartitions(n).map(partsKey);
}

describe('exact partition numbers p(n)', () => {
  const numbers = new PartitionNumbers();
  it.each([
    // OEIS A000041 (partition numbers), values as listed there.
    [0, 1n], [1, 1n], [2, 2n], [3, 3n], [4, 5n], [5, 7n], [10, 42n], [12, 77n], [15, 176n], [50, 204226n],
    [100, 190569292n],
    [1000, 24061467864032622473692149727991n],
  ])('p(%i) = %s (OEIS A000041)', (n, expected) => {
    expect(numbers.get(n)).toBe(expected);
  });
  // p(10000) ≈ 3.6167·10^106: leading digits from memory of the OEIS A000041 b-file.
  it('p(10000) has 107 digits and starts 36167251325636293988', () => {
    const value = numbers.get(10_000).toString();
    expect(value.length).toBe(107);
    expect(value.startsWith('36167251325636293988')).toBe(true);
  });
  it('matches the enumeration count for n <= 20', () => {
    for (let n = 0; n <= 20; n++) expect(numbers.get(n)).toBe(BigInt(allPartitionKeys(n).length));
  });
  it('rejects negative, fractional and too-large n with a RangeError', () => {
    expect(() => numbers.get(-1)).toThrow(RangeError);
    expect(() => numbers.get(1.5)).toThrow(RangeError);
    expect(() => numbers.get(PartitionNumbers.MAX_N + 1)).toThrow(RangeError);
  });
});

describe('recursive oracle (Nijenhuis–Wilf, exact integers)', () => {
  // Chi-square over every partition of n; alpha = 1e-4 per test, so with a random seed a
  // correct sampler fails one of these three with probability about 3e-4. The seeds are fixed,
  // so the outcome is reproducible.
  it.each([10, 12, 15])('is uniform over all partitions of %i (chi-square, 100,000 samples)', (n) => {
    const keys = allPartitionKeys(n);
    const index = new Map(keys.map((k, i) => [k, i]));
    const observed = new Array<number>(keys.length).fill(0);
    const oracle = new RecursiveOracle(n);
    const source = sampleSource(`oracle-chi-${n}`, 0, 'test');
    for (let i = 0; i < 100_000; i++) {
      const key = partsOf(oracle.sample(source)).join(',');
      const cell = index.get(key);
      expect(cell).toBeDefined();
      observed[cell!]++;
    }
    const { pValue } = chiSquareTest(observed, keys.map(() => 1 / keys.length));
    expect(pValue).toBeGreaterThan(1e-4);
  });
  it('takes the BigInt path beyond 2^53 and still returns partitions of n', () => {
    const oracle = new RecursiveOracle(600);
    const source = sampleSource('oracle-big', 0, 'test');
    for (let i = 0; i < 5; i++) expect(sizeOf(oracle.sample(source))).toBe(600);
  });
  it('returns the empty partition for n = 0 and rejects bad n', () => {
    expect(new RecursiveOracle(0).sample(sampleSource('z', 0, 'test'))).toEqual({ sizes: [], multiplicities: [] });
    expect(() => new RecursiveOracle(-3)).toThrow(RangeError);
    expect(() => new RecursiveOracle(RecursiveOracle.MAX_N + 1)).toThrow(RangeError);
  });
});
