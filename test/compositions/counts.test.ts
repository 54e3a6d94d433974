import { combinations, composition } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { binomial } from '../../src/core/counting/binomial.js';
import { boundedByInclusionExclusion, countCompositions } from '../../src/core/counting/composition-counts.js';
import { LimitExceededError } from '../../src/core/errors.js';
import type { CompositionFamily } from '../../src/core/family.js';
import { enumerateCompositions } from '../support/enumerate-compositions.js';

const fam = (f: Omit<CompositionFamily, 'kind'>): CompositionFamily => ({ kind: 'composition', ...f });

describe('composition counts', () => {
  it('unrestricted: 2^(n-1), and 1 for n = 0', () => {
    // 2^(n-1) compositions of n >= 1 (Stanley, Enumerative Combinatorics vol. 1, §1.2; OEIS A011782).
    expect(countCompositions(fam({ n: 0 }))).toBe(1n);
    for (const n of [1, 2, 3, 10, 64, 1000]) expect(countCompositions(fam({ n }))).toBe(2n ** BigInt(n - 1));
  });

  it('exactly k parts: C(n-1, k-1), against mathjs composition and combinations', () => {
    for (const [n, k] of [[1, 1], [5, 2], [14, 4], [30, 7], [50, 50], [60, 13]]) {
      const ours = countCompositions(fam({ n, length: k }));
      // mathjs.composition(n, k): number of compositions of n into k parts (mathjs docs).
      expect(ours).toBe(BigInt(composition(n, k) as number));
      // mathjs.combinations(n-1, k-1): the stars-and-bars identity.
      expect(ours).toBe(BigInt(combinations(n - 1, k - 1) as number));
    }
    expect(countCompositions(fam({ n: 3, length: 5 }))).toBe(0n);
  });

  it('weak compositions: C(n+k-1, k-1), against mathjs combinations', () => {
    for (const [n, k] of [[0, 3], [8, 3], [20, 5], [40, 10]]) {
      // mathjs.combinations: C(n+k-1, k-1) weak compositions (stars and bars, Feller vol. 1 §II.5).
      expect(countCompositions(fam({ n, length: k, minPart: 0 }))).toBe(BigInt(combinations(n + k - 1, k - 1) as number));
    }
  });

  it('exact big binomials agree with the step-by-step product C(m, j+1) = C(m, j)(m-j)/(j+1)', () => {
    const count = countCompositions(fam({ n: 1000, length: 40 }));
    expect(count).toBe(binomial(999, 39));
    let product = 1n;
    for (let i = 0n; i < 39n; i++) product = (product * (999n - i)) / (i + 1n); // exact at each step
    expect(count).toBe(product);
  });

  it('parts in {1, 2}: Fibonacci F(n+1) (OEIS A000045)', () => {
    // A000045: 0, 1, 1, 2, 3, 5, 8, 13, 21, 34, 55, 89, 144, 233, 377, 610, 987, 1597, 2584, 4181, 6765.
    const fib = [0, 1, 1, 2, 3, 5, 8, 13, 21, 34, 55, 89, 144, 233, 377, 610, 987, 1597, 2584, 4181, 6765];
    for (let n = 0; n + 1 < fib.length; n++) expect(countCompositions(fam({ n, allowed: [1, 2] }))).toBe(BigInt(fib[n + 1]));
    // F(101) = 573147844013817084101 (OEIS A000045 b-file).
    expect(countCompositions(fam({ n: 100, maxPart: 2 }))).toBe(573147844013817084101n);
  });

  it('parts >= 2: Fibonacci F(n-1) (OEIS A000045, "compositions of n into parts >= 2" in its comments)', () => {
    const fib = [0, 1, 1, 2, 3, 5, 8, 13, 21, 34, 55, 89, 144];
    for (let n = 2; n <= 13; n++) expect(countCompositions(fam({ n, minPart: 2 }))).toBe(BigInt(fib[n - 1]));
  });

  it('k parts in [a, b]: inclusion–exclusion formula written out, and brute force', () => {
    // sum_j (-1)^j C(k, j) C(n - k a - j (b-a+1) + k - 1, k - 1) (inclusion–exclusion over parts above b).
    const formula = (n: number, k: number, a: number, b: number): bigint => {
      let s = 0n;
      const m = n - k * a;
      for (let j = 0; j <= k && m - j * (b - a + 1) >= 0; j++) {
        const term = BigInt(combinations(k, j) as number) * BigInt(combinations(m - j * (b - a + 1) + k - 1, k - 1) as number);
        s += j % 2 === 0 ? term : -term;
      }
      return s;
    };
    for (const [n, k, a, b] of [[20, 6, 2, 5], [15, 4, 1, 6], [12, 5, 0, 3], [30, 8, 2, 4], [25, 5, 5, 5], [18, 3, 1, 9]]) {
      const f = fam({ n, length: k, minPart: a, maxPart: b });
      const ours = countCompositions(f);
      expect(ours).toBe(formula(n, k, a, b));
      expect(ours).toBe(BigInt(enumerateCompositions(f).length));
    }
    expect(boundedByInclusionExclusion(10, 4, 2)).toBe(BigInt(enumerateCompositions(fam({ n: 10, length: 4, minPart: 0, maxPart: 2 })).length));
  });

  it('bounded and allowed families, with and without length: brute force at small n', () => {
    const families: Omit<CompositionFamily, 'kind'>[] = [
      { n: 20, minPart: 2, maxPart: 5 },
      { n: 15, allowed: [1, 3, 4] },
      { n: 7, allowed: [2, 4] },
      { n: 16, allowed: [2, 4] },
      { n: 17, minPart: 3 },
      { n: 16, allowed: [3, 5], length: 4 },
      { n: 14, allowed: [0, 2, 5], length: 5 },
      { n: 12, allowed: [1, 2, 3, 7], maxPart: 3, length: 6 },
      { n: 13, minPart: 0, maxPart: 4, length: 5 },
      { n: 9, allowed: [1, 4, 6], minPart: 2 },
    ];
    for (const f of families) expect(countCompositions(fam(f)), JSON.stringify(f)).toBe(BigInt(enumerateCompositions(fam(f)).length));
  });

  it('refuses counts over the size limit with LimitExceededError, and malformed families with RangeError', () => {
    expect(() => countCompositions(fam({ n: 2_000_000 }))).toThrow(LimitExceededError);
    expect(() => countCompositions(fam({ n: 10, minPart: 0 }))).toThrow(RangeError);
    expect(() => countCompositions(fam({ n: 10, minPart: 4, maxPart: 3 }))).toThrow(/minPart \(4\) is greater than maxPart \(3\)/);
    expect(() => countCompositions(fam({ n: 1.5 }))).toThrow(RangeError);
    expect(countCompositions(fam({ n: 7, allowed: [2, 4] }))).toBe(0n);
  });
});
