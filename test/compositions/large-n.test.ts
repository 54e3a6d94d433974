import { describe, expect, it } from 'vitest';
import { sampleUnrestricted } from '../../src/core/compositions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';

/**
 * Unrestricted compositions of n = 10^6: the number of parts is exactly 1 + Binomial(n-1, 1/2)
 * (each gap is cut independently with probability 1/2; Stanley EC1 §1.2), so its mean is
 * (n+1)/2 and its variance (n-1)/4. 200 samples (~1 s). alpha = 1e-4 per check.
 */
describe('unrestricted compositions at n = 1e6', () => {
  it('number of parts: mean (n+1)/2 and variance (n-1)/4', () => {
    const n = 1_000_000;
    const draws = 200;
    const lengths: number[] = [];
    for (let i = 0; i < draws; i++) lengths.push(sampleUnrestricted(sampleSource('law', i, 'unrestricted'), n).length);
    const mean = lengths.reduce((s, v) => s + v, 0) / draws;
    const variance = lengths.reduce((s, v) => s + (v - mean) ** 2, 0) / (draws - 1);
    // z-test of the mean: two-sided 1e-4 quantile of N(0,1) is 3.891 (A&S Table 26.1, from memory).
    const z = (mean - (n + 1) / 2) / Math.sqrt((n - 1) / 4 / draws);
    expect(Math.abs(z)).toBeLessThan(3.891);
    // (draws-1) s^2 / sigma^2 ~ chi-square(199) (normal parts: Binomial(1e6, 1/2) is normal to ~1e-3).
    // Wilson–Hilferty 1e-4 two-sided bounds for 199 degrees of freedom: [130.5, 286.3] (computed
    // from 199 (1 - 2/(9*199) -+ 3.891 sqrt(2/(9*199)))^3).
    const stat = ((draws - 1) * variance) / ((n - 1) / 4);
    expect(stat).toBeGreaterThan(130.5);
    expect(stat).toBeLessThan(286.3);
  });
});
