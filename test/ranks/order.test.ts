import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { countCompositions } from '../../src/core/counting/composition-counts.js';
import { countPartitions } from '../../src/core/counting/partition-counts.js';
import type { CompositionFamily, PartitionFamily } from '../../src/core/family.js';
import { compositionRanker } from '../../src/core/ranks/composition-ranker.js';
import { partitionRanker } from '../../src/core/ranks/partition-ranker.js';
import { enumerateCompositions } from '../support/enumerate-compositions.js';
import { allPartitions, satisfies } from '../support/enumerate-constrained.js';
import { listAll } from './support.js';

/**
 * Listing, rank and unrank against brute force. The brute-force enumerations (test/support) are
 * written from the definitions, independently of the counting tables: partitions by the classical
 * walk over the largest part, tried from the largest down — which visits them in reverse
 * lexicographic order — filtered by the constraints; compositions by trying each next part from
 * the smallest up — lexicographic order. So "listing = enumeration" checks the members, their
 * number and the documented order at once; every member's rank is then its index, both ways.
 */
const PARTITIONS: Omit<PartitionFamily, 'kind'>[] = [
  { n: 0 }, { n: 1 }, { n: 7 }, { n: 20 }, { n: 25 },
  { n: 25, distinct: true },
  { n: 24, minPart: 3 },
  { n: 22, maxPart: 4 },
  { n: 20, length: 5 }, { n: 25, length: 1 }, { n: 12, length: 12 },
  { n: 18, maxLength: 3 }, { n: 10, maxLength: 0 },
  { n: 25, allowed: [1, 2, 5, 10] }, { n: 15, allowed: [2, 4] },
  { n: 25, distinct: true, minPart: 2, maxPart: 12 },
  { n: 24, distinct: true, length: 4 },
  { n: 25, distinct: true, maxLength: 3 },
  { n: 24, allowed: [1, 3, 4, 7], length: 5 },
  { n: 25, allowed: [2, 3, 5, 7, 11], maxLength: 5, distinct: true },
  { n: 23, minPart: 2, maxPart: 9, maxLength: 6 },
  { n: 20, maxPart: 6, length: 5 },
  { n: 25, minPart: 3, length: 4 },
  { n: 25, distinct: true, minPart: 2, maxPart: 12, maxLength: 4 },
  { n: 21, allowed: [1, 2, 4, 8, 16], minPart: 2, maxPart: 8 },
  { n: 6, length: 7 }, // length > n: no member
  { n: 10, minPart: 5, maxPart: 3 }, // contradictory bounds: no member
];

const COMPOSITIONS: Omit<CompositionFamily, 'kind'>[] = [
  { n: 0 }, { n: 1 }, { n: 12 }, { n: 14 },
  { n: 14, length: 4 }, { n: 8, length: 4, minPart: 0 }, { n: 0, length: 0 }, { n: 0, length: 3, minPart: 0 },
  { n: 18, minPart: 3 }, { n: 14, maxPart: 3 }, { n: 15, allowed: [1, 3, 4] }, { n: 18, allowed: [3, 6] },
  { n: 8, length: 3, allowed: [0, 2, 3] },
  { n: 16, length: 5, maxPart: 4 },
  { n: 20, length: 4, minPart: 2, maxPart: 7 },
  { n: 19, length: 4, allowed: [2, 5, 7] },
  { n: 17, minPart: 2, maxPart: 5 },
  { n: 16, allowed: [1, 2, 5, 7], maxPart: 5 },
  { n: 12, length: 4, minPart: 0, maxPart: 5 },
  { n: 11, allowed: [2, 4] }, // odd n with even parts: no member
];

function partitionsByBruteForce(family: PartitionFamily): number[][] {
  // Contradictory bounds (minPart > maxPart, length > n) describe no partition.
  if (family.minPart !== undefined && family.maxPart !== undefined && family.minPart > family.maxPart) return [];
  return allPartitions(family.n).filter((parts) => satisfies(parts, family));
}

describe('partition listing = brute force in reverse lexicographic order', () => {
  it.each(PARTITIONS.map((f) => [JSON.stringify(f), f] as const))('%s', (_name, f) => {
    const family: PartitionFamily = { kind: 'partition', ...f };
    const expected = partitionsByBruteForce(family);
    const ranker = partitionRanker(family);
    expect(listAll(ranker)).toEqual(expected);
    expect(ranker.count).toBe(BigInt(expected.length));
    expect(ranker.count).toBe(countPartitions(family));
    expected.forEach((member, i) => {
      expect(ranker.rank(member)).toBe(BigInt(i));
      expect(ranker.unrank(BigInt(i))).toEqual(member);
    });
  });

  it('covers every constraint alone and in combination', () => {
    const keys = (f: object) => Object.keys(f).filter((k) => k !== 'n');
    for (const c of ['distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed']) {
      expect(PARTITIONS.some((f) => keys(f).length === 1 && keys(f)[0] === c), c).toBe(true);
      expect(PARTITIONS.some((f) => keys(f).length >= 2 && keys(f).includes(c)), c).toBe(true);
    }
    expect(PARTITIONS.length + COMPOSITIONS.length).toBeGreaterThanOrEqual(30);
  });
});

describe('composition listing = brute force in lexicographic order', () => {
  it.each(COMPOSITIONS.map((f) => [JSON.stringify(f), f] as const))('%s', (_name, f) => {
    const family: CompositionFamily = { kind: 'composition', ...f };
    const expected = enumerateCompositions(family);
    const ranker = compositionRanker(family);
    expect(listAll(ranker)).toEqual(expected);
    expect(ranker.count).toBe(BigInt(expected.length));
    expect(ranker.count).toBe(countCompositions(family));
    expected.forEach((member, i) => {
      expect(ranker.rank(member)).toBe(BigInt(i));
      expect(ranker.unrank(BigInt(i))).toEqual(member);
    });
  });

  it('covers every constraint alone and in combination', () => {
    const keys = (f: object) => Object.keys(f).filter((k) => k !== 'n');
    for (const c of ['length', 'minPart', 'maxPart', 'allowed']) {
      expect(COMPOSITIONS.some((f) => keys(f).length === 1 && keys(f)[0] === c), c).toBe(true);
      expect(COMPOSITIONS.some((f) => keys(f).length >= 2 && keys(f).includes(c)), c).toBe(true);
    }
  });
});

describe('outside checks of the order', () => {
  it('unrestricted partitions of n <= 7 list as OEIS A080577', () => {
    // OEIS A080577 ("triangle of partitions of n in graded reverse lexicographic order"), its
    // data for n = 1..7 flattened (transcribed from memory of the sequence; its rows are the
    // order of the trade: n, n-1+1, n-2+2, n-2+1+1, ...).
    const a080577 = [
      1,
      2, 1, 1,
      3, 2, 1, 1, 1, 1,
      4, 3, 1, 2, 2, 2, 1, 1, 1, 1, 1, 1,
      5, 4, 1, 3, 2, 3, 1, 1, 2, 2, 1, 2, 1, 1, 1, 1, 1, 1, 1, 1,
      6, 5, 1, 4, 2, 4, 1, 1, 3, 3, 3, 2, 1, 3, 1, 1, 1, 2, 2, 2, 2, 2, 1, 1, 2, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1,
      7, 6, 1, 5, 2, 5, 1, 1, 4, 3, 4, 2, 1, 4, 1, 1, 1, 3, 3, 1, 3, 2, 2, 3, 2, 1, 1, 3, 1, 1, 1, 1, 2, 2, 2, 1, 2, 2, 1, 1, 1, 2, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1,
    ];
    const flat: number[] = [];
    for (let n = 1; n <= 7; n++) for (const member of listAll(partitionRanker({ kind: 'partition', n }))) flat.push(...member);
    expect(flat).toEqual(a080577);
  });

  it('compositions with parts in {1, 2}: counts are Fibonacci numbers and ranks their Zeckendorf sums (OEIS A000045)', () => {
    // OEIS A000045, F(0..31) (from memory).
    const F = [0, 1, 1, 2, 3, 5, 8, 13, 21, 34, 55, 89, 144, 233, 377, 610, 987, 1597, 2584, 4181, 6765, 10946, 17711, 28657, 46368, 75025, 121393, 196418, 317811, 514229, 832040, 1346269];
    for (let n = 0; n <= 30; n++) expect(compositionRanker({ kind: 'composition', n, allowed: [1, 2] }).count, `n = ${n}`).toBe(BigInt(F[n + 1]));
    // Lexicographic order puts 1 before 2, so a 2 at a point with m units left skips the F(m)
    // compositions of m - 1 that continue with a 1: the rank of a member is the sum of F(m) over
    // its 2s, and Zeckendorf's theorem (every number is one sum of non-consecutive Fibonacci
    // numbers F(k), k >= 2) makes that a bijection onto 0 ... F(n+1) - 1.
    for (const n of [1, 2, 5, 12, 20]) {
      const ranker = compositionRanker({ kind: 'composition', n, allowed: [1, 2] });
      for (let r = 0; r < F[n + 1]; r += n < 20 ? 1 : 37) {
        const twosAt = new Set<number>();
        let rest = r;
        for (let k = n; k >= 2 && rest > 0; k--) {
          if (F[k] <= rest) {
            twosAt.add(k);
            rest -= F[k];
            k--; // Zeckendorf: the next index is at least two lower
          }
        }
        const expected: number[] = [];
        for (let m = n; m > 0; ) {
          const part = twosAt.has(m) ? 2 : 1;
          expected.push(part);
          m -= part;
        }
        expect(ranker.unrank(BigInt(r)), `n = ${n}, rank ${r}`).toEqual(expected);
      }
    }
  });
});

describe('seeded random families against brute force', () => {
  // 300 families of each kind with constraints drawn at random (seedrandom, fixed seed): every
  // listing must equal the brute-force enumeration, and every member's rank its index.
  const rng = seedrandom('rank-families');
  const below = (k: number) => Math.floor(rng() * k);
  const maybe = (p: number) => rng() < p;
  const sizes = () => [...new Set(Array.from({ length: 1 + below(5) }, () => 1 + below(9)))];

  it('partitions', () => {
    for (let t = 0; t < 300; t++) {
      const f: PartitionFamily = { kind: 'partition', n: below(19) };
      if (maybe(0.3)) Object.assign(f, { distinct: true });
      if (maybe(0.3)) Object.assign(f, { minPart: 1 + below(4) });
      if (maybe(0.3)) Object.assign(f, { maxPart: 1 + below(8) });
      if (maybe(0.25)) Object.assign(f, { length: below(7) });
      else if (maybe(0.25)) Object.assign(f, { maxLength: below(7) });
      if (maybe(0.3)) Object.assign(f, { allowed: sizes() });
      const expected = partitionsByBruteForce(f);
      const ranker = partitionRanker(f);
      expect(listAll(ranker), JSON.stringify(f)).toEqual(expected);
      expected.forEach((member, i) => expect(ranker.rank(member)).toBe(BigInt(i)));
    }
  });

  it('compositions', () => {
    for (let t = 0; t < 300; t++) {
      const f: CompositionFamily = { kind: 'composition', n: below(13) };
      if (maybe(0.4)) Object.assign(f, { length: below(6) });
      if (maybe(0.3)) Object.assign(f, { minPart: (f.length !== undefined ? 0 : 1) + below(3) });
      if (maybe(0.3)) Object.assign(f, { maxPart: Math.max(1, (f.minPart ?? 0) + below(6)) });
      if (maybe(0.3)) Object.assign(f, { allowed: sizes().concat(f.length !== undefined && maybe(0.3) ? [0] : []) });
      const expected = enumerateCompositions(f);
      const ranker = compositionRanker(f);
      expect(listAll(ranker), JSON.stringify(f)).toEqual(expected);
      expected.forEach((member, i) => expect(ranker.rank(member)).toBe(BigInt(i)));
    }
  });
});
