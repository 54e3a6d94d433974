import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import kstest from '@stdlib/stats-kstest';
import { lgamma } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { sampleSource } from '../../src/core/seeding.js';
import {
  binnedChiSquare,
  chiSquareSurvival,
  integerKolmogorovSmirnov,
  kolmogorovSmirnovPValue,
  kolmogorovSurvival,
  lnBinomial,
  lnGamma,
  regularizedGammaQ,
} from '../../src/core/pictures/statistics.js';

describe('the distribution functions of the check, against outside implementations', () => {
  it('ln Gamma agrees with mathjs lgamma', () => {
    for (const x of [0.1, 0.5, 1, 1.5, 2, 3.7, 10, 57.25, 1000, 123456.5]) {
      const reference = lgamma(x) as number;
      // Tolerance: what a p-value needs is far coarser; measured differences are ~1e-12 relative.
      expect(Math.abs(lnGamma(x) - reference)).toBeLessThan(1e-11 * Math.max(1, Math.abs(reference)));
    }
    // ln C(10, 3) = ln 120 (DLMF 26.3.1).
    expect(lnBinomial(10, 3)).toBeCloseTo(Math.log(120), 12);
  });

  it('chi-square survival agrees with @stdlib chisquare cdf', () => {
    for (const k of [1, 2, 3, 5, 10, 31, 100, 500]) {
      for (const q of [0.01, 0.3, 0.5, 1, 1.5, 2, 4]) {
        const x = q * k;
        const reference = 1 - chisquareCdf(x, k);
        const ours = chiSquareSurvival(x, k);
        // Absolute agreement where 1 - cdf is computed with cancellation by the reference.
        expect(Math.abs(ours - reference), `x=${x} k=${k}`).toBeLessThan(1e-12);
      }
    }
    // Deep tail: 1 - cdf underflows to 0 in the reference; ours stays positive and tiny.
    expect(chiSquareSurvival(400, 10)).toBeGreaterThan(0);
    expect(chiSquareSurvival(400, 10)).toBeLessThan(1e-70);
    // Q(1, x) = e^{-x} (DLMF 8.4.8 with a = 1).
    expect(regularizedGammaQ(1, 3)).toBeCloseTo(Math.exp(-3), 14);
  });

  it('Kolmogorov survival matches the classical critical values', () => {
    // Asymptotic two-sided critical values 1.358 (5%) and 1.628 (1%): standard KS tables
    // (e.g. Smirnov 1948), from memory.
    expect(kolmogorovSurvival(1.358)).toBeCloseTo(0.05, 3);
    expect(kolmogorovSurvival(1.628)).toBeCloseTo(0.01, 3);
    // The two series agree where they meet.
    expect(Math.abs(kolmogorovSurvival(1.1799999) - kolmogorovSurvival(1.18))).toBeLessThan(1e-6);
  });

  it('the KS p-value is close to @stdlib kstest (exact Marsaglia–Tsang–Wang) on real data', () => {
    for (const [seed, size] of [['ks-a', 200], ['ks-b', 1000], ['ks-c', 50]] as const) {
      const source = sampleSource(seed, 0, 'test');
      // Squares of uniforms are far from uniform only mildly when mixed: half squared.
      const data = Array.from({ length: size }, (_, i) => (i % 2 === 0 ? source.nextDouble() : source.nextDouble() ** 1.3));
      const reference = kstest(data, 'uniform', 0, 1);
      const sorted = [...data].sort((a, b) => a - b);
      let d = 0;
      sorted.forEach((x, i) => (d = Math.max(d, (i + 1) / size - x, x - i / size)));
      expect(d).toBeCloseTo(reference.statistic, 12);
      // Stephens' approximation: within 0.01 of the exact p-value for N >= 50 (common practice).
      expect(Math.abs(kolmogorovSmirnovPValue(d, size) - reference.pValue), seed).toBeLessThan(0.01);
    }
  });
});

describe('binned chi-square', () => {
  it('pools cells until each expects at least 5 and keeps the totals', () => {
    const probabilities = [0.001, 0.004, 0.02, 0.2, 0.5, 0.2, 0.05, 0.02, 0.005];
    const observed = [0, 1, 3, 41, 98, 39, 12, 5, 1];
    const result = binnedChiSquare(observed, probabilities);
    const total = observed.reduce((a, b) => a + b, 0);
    for (const cell of result.cells) expect(cell.expected).toBeGreaterThanOrEqual(5);
    expect(result.cells.reduce((a, c) => a + c.observed, 0)).toBe(total);
    expect(result.cells.reduce((a, c) => a + c.expected, 0)).toBeCloseTo(total, 9);
    expect(result.degreesOfFreedom).toBe(result.cells.length - 1);
    expect(result.pValue).toBeCloseTo(1 - chisquareCdf(result.statistic, result.degreesOfFreedom), 12);
  });

  it('fails samples outside the support', () => {
    const result = binnedChiSquare([10, 10, 0, 5], [0.5, 0.5, 0, 0]);
    expect(result.pValue).toBe(0);
  });

  it('gives no p-value when everything falls in one cell', () => {
    expect(binnedChiSquare([3, 1], [0.5, 0.5]).pValue).toBeNull();
  });
});

describe('integer Kolmogorov-Smirnov against a continuous law', () => {
  it('accepts rounded draws from the law and rejects shifted ones', () => {
    // A logistic law with scale 20: F(x) = 1/(1 + e^{-x/20}); draws by inversion, rounded.
    const cdf = (x: number): number => 1 / (1 + Math.exp(-x / 20));
    const draw = (shift: number): number[] => {
      const source = sampleSource('int-ks', 0, 'test');
      const values = Array.from({ length: 5000 }, () => {
        const u = source.nextDouble();
        return Math.round(20 * Math.log(u / (1 - u)) + shift);
      });
      return values;
    };
    const tally = (values: number[]) => {
      const lo = Math.min(...values);
      const counts = new Array(Math.max(...values) - lo + 1).fill(0);
      for (const v of values) counts[v - lo]++;
      return { lo, counts };
    };
    const fair = tally(draw(0));
    // alpha = 1e-4: a false alarm at most once in 10^4 seeds.
    expect(integerKolmogorovSmirnov(fair.counts, fair.lo, cdf).pValue!).toBeGreaterThan(1e-4);
    const shifted = tally(draw(5));
    expect(integerKolmogorovSmirnov(shifted.counts, shifted.lo, cdf).pValue!).toBeLessThan(1e-6);
  });
});
