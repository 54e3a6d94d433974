import { combinations } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { COUNT_WORK_LIMIT, countPartitions } from '../../src/core/counting/partition-counts.js';
import { LimitExceededError } from '../../src/core/errors.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { allPartitions, satisfies } from '../support/enumerate-constrained.js';
import { sampleSource } from '../../src/core/seeding.js';
import { nextBelow } from '../../src/core/random.js';

const count = (f: Omit<PartitionFamily, 'kind'>) => countPartitions({ kind: 'partition', ...f } as PartitionFamily);

describe('counts against OEIS', () => {
  it('distinct parts: A000009', () => {
    // OEIS A000009, a(0..30) (from memory; also checked by brute force below).
    const q = [1, 1, 1, 2, 2, 3, 4, 5, 6, 8, 10, 12, 15, 18, 22, 27, 32, 38, 46, 54, 64, 76, 89, 104, 122, 142, 165, 192, 222, 256, 296];
    expect(q.map((_, n) => count({ n, distinct: true }))).toEqual(q.map(BigInt));
    // q(100) = 444793: OEIS A000009 (value quoted in the project's issue 4).
    expect(count({ n: 100, distinct: true })).toBe(444793n);
    // q(1000) = 8635565795744155161506: OEIS A000009 (from memory).
    expect(count({ n: 1000, distinct: true })).toBe(8635565795744155161506n);
  });

  it('exactly k parts: A008284 row n = 10', () => {
    // OEIS A008284, row 10: 1, 5, 8, 9, 7, 5, 3, 2, 1, 1 (from memory; sums to p(10) = 42, A000041).
    const row = [1, 5, 8, 9, 7, 5, 3, 2, 1, 1];
    expect(row.map((_, i) => count({ n: 10, length: i + 1 }))).toEqual(row.map(BigInt));
  });

  it('at most k parts: A026820 row n = 10 (cumulative A008284)', () => {
    // OEIS A026820 row 10 = partial sums of A008284 row 10.
    const row = [1, 6, 14, 23, 30, 35, 38, 40, 41, 42];
    expect(row.map((_, i) => count({ n: 10, maxLength: i + 1 }))).toEqual(row.map(BigInt));
  });

  it('at most 2 and 3 parts: closed forms', () => {
    // floor(n/2) + 1 (OEIS A008619) and round((n + 3)^2 / 12) (OEIS A001399), from memory.
    for (const n of [0, 1, 7, 50, 333, 1000]) {
      expect(count({ n, maxLength: 2 })).toBe(BigInt(Math.floor(n / 2) + 1));
      expect(count({ n, maxLength: 3 })).toBe(BigInt(Math.round((n + 3) ** 2 / 12)));
    }
  });

  it('parts in {1, 2, 5, 10}: A000008', () => {
    // OEIS A000008, a(0..30) (from memory).
    const a = [1, 1, 2, 2, 3, 4, 5, 6, 7, 8, 11, 12, 15, 16, 19, 22, 25, 28, 31, 34, 40, 43, 49, 52, 58, 64, 70, 76, 82, 88, 98];
    expect(a.map((_, n) => count({ n, allowed: [1, 2, 5, 10] }))).toEqual(a.map(BigInt));
  });

  it('ways to change a dollar: 292 with coins 1, 5, 10, 25, 50 and 293 with the dollar coin', () => {
    // Pólya 1956, "On picture-writing", Amer. Math. Monthly 63 (from memory); OEIS A001299(100) = 292.
    expect(count({ n: 100, allowed: [1, 5, 10, 25, 50] })).toBe(292n);
    expect(count({ n: 100, allowed: [1, 5, 10, 25, 50, 100] })).toBe(293n);
  });

  it('unrestricted families use p(n): p(100) = 190569292 (OEIS A000041)', () => {
    expect(count({ n: 100 })).toBe(190569292n);
    expect(count({ n: 100, minPart: 1, maxPart: 100, maxLength: 100 })).toBe(190569292n);
  });

  it("Euler's identity: distinct parts and odd parts are equinumerous (Andrews 1976, Cor. 1.2)", () => {
    for (const n of [1, 2, 9, 25, 60, 150, 400]) {
      const odd: number[] = [];
      for (let k = 1; k <= n; k += 2) odd.push(k);
      expect(count({ n, allowed: odd })).toBe(count({ n, distinct: true }));
    }
  });

  it('Gaussian binomials: partitions in a k x w box sum to C(k + w, k) (Andrews 1976, Thm 3.1; mathjs)', () => {
    for (const [k, w] of [[4, 5], [3, 9], [6, 6]]) {
      let total = 0n;
      for (let n = 0; n <= k * w; n++) total += count({ n, maxLength: k, maxPart: w });
      expect(total).toBe(BigInt(combinations(k + w, k)));
      // Exactly k parts in [1, w + 1] is the same box after removing one column.
      let exact = 0n;
      for (let n = k; n <= k * (w + 1); n++) exact += count({ n, length: k, maxPart: w + 1 });
      expect(exact).toBe(BigInt(combinations(k + w, k)));
    }
  });
});

describe('counts against brute-force enumeration', () => {
  it('random combined families, n <= 24', () => {
    const source = sampleSource('count-brute', 0, 'test');
    const lists = new Map<number, number[][]>();
    for (let trial = 0; trial < 400; trial++) {
      const n = nextBelow(source, 25);
      const f: { -readonly [K in keyof PartitionFamily]: PartitionFamily[K] } = { kind: 'partition', n };
      if (nextBelow(source, 2)) f.distinct = true;
      if (nextBelow(source, 3) === 0) f.minPart = 1 + nextBelow(source, 5);
      if (nextBelow(source, 3) === 0) f.maxPart = (f.minPart ?? 1) + nextBelow(source, 10);
      const lengthKind = nextBelow(source, 4);
      if (lengthKind === 0) f.length = nextBelow(source, n + 1);
      if (lengthKind === 1) f.maxLength = nextBelow(source, n + 2);
      if (nextBelow(source, 3) === 0) {
        const allowed = new Set<number>();
        const size = 1 + nextBelow(source, 6);
        for (let i = 0; i < size; i++) allowed.add(1 + nextBelow(source, 15));
        f.allowed = [...allowed];
      }
      if (!lists.has(n)) lists.set(n, allPartitions(n));
      const expected = lists.get(n)!.filter((parts) => satisfies(parts, f)).length;
      expect(countPartitions(f), JSON.stringify(f)).toBe(BigInt(expected));
    }
  });

  it('contradictory bounds and empty families count 0', () => {
    expect(count({ n: 10, minPart: 5, maxPart: 3 })).toBe(0n);
    expect(count({ n: 10, length: 11 })).toBe(0n);
    expect(count({ n: 7, allowed: [2, 4] })).toBe(0n);
    expect(count({ n: 11, allowed: [3, 5] })).toBe(1n); // 11 = 5 + 3 + 3 only
  });

  it('malformed families throw RangeError', () => {
    expect(() => count({ n: -1 })).toThrow(RangeError);
    expect(() => count({ n: 1.5 })).toThrow(RangeError);
    expect(() => count({ n: 2e9 })).toThrow(RangeError);
    expect(() => count({ n: 10, length: 2, maxLength: 3 })).toThrow(RangeError);
    expect(() => count({ n: 10, allowed: [] })).toThrow(RangeError);
    expect(() => count({ n: 10, allowed: [0, 1] })).toThrow(RangeError);
    expect(() => count({ n: 10, minPart: 0 })).toThrow(RangeError);
  });

  it(`refuses work over COUNT_WORK_LIMIT (${COUNT_WORK_LIMIT}) with LimitExceededError`, () => {
    // 167 odd primes below 1000 at n = 2e5: the series needs 167 * 2e5 = 3.3e7 additions.
    const odd: number[] = [];
    for (let k = 3; k < 1000; k += 2) if (![...Array(k).keys()].slice(2).some((d) => k % d === 0)) odd.push(k);
    expect(odd.length).toBe(167);
    expect(() => count({ n: 200_000, allowed: odd })).toThrow(LimitExceededError);
  });
});
