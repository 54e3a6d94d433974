import { sumsOverSizes } from './tilt.js';
import type { SizeSet } from './spec.js';

/**
 * Approximate law of the number of parts of a uniform member of a product-form family (allowed
 * sizes, distinct or not, no length constraint), from its Boltzmann tilt t = ln x: the number of
 * parts L and the size N are sums of independent multiplicities, and given N = n the number of
 * parts is close to normal with the conditional moments below (local limit theorem; Fristedt
 * 1993 for unrestricted partitions). Used only to estimate how often a length condition holds.
 */
export interface LengthLaw {
  readonly mean: number;
  readonly sd: number;
}

export function lengthLaw(sizes: SizeSet, t: number, distinct: boolean): LengthLaw {
  // One pass over the sizes for the four sums (sumsOverSizes: each bit for bit its own sum).
  const [mean, varL, cov, varN] = sumsOverSizes(sizes, t, 4, (k, out) => {
    const q = Math.exp(t * k);
    let varZ: number;
    let meanZ: number;
    if (distinct) {
      const p = 1 / (1 + 1 / q);
      varZ = p * (1 - p);
      meanZ = p;
    } else {
      const d = -Math.expm1(t * k);
      varZ = q / (d * d);
      meanZ = q / d;
    }
    out[0] = meanZ;
    out[1] = varZ;
    out[2] = k * varZ;
    out[3] = k * k * varZ;
  });
  const conditional = varN > 0 ? varL - (cov * cov) / varN : varL;
  return { mean, sd: Math.sqrt(Math.max(conditional, 0)) };
}

/** Standard normal distribution function (Abramowitz & Stegun 7.1.26 via erfc; |error| < 1.5e-7). */
export function normalCdf(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * x);
  const poly = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  const erfc = poly * Math.exp(-x * x);
  return z >= 0 ? 1 - erfc / 2 : erfc / 2;
}

/**
 * The Boltzmann tilt t = ln x with mean size n (as tilt.ts solveTilt), by Newton steps on t
 * (d E N / dt = Var N) inside a bisection bracket: about ten evaluations instead of two hundred.
 * Only speed and estimates depend on it.
 */
export function solveTiltNewton(sizes: SizeSet, n: number, distinct: boolean): number {
  const smallest = sizes.kind === 'list' ? sizes.values[0] : sizes.lo;
  let lo = -60 / smallest;
  let hi = distinct ? 60 / smallest : -1e-15;
  const moments = (t: number): { mean: number; variance: number } => {
    const [mean, variance] = sumsOverSizes(sizes, t, 2, (k, out) => {
      const q = Math.exp(t * k);
      if (distinct) {
        const p = 1 / (1 + 1 / q);
        out[0] = k * p;
        out[1] = k * k * (p * (1 - p));
        return;
      }
      const d = -Math.expm1(t * k);
      out[0] = k * (q / d);
      out[1] = k * k * (q / (d * d));
    });
    return { mean, variance };
  };
  let t = distinct ? -Math.PI / Math.sqrt(12 * n) : -Math.PI / Math.sqrt(6 * n);
  t = Math.min(Math.max(t, lo), hi);
  for (let iter = 0; iter < 60; iter++) {
    const { mean, variance } = moments(t);
    if (Math.abs(mean - n) <= 1e-10 * n) break;
    if (mean < n) lo = t;
    else hi = t;
    let next = t + (n - mean) / variance;
    if (!(next > lo && next < hi) || !Number.isFinite(next)) next = lo < 0 && hi < 0 ? -Math.sqrt(lo * hi) : (lo + hi) / 2;
    if (Math.abs(next - t) <= 1e-13 * Math.abs(t)) break;
    t = next;
  }
  return t;
}
