import cdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { sampleUnrestricted } from '../../src/core/compositions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';

/**
 * Largest part of a uniform composition of n = 10^6 (= longest run of uncut gaps + 1, i.e. the
 * longest run in a fair coin sequence): P(M <= m) ~ exp(-n 2^-(m+1)) (Erdős–Rényi law of the
 * longest run; Schilling, "The longest run of heads", College Math. J. 21, 1990 — from memory).
 * 2000 samples; chi-square over the bins m <= 17, 18, ..., 24, >= 25 (each expects >= 40 draws) against that law.
 * alpha = 1e-4. The approximation's own error at n = 1e6 is O(1/n) per bin, far below the
 * sampling noise of 2000 draws.
 */
describe('largest part of unrestricted compositions, n = 1e6', () => {
  it('follows P(M <= m) = exp(-n 2^-(m+1))', () => {
    const n = 1_000_000;
    const draws = 2000;
    const F = (m: number) => Math.exp(-n * 2 ** -(m + 1));
    const edges = [17, 18, 19, 20, 21, 22, 23, 24];
    const observed = new Array(edges.length + 1).fill(0);
    for (let i = 0; i < draws; i++) {
      const parts = sampleUnrestricted(sampleSource('longest', i, 'unrestricted'), n);
      let largest = 0;
      for (const p of parts) if (p > largest) largest = p;
      let bin = edges.findIndex((e) => largest <= e);
      if (bin < 0) bin = edges.length;
      observed[bin]++;
    }
    const probs = edges.map((e, i) => F(e) - (i === 0 ? 0 : F(edges[i - 1])));
    probs.push(1 - F(edges[edges.length - 1]));
    let stat = 0;
    for (let i = 0; i < probs.length; i++) stat += (observed[i] - draws * probs[i]) ** 2 / (draws * probs[i]);
    expect(1 - cdf(stat, probs.length - 1)).toBeGreaterThan(1e-4);
  });
});
