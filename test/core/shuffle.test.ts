import { describe, expect, it } from 'vitest';
import { binnedChiSquare } from '../../src/core/pictures/statistics.js';
import { sampleSource } from '../../src/core/seeding.js';
import { shuffleInPlace } from '../../src/core/shuffle.js';

/** The rank of a permutation of 0..n−1 in lexicographic order (Lehmer code). */
function permutationRank(p: Int32Array): number {
  let rank = 0;
  for (let i = 0; i < p.length; i++) {
    let smaller = 0;
    for (let j = i + 1; j < p.length; j++) if (p[j] < p[i]) smaller++;
    rank = rank * (p.length - i) + smaller;
  }
  return rank;
}

function identity(n: number): Int32Array {
  const p = new Int32Array(n);
  for (let i = 0; i < n; i++) p[i] = i;
  return p;
}

/**
 * Fisher–Yates with several indices per 32-bit word (src/core/shuffle.ts). Statistical tests use
 * fixed seeds; each has false-alarm probability 1e-4 (alpha).
 */
describe('shuffleInPlace', () => {
  it('all 7! = 5040 orders of 7 items are equally likely (chi-square, 200,000 shuffles, alpha = 1e-4)', () => {
    // Bounds 7, 6, …, 2 multiply to 5040: one word gives the whole shuffle.
    const source = sampleSource('shuffle', 0, 'n-7');
    const counts = new Array<number>(5040).fill(0);
    for (let t = 0; t < 200_000; t++) {
      const p = identity(7);
      shuffleInPlace(source, p);
      counts[permutationRank(p)]++;
    }
    expect(binnedChiSquare(counts, new Array<number>(5040).fill(1 / 5040)).pValue).toBeGreaterThan(1e-4);
  });

  // 20 items take two words (20·19·…·9 > 2^32): the first two and the last two entries, each
  // pair over its 380 equally likely ordered values.
  for (const [label, a, b] of [['first', 0, 1], ['last', 18, 19]] as const) {
    it(`20 items: the ${label} two entries are a uniform ordered pair (chi-square over 380, alpha = 1e-4)`, () => {
      const source = sampleSource('shuffle', a, 'n-20');
      const counts = new Array<number>(400).fill(0);
      const probabilities = Array.from({ length: 400 }, (_, c) => (Math.floor(c / 20) === c % 20 ? 0 : 1 / 380));
      for (let t = 0; t < 100_000; t++) {
        const p = identity(20);
        shuffleInPlace(source, p);
        counts[p[a] * 20 + p[b]]++;
      }
      expect(binnedChiSquare(counts, probabilities).pValue).toBeGreaterThan(1e-4);
    });
  }

  it('1000 items: where item 0 lands and what lands at the last place are uniform (chi-square, alpha = 1e-4 each)', () => {
    const source = sampleSource('shuffle', 0, 'n-1000');
    const where = new Array<number>(1000).fill(0);
    const last = new Array<number>(1000).fill(0);
    for (let t = 0; t < 20_000; t++) {
      const p = identity(1000);
      shuffleInPlace(source, p);
      where[p.indexOf(0)]++;
      last[p[999]]++;
    }
    const uniform = new Array<number>(1000).fill(1 / 1000);
    expect(binnedChiSquare(where, uniform).pValue).toBeGreaterThan(1e-4);
    expect(binnedChiSquare(last, uniform).pValue).toBeGreaterThan(1e-4);
  });

  it('is a permutation at every length 0..40 and past 2^21 items (where indices take one word each)', () => {
    for (const n of [...Array.from({ length: 41 }, (_, n) => n), 2 ** 21 + 3]) {
      const p = identity(n);
      shuffleInPlace(sampleSource('shuffle', n, 'lengths'), p);
      const seen = new Uint8Array(n);
      for (const v of p) seen[v]++;
      expect(seen.every((c) => c === 1)).toBe(true);
    }
  });
});
