import type { SizeSet } from './spec.js';

/**
 * The Boltzmann tilt of a product-form family (Duchon, Flajolet, Louchard & Schaeffer 2004;
 * Fristedt 1993). Multiplicities are independent: Z_k ~ Geometric with P(Z_k >= j) = x^(kj) for
 * partitions, Z_k ~ Bernoulli(x^k / (1 + x^k)) for distinct parts, k over the allowed sizes.
 * We work with t = ln x. The size N = sum k Z_k has mean E(t); we solve E(t) = n so that size n
 * is typical. The solved t only affects speed: exactness comes from the rejection steps, which use
 * the same t in closed form.
 */

/** Sizes summed term by term before switching to Simpson's rule for long intervals. */
const DIRECT_TERMS = 4_000;
const SIMPSON_PANELS = 4_000;

/**
 * sum over allowed sizes k of f(k), for f that decays like e^(t k) when t < 0. Long intervals are
 * summed exactly for their first DIRECT_TERMS sizes and by Simpson's rule beyond (the result
 * steers the tilt, it does not enter any probability).
 */
export function sumOverSizes(sizes: SizeSet, t: number, f: (k: number) => number): number {
  if (sizes.kind === 'list') {
    let s = 0;
    for (const k of sizes.values) s += f(k);
    return s;
  }
  const { lo } = sizes;
  let hi = sizes.hi;
  if (t < 0) hi = Math.min(hi, lo + Math.ceil(60 / -t));
  if (hi - lo + 1 <= 2 * DIRECT_TERMS) {
    let s = 0;
    for (let k = lo; k <= hi; k++) s += f(k);
    return s;
  }
  let s = 0;
  const split = lo + DIRECT_TERMS;
  for (let k = lo; k < split; k++) s += f(k);
  // Simpson's rule on [split - 1/2, hi + 1/2] approximates the sum over split..hi (midpoint form).
  const a = split - 0.5;
  const b = hi + 0.5;
  const h = (b - a) / SIMPSON_PANELS;
  let acc = f(a) + f(b);
  for (let i = 1; i < SIMPSON_PANELS; i++) acc += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return s + (acc * h) / 3;
}

/**
 * Several sums over the allowed sizes at once, sums[i] = sum over k of f_i(k), where
 * fill(k, values) writes f_0(k), ..., f_{width-1}(k) into values: the same points, weights and
 * order of additions as sumOverSizes for each i (so each result is bit for bit that function's),
 * with the terms' shared transcendental functions evaluated once per point.
 */
export function sumsOverSizes(sizes: SizeSet, t: number, width: number, fill: (k: number, values: Float64Array) => void): Float64Array {
  const values = new Float64Array(width);
  const s = new Float64Array(width);
  const add = (k: number, weight: number, into: Float64Array) => {
    fill(k, values);
    for (let i = 0; i < width; i++) into[i] += weight === 1 ? values[i] : weight * values[i];
  };
  if (sizes.kind === 'list') {
    for (const k of sizes.values) add(k, 1, s);
    return s;
  }
  const { lo } = sizes;
  let hi = sizes.hi;
  if (t < 0) hi = Math.min(hi, lo + Math.ceil(60 / -t));
  if (hi - lo + 1 <= 2 * DIRECT_TERMS) {
    for (let k = lo; k <= hi; k++) add(k, 1, s);
    return s;
  }
  const split = lo + DIRECT_TERMS;
  for (let k = lo; k < split; k++) add(k, 1, s);
  const a = split - 0.5;
  const b = hi + 0.5;
  const h = (b - a) / SIMPSON_PANELS;
  const acc = new Float64Array(width);
  fill(a, values);
  for (let i = 0; i < width; i++) acc[i] = values[i];
  fill(b, values);
  for (let i = 0; i < width; i++) acc[i] += values[i];
  for (let j = 1; j < SIMPSON_PANELS; j++) add(a + j * h, j % 2 === 1 ? 4 : 2, acc);
  for (let i = 0; i < width; i++) s[i] = s[i] + (acc[i] * h) / 3;
  return s;
}

/** Mean part count, mean size and size variance of one size k under tilt t. */
function geometricTerms(k: number, t: number): { p: number; mean: number; varZ: number } {
  const y = Math.exp(t * k); // x^k
  const mean = y / -Math.expm1(t * k); // E Z = y / (1 - y)
  return { p: y, mean, varZ: mean * (1 + mean) };
}

function bernoulliTerms(k: number, t: number): { p: number; mean: number; varZ: number } {
  const p = 1 / (1 + Math.exp(-t * k)); // x^k / (1 + x^k)
  return { p, mean: p, varZ: p * (1 - p) };
}

export interface TiltMoments {
  /** E N, mean size. */
  readonly mean: number;
  /** Var N. */
  readonly variance: number;
  /** E (number of parts). */
  readonly parts: number;
  /** E (number of distinct sizes). */
  readonly distinctSizes: number;
}

export function tiltMoments(sizes: SizeSet, t: number, distinct: boolean): TiltMoments {
  const terms = distinct ? bernoulliTerms : geometricTerms;
  const [mean, variance, parts, distinctSizes] = sumsOverSizes(sizes, t, 4, (k, out) => {
    const z = terms(k, t);
    out[0] = k * z.mean;
    out[1] = k * k * z.varZ;
    out[2] = z.mean;
    out[3] = z.p;
  });
  return { mean, variance, parts, distinctSizes };
}

function meanSize(sizes: SizeSet, t: number, distinct: boolean): number {
  const terms = distinct ? bernoulliTerms : geometricTerms;
  return sumOverSizes(sizes, t, (k) => k * terms(k, t).mean);
}

/**
 * t with E(t) = n, by bisection (E is increasing in t). Partitions need t < 0; distinct parts
 * over a finite set may need t >= 0 (n above half the sum of the sizes).
 */
export function solveTilt(sizes: SizeSet, n: number, distinct: boolean): number {
  const smallest = sizes.kind === 'list' ? sizes.values[0] : sizes.lo;
  let lo = -60 / smallest; // E(lo) is about smallest * e^-60: below any n >= 1
  let hi: number;
  if (distinct) {
    hi = 60 / smallest;
  } else {
    hi = -1e-15;
  }
  for (let i = 0; i < 200 && hi - lo > 1e-12 * Math.max(Math.abs(lo), Math.abs(hi)); i++) {
    // Bisect on a log scale for negative t (t spans many orders of magnitude), linearly otherwise.
    const mid = lo < 0 && hi < 0 ? -Math.sqrt(lo * hi) : (lo + hi) / 2;
    if (mid === lo || mid === hi) break;
    if (meanSize(sizes, mid, distinct) < n) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * Local-limit estimate of P(N = n) under the tilt: span / sqrt(2 pi Var N), where span is the gcd
 * of the sizes (Gaussian local limit theorem; used only for cost estimates), capped at 1.
 */
export function localProbability(variance: number, span: number): number {
  if (!(variance > 0)) return 1;
  return Math.min(1, span / Math.sqrt(2 * Math.PI * variance));
}
