import { describe, expect, it } from 'vitest';
import { BoxDesign, BoxSubset } from '../../src/core/partitions/constrained/box-subset.js';
import { designMoments, logGaussianBinomial, logQPochhammer } from '../../src/core/partitions/constrained/subset-design.js';
import { sampleSource } from '../../src/core/seeding.js';

/** Partitions in the rows x cols box with the given size, by brute force (independent of the library). */
function boxCount(rows: number, cols: number, size: number): number {
  let count = 0;
  const walk = (left: number, largest: number, rowsLeft: number) => {
    if (left === 0) {
      count++;
      return;
    }
    if (rowsLeft === 0) return;
    for (let p = Math.min(largest, left); p >= 1; p--) walk(left - p, p, rowsLeft - 1);
  };
  walk(size, Math.min(cols, size), rows);
  return count;
}

/** Compensated (Kahan) sum of ln(1 - x^i), i = 1..j: the reference for the O(1) formula. */
function directLogQPochhammer(s: number, j: number): number {
  let sum = 0;
  let carry = 0;
  for (let i = 1; i <= j; i++) {
    const y = Math.log(-Math.expm1(-s * i)) - carry;
    const t = sum + y;
    carry = t - sum - y;
    sum = t;
  }
  return sum;
}

describe('normalisers of the subset design', () => {
  it('ln (x; x)_j in O(1) (eta transformation, Faulhaber series) agrees with the direct sum to 1e-14', () => {
    for (const s of [1e-7, 2e-6, 3e-5, 1e-4, 1e-3, 0.02, 0.3, 0.9, 1.5, 6]) {
      for (const j of [1, 7, 33, 100, 999, 4321, 31_622, 200_000]) {
        const exact = directLogQPochhammer(s, j);
        expect(Math.abs(logQPochhammer(s, j) - exact) / Math.max(1, Math.abs(exact)), `s ${s} j ${j}`).toBeLessThan(1e-14);
      }
    }
  });

  it('ln [N choose j]_x at x = 1 is ln C(N, j) (BigInt binomial)', () => {
    for (const [N, j] of [
      [10, 3],
      [50, 25],
      [300, 120],
    ]) {
      let c = 1n;
      for (let i = 1; i <= j; i++) c = (c * BigInt(N - j + i)) / BigInt(i);
      expect(logGaussianBinomial(N, j, 0)).toBeCloseTo(Math.log(Number(c)), 9);
    }
  });
});

describe('box designs', () => {
  it('the size of a uniform box partition has the Mann–Whitney mean k b / 2 and variance k b (k + b + 1) / 12 (Mann & Whitney 1947)', () => {
    for (const [k, b] of [
      [3, 5],
      [6, 6],
      [4, 9],
    ]) {
      let total = 0;
      let first = 0;
      let second = 0;
      for (let m = 0; m <= k * b; m++) {
        const c = boxCount(k, b, m);
        total += c;
        first += c * m;
        second += c * m * m;
      }
      const mean = first / total;
      const exact = designMoments(k, b, 0);
      expect(exact.mean).toBeCloseTo(mean, 9);
      expect(exact.variance).toBeCloseTo(second / total - mean * mean, 9);
    }
  });

  it('tilted moments match the Gaussian-binomial law weighted by x^size', () => {
    for (const [k, b, s] of [
      [3, 5, 0.3],
      [5, 4, 0.05],
      [4, Infinity, 0.4],
    ] as const) {
      let total = 0;
      let first = 0;
      let second = 0;
      const top = b === Infinity ? 150 : k * b; // x^150 = e^-60 at s = 0.4: the rest is below rounding
      for (let m = 0; m <= top; m++) {
        const w = boxCount(k, b, m) * Math.exp(-s * m);
        total += w;
        first += w * m;
        second += w * m * m;
      }
      const mean = first / total;
      const got = designMoments(k, b, s);
      expect(got.mean).toBeCloseTo(mean, 6);
      expect(got.variance).toBeCloseTo(second / total - mean * mean, 5);
    }
  });

  it('one proposal succeeds with probability (members) x exp(logSuccessPerMember): z-test, alpha = 1e-4', () => {
    // This identity is what makes box-mixture exact (the weight of k is its inverse).
    for (const [rows, cols, size] of [
      [4, 5, 9],
      [5, 4, 7],
      [3, 8, 20],
      [4, Infinity, 12],
      [6, 9, 20],
    ]) {
      const design = new BoxDesign({ rows, cols, size });
      const box = new BoxSubset(design);
      const trials = 40_000;
      const source = sampleSource('success-rate', 0, `${rows}x${cols}:${size}`);
      let ok = 0;
      for (let i = 0; i < trials; i++) if (box.propose(source) !== null) ok++;
      const p = boxCount(rows, cols, size) * Math.exp(design.logSuccessPerMember());
      const z = (ok / trials - p) / Math.sqrt((p * (1 - p)) / trials);
      expect(Math.abs(z), `${rows}x${cols}:${size} rate ${ok / trials} vs ${p}`).toBeLessThan(3.89);
    }
  });

  it('estimates: expected proposals within 25% of the measured mean on mid-size boxes', () => {
    for (const [rows, cols, size] of [
      [40, 199, 2960],
      [30, Infinity, 3000],
    ]) {
      const design = new BoxDesign({ rows, cols, size });
      const box = new BoxSubset(design);
      const source = sampleSource('estimates', 0, `${rows}x${cols}:${size}`);
      let proposals = 0;
      let samples = 0;
      while (samples < 400) {
        proposals++;
        if (box.propose(source) !== null) samples++;
      }
      expect(proposals / samples / design.expectedProposals).toBeGreaterThan(0.75);
      expect(proposals / samples / design.expectedProposals).toBeLessThan(1.33);
    }
  });
});
