import type { RandomSource } from '../random.js';
import { logPoissonPmf } from './log-poisson.js';

/** Means below this are drawn by inversion, at or above it by transformed rejection. */
const INVERSION_BELOW = 10;

/**
 * Exact Poisson(μ) variates for any mean μ >= 0, set up once per mean.
 *
 * - μ < 10: inversion by sequential search from 0 (Devroye, Non-Uniform Random Variate
 *   Generation 1986, §X.3.2): one uniform, about μ + 1 comparisons.
 * - μ >= 10: Hörmann's transformed rejection with squeeze, PTRS ("The transformed rejection
 *   method for generating Poisson random variables", Insurance: Mathematics and Economics 12,
 *   1993), with the constants of that paper: two uniforms per trial, acceptance about 0.9 at
 *   every μ, and the exact Poisson log-probability in the final test, so the variate is exact
 *   up to double rounding.
 */
export class PoissonVariate {
  private readonly expMinusMean: number;
  private readonly b: number;
  private readonly a: number;
  private readonly logInvAlpha: number;
  private readonly vr: number;

  constructor(readonly mean: number) {
    if (!(mean >= 0) || !Number.isFinite(mean)) throw new RangeError(`a Poisson mean must be finite and >= 0, got ${mean}`);
    this.expMinusMean = Math.exp(-mean);
    const root = Math.sqrt(mean);
    this.b = 0.931 + 2.53 * root;
    this.a = -0.059 + 0.02483 * this.b;
    this.logInvAlpha = Math.log(1.1239 + 1.1328 / (this.b - 3.4));
    this.vr = 0.9277 - 3.6224 / (this.b - 2);
  }

  sample(source: RandomSource): number {
    const mu = this.mean;
    if (mu < INVERSION_BELOW) {
      if (mu === 0) return 0;
      const u = source.nextDouble();
      let k = 0;
      let p = this.expMinusMean;
      let cdf = p;
      // The cumulative sum reaches 1 up to rounding; the cap stops a u above the rounded total.
      while (u >= cdf && k < 1000) {
        k++;
        p *= mu / k;
        cdf += p;
      }
      return k;
    }
    const { a, b, vr } = this;
    for (;;) {
      const u = source.nextDouble() - 0.5;
      const v = source.nextDouble();
      const us = 0.5 - Math.abs(u);
      const k = Math.floor(((2 * a) / us + b) * u + mu + 0.43);
      if (us >= 0.07 && v <= vr) return k;
      if (k < 0 || (us < 0.013 && v > us)) continue;
      if (Math.log(v) + this.logInvAlpha - Math.log(a / (us * us) + b) <= logPoissonPmf(k, mu)) return k;
    }
  }
}
