import { sizeLaw, type SizeLaw } from './size-law.js';

/**
 * Choosing the Boltzmann parameters. The samplers are exact for every x > 0 (and y), because
 * every set partition of the target family gets the same weight x^n·y^k/n! and the rejection
 * steps remove the rest; the parameters only decide how often a draw is kept. They are tuned
 * so that the free model's expected size is n (Duchon et al. 2004, §2.2) and, for a bound on
 * the number of blocks, so that its expected number of blocks sits at the bound (multiparametric
 * tuning; Bendkowski, Bodini & Dovgal, "Tuning as convex optimisation", 2022, for the general
 * problem — here two one-dimensional monotone equations suffice).
 */

/** ln x is searched in this range: e^-60 makes sizes other than the smallest negligible. */
const T_MIN = -60;
const EXTRA = 60;

/** Solves g(t) = 0 for an increasing g with derivative dg, by Newton steps kept inside a shrinking bracket. */
function solveIncreasing(g: (t: number) => { value: number; slope: number }, lo: number, hi: number, start: number): number {
  let t = Math.min(hi, Math.max(lo, start));
  for (let i = 0; i < 200; i++) {
    const { value, slope } = g(t);
    if (Math.abs(value) < 1e-12) return t;
    if (value > 0) hi = t;
    else lo = t;
    let next = slope > 0 ? t - value / slope : NaN;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (hi - lo < 1e-13 * Math.max(1, Math.abs(t))) return next;
    t = next;
  }
  return t;
}

/** The size law whose mean is `mean` (minSize <= mean <= maxSize): for exactly k blocks, mean = n / k. */
export function tiltForMeanSize(mean: number, minSize: number, maxSize: number): SizeLaw {
  if (mean <= minSize * (1 + 1e-12)) return sizeLaw(T_MIN, minSize, maxSize);
  if (mean >= maxSize * (1 - 1e-12)) return sizeLaw(Math.log(maxSize) + EXTRA, minSize, maxSize);
  const t = solveIncreasing(
    (t) => {
      const { law } = sizeLaw(t, minSize, maxSize);
      // d mean / d ln x = variance (an exponential family in ln x).
      return { value: Math.log(law.mean / mean), slope: law.variance / law.mean };
    },
    T_MIN,
    Math.log(maxSize) + EXTRA,
    Math.log(mean),
  );
  return sizeLaw(t, minSize, maxSize);
}

/**
 * The size law at which the free model (y = 1: a Poisson number of blocks, mean the block
 * generating function G(x)) has expected size x·G'(x) = n.
 */
export function tiltForTotal(n: number, minSize: number, maxSize: number): SizeLaw {
  const t = solveIncreasing(
    (t) => {
      const { law, logBlockGf } = sizeLaw(t, minSize, maxSize);
      // ln E[N] = ln G + ln(mean size); its derivative in t is mean + variance / mean.
      return { value: logBlockGf + Math.log(law.mean) - Math.log(n), slope: law.mean + law.variance / law.mean };
    },
    T_MIN,
    Math.log(Math.max(n, 1)) + EXTRA,
    Math.log(Math.max(1, Math.log(n + 1))),
  );
  return sizeLaw(t, minSize, maxSize);
}
