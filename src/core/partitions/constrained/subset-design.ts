import { nextOpenDouble, type RandomSource } from '../../random.js';

/**
 * The tilted subset design: a k-subset T of the positions [0, N) (N may be Infinity) drawn with
 * probability proportional to x^(sum of T), x = e^(-s), s >= 0. Its normaliser is the elementary
 * symmetric function e_k(1, x, ..., x^(N-1)) = x^(k(k-1)/2) [N choose k]_x (Gaussian binomial;
 * Andrews, "The Theory of Partitions", 1976, Thm 3.1 and §3.3), so every conditional probability
 * of the sequential method has a closed form (Nijenhuis & Wilf 1978, ch. 10, with the counts
 * replaced by their x-weighted versions): with j elements still to place in [t, N),
 *   P(t in T) = x^t e_(j-1)(x^(t+1), ..., x^(N-1)) / e_j(x^t, ..., x^(N-1)) = (1 - x^j) / (1 - x^(N-t)),
 * which is j / (N - t) at x = 1 (a uniform subset) and 1 - x^j for N = Infinity (gaps then
 * independent geometric: the conjugate of "parts <= k" Boltzmann, Fristedt 1993).
 *
 * By stars and bars, k-subsets w_1 < ... < w_k of [0, a + b) are the k-multisets
 * u_i = w_i - (i - 1) of [0, b], i.e. the partitions in a k x b box, with
 * sum(u) = sum(w) - k(k-1)/2: the design is the x-tilted (Boltzmann) law on partitions in a box.
 */

/** x^j -> (1 - x^j) as -expm1(-s j), exact to rounding for tiny s j. */
function oneMinusPow(s: number, j: number): number {
  return -Math.expm1(-s * j);
}

/** P(t in T) with j elements left in [t, N): (1 - x^j) / (1 - x^(N - t)). */
export function inclusionProbability(s: number, j: number, remaining: number): number {
  if (remaining <= j) return 1;
  if (s === 0) return j / remaining;
  if (remaining === Infinity) return oneMinusPow(s, j);
  return oneMinusPow(s, j) / oneMinusPow(s, remaining);
}

/** Beyond this s (N - t), x^(N - t) < 2^-53 / 2: the probability is 1 - x^j to double precision. */
const FAR_FROM_TOP = 38;

/**
 * Draws the design's k-subset of [0, N) into `out` (ascending) and returns its sum, or -1 as
 * soon as the sum must exceed `budget` (the caller rejects such draws; stopping early does not
 * change the accepted ones). Positions are visited bottom-up; runs of excluded positions are
 * skipped:
 * - where x^(N - t) is below double precision (always, for N = Infinity) the probability is the
 *   constant 1 - x^j until the next element, so the gap is geometric: floor(ln U / (-s j));
 * - elsewhere by thinning (Lewis & Shedler 1979; Devroye 1986, §VI.2): the probability p_t
 *   increases with t, so within a window [t, e] chosen with p_e <= 2 p_t the trials are
 *   dominated by Bernoulli(2 p_t); candidates come as geometric jumps of it and are kept with
 *   probability p_c / (2 p_t), which leaves every position's trial Bernoulli(p_c) and
 *   independent. A few windows per element: O(k) steps whatever N is.
 */
export function drawDesign(
  source: RandomSource,
  k: number,
  positions: number,
  s: number,
  out: Float64Array,
  budget = Infinity,
): number {
  let t = 0;
  let j = k;
  let count = 0;
  let sum = 0;
  // Positions below farEnd are "far from the top" (constant probability between elements).
  const farEnd = s === 0 ? 0 : positions === Infinity ? Infinity : positions - Math.ceil(FAR_FROM_TOP / s);
  let logStay = -s * j; // ln(1 - p) = ln x^j far from the top
  while (j > 0) {
    if (sum + j * t + (j * (j - 1)) / 2 > budget) return -1;
    if (t < farEnd) {
      const candidate = t + Math.floor(Math.log(nextOpenDouble(source)) / logStay);
      if (candidate >= farEnd) {
        t = farEnd;
        continue;
      }
      out[count++] = candidate;
      sum += candidate;
      j--;
      logStay = -s * j;
      t = candidate + 1;
      continue;
    }
    const remaining = positions - t;
    if (remaining <= j) {
      // Every remaining position is in T.
      for (let p = t; p < positions; p++) {
        out[count++] = p;
        sum += p;
      }
      break;
    }
    // p_t and the window end: the smallest M_e with 1 - x^(M_e) >= (1 - x^M) / 2.
    const pt = inclusionProbability(s, j, remaining);
    const bound = 2 * pt;
    if (bound >= 0.5) {
      // Dense stretch: one trial per position.
      if (source.nextDouble() < pt) {
        out[count++] = t;
        sum += t;
        j--;
      }
      t++;
      continue;
    }
    const half = s === 0 ? remaining / 2 : -Math.log1p(Math.expm1(-s * remaining) / 2) / s;
    const end = positions - Math.max(j, Math.min(remaining, Math.ceil(half)));
    const candidate = t + Math.floor(Math.log(nextOpenDouble(source)) / Math.log1p(-bound));
    if (candidate > end) {
      t = end + 1;
      continue;
    }
    if (source.nextDouble() * bound < inclusionProbability(s, j, positions - candidate)) {
      out[count++] = candidate;
      sum += candidate;
      j--;
    }
    t = candidate + 1;
  }
  return sum;
}

/** Stable pieces of z / (e^z - 1) and z^2 e^z / (e^z - 1)^2 near 0 (Bernoulli-number series). */
export function designTermMean(z: number): number {
  return c1(z);
}

export function designTermVariance(z: number): number {
  return e2(z);
}

function c1(z: number): number {
  // z / (e^z - 1) - 1 + z / 2 = z^2/12 - z^4/720 + z^6/30240 - ...
  if (z < 1e-2) {
    const z2 = z * z;
    return z2 / 12 - (z2 * z2) / 720 + (z2 * z2 * z2) / 30240;
  }
  return z / Math.expm1(z) - 1 + z / 2;
}

function e2(z: number): number {
  // 1 - (z/2)^2 / sinh(z/2)^2 = z^2/12 - z^4/240 + z^6/6048 - ...
  if (z < 1e-2) {
    const z2 = z * z;
    return z2 / 12 - (z2 * z2) / 240 + (z2 * z2 * z2) / 6048;
  }
  if (z > 700) return 1;
  const r = z / Math.expm1(z);
  return 1 - r * r * Math.exp(z);
}

export interface DesignMoments {
  /** Mean of sum(u) = sum(T) - k(k-1)/2 (the partition's size). */
  readonly mean: number;
  readonly variance: number;
}

/**
 * Mean and variance of the box partition's size under the design (k rows, b columns, b may be
 * Infinity). From the product [k + b choose k]_q = prod_(i=1..k) (1 - q^(b+i)) / (1 - q^i): the
 * size is a signed sum of independent geometric laws, so the cumulants add (Andrews 1976, §3.3;
 * at x = 1 the Mann–Whitney moments k b / 2 and k b (k + b + 1) / 12).
 */
export function designMoments(k: number, b: number, s: number): DesignMoments {
  if (s === 0) {
    if (b === Infinity) return { mean: Infinity, variance: Infinity };
    return { mean: (k * b) / 2, variance: (k * b * (k + b + 1)) / 12 };
  }
  let mean = 0;
  let variance = 0;
  for (let i = 1; i <= k; i++) {
    const z = i * s;
    if (b === Infinity) {
      // i x^i / (1 - x^i) and i^2 x^i / (1 - x^i)^2
      mean += (1 - z / 2 + c1(z)) / s;
      variance += (1 - e2(z)) / (s * s);
    } else {
      const zA = (b + i) * s;
      mean += b / 2 + (c1(z) - c1(zA)) / s;
      variance += (e2(zA) - e2(z)) / (s * s);
    }
  }
  return { mean, variance };
}

/**
 * s >= 0 with design mean = m (0 < m <= k b / 2 for a finite box, so that x <= 1), by Newton
 * steps on s (d mean / ds = -variance) inside a bisection bracket. Only speed depends on it.
 */
export function solveDesignTilt(k: number, b: number, m: number, start?: number): number {
  if (b !== Infinity && m >= (k * b) / 2 - 0.25) return 0;
  let lo = 0;
  let hi = 60;
  // Default start: k values of a geometric law with mean m / k.
  let s = start !== undefined && start > 0 && start < hi ? start : Math.min(hi / 2, Math.max(1e-12, Math.log1p(k / Math.max(m, 1e-9))));
  for (let iter = 0; iter < 200; iter++) {
    const { mean, variance } = designMoments(k, b, s);
    if (mean > m) lo = s;
    else hi = s;
    if (Math.abs(mean - m) <= 1e-9 * Math.max(1, m)) break;
    let next = s + (mean - m) / variance;
    if (!(next > lo && next < hi)) next = lo === 0 ? hi / 16 : Math.sqrt(lo * hi);
    if (Math.abs(next - s) <= 1e-13 * s) break;
    s = next;
  }
  return s;
}

/**
 * ln [N choose j]_x at x = e^(-s) (N may be Infinity), from the product
 * prod_(i=1..j) (1 - x^(N-j+i)) / (1 - x^i) (Andrews 1976, (3.3.1)); the binomial coefficient at s = 0.
 */
export function logGaussianBinomial(N: number, j: number, s: number): number {
  let total = 0;
  for (let i = 1; i <= j; i++) {
    if (s === 0) total += Math.log((N - j + i) / i);
    else {
      if (N !== Infinity) total += Math.log(-Math.expm1(-s * (N - j + i)));
      total -= Math.log(-Math.expm1(-s * i));
    }
  }
  return total;
}

/** ln Γ(z) for z >= 1: exact log-factorial sums below 16, Stirling's series above (error < 1e-15). */
function logGamma(z: number): number {
  let shift = 0;
  while (z < 16) {
    shift -= Math.log(z);
    z += 1;
  }
  const inv = 1 / z;
  const inv2 = inv * inv;
  // Bernoulli terms B_2k / (2k (2k-1) z^(2k-1)), k = 1..6 (Abramowitz & Stegun 6.1.40).
  const series = inv * (1 / 12 + inv2 * (-1 / 360 + inv2 * (1 / 1260 + inv2 * (-1 / 1680 + inv2 * (1 / 1188 + inv2 * (-691 / 360360))))));
  return shift + (z - 0.5) * Math.log(z) - z + 0.5 * Math.log(2 * Math.PI) + series;
}

/** Bernoulli numbers B_0..B_24 (B_1 = -1/2), for the series below (DLMF Table 24.2.1). */
const BERNOULLI = [
  1, -1 / 2, 1 / 6, 0, -1 / 30, 0, 1 / 42, 0, -1 / 30, 0, 5 / 66, 0, -691 / 2730, 0, 7 / 6, 0, -3617 / 510, 0, 43867 / 798, 0,
  -174611 / 330, 0, 854513 / 138, 0, -236364091 / 2730,
];

/**
 * ln (x; x)_j = sum_(i=1..j) ln(1 - x^i), x = e^(-s), s > 0, in O(1) operations, relative error
 * ~1e-15 (checked against the direct sum in test/constrained/subset-design.test.ts):
 * - s >= 1: the direct sum of the terms with x^i above 2^-60;
 * - (j + 1) s >= 1: ln (x; x)_inf - sum_(i>j) ln(1 - x^i); the first by the modular
 *   transformation of Dedekind's eta (Apostol 1976, "Modular functions and Dirichlet series",
 *   Thm 3.1): (x; x)_inf = sqrt(2 pi / s) exp(s/24 - pi^2/(6s)) (x'; x')_inf, x' = e^(-4 pi^2 / s);
 *   the tail as -sum_(m>=1) x^(m(j+1)) / (m (1 - x^m)) (ratio x^(j+1) <= 1/e);
 * - (j + 1) s < 1: sum ln(i s) + sum h(i s) with h(z) = ln((1 - e^-z)/z) = sum_(n>=1) B_n z^n / (n n!)
 *   (radius 2 pi), i.e. j ln s + ln j! + sum_n B_n s^n S_n(j) / (n n!), S_n(j) = sum_(i<=j) i^n
 *   by Faulhaber's formula.
 */
export function logQPochhammer(s: number, j: number, sums?: PowerSums): number {
  if (j <= 0) return 0;
  if (s >= 1 || j <= 32) {
    let total = 0;
    const top = Math.min(j, Math.ceil(42 / s));
    for (let i = 1; i <= top; i++) total += Math.log(-Math.expm1(-s * i));
    return total;
  }
  if ((j + 1) * s >= 1) {
    // ln (x; x)_inf by the eta transformation; (x'; x')_inf with x' <= e^-(4 pi^2) is 1 - x' - ...
    const xp = Math.exp((-4 * Math.PI * Math.PI) / s);
    const full = 0.5 * Math.log((2 * Math.PI) / s) + s / 24 - (Math.PI * Math.PI) / (6 * s) + Math.log1p(-xp) + Math.log1p(-xp * xp);
    let tail = 0;
    for (let m = 1; m < 200; m++) {
      const term = Math.exp(-s * m * (j + 1)) / (m * -Math.expm1(-s * m));
      tail += term;
      if (term < 1e-17 * tail) break;
    }
    return full + tail;
  }
  // Small j s: sum_i ln(i s) + sum_n B_n s^n S_n(j) / (n n!).
  let total = j * Math.log(s) + logGamma(j + 1);
  let factorial = 1;
  for (let n = 1; n < BERNOULLI.length; n++) {
    factorial *= n;
    if (BERNOULLI[n] === 0) continue;
    const term = (BERNOULLI[n] * Math.pow(s, n) * (sums !== undefined && sums.j === j ? sums.values[n] : powerSum(n, j))) / (n * factorial);
    total += term;
    if (Math.abs(term) < 1e-18 * Math.abs(total) && n > 4) break;
  }
  return total;
}

/** The power sums S_n(j) = sum_(i<=j) i^n, n < 25, advanced with j (they do not depend on s). */
export class PowerSums {
  j = 0;
  readonly values = new Float64Array(BERNOULLI.length);

  /** Moves to j + 1. */
  advance(): void {
    this.j++;
    let power = 1;
    for (let n = 0; n < this.values.length; n++) {
      this.values[n] += power;
      power *= this.j;
    }
  }
}

/** sum_(i=1..j) i^n by Faulhaber's formula (1/(n+1)) sum_k C(n+1, k) B+_k j^(n+1-k), B+_1 = +1/2. */
function powerSum(n: number, j: number): number {
  let total = 0;
  let binomial = 1; // C(n+1, k)
  for (let k = 0; k <= n; k++) {
    const b = k === 1 ? 0.5 : BERNOULLI[k];
    if (b !== 0) total += binomial * b * Math.pow(j, n + 1 - k);
    binomial = (binomial * (n + 1 - k)) / (k + 1);
  }
  return total / (n + 1);
}

/**
 * designMoments for an open box (b = Infinity) in O(1): the first 32 terms summed, the rest by
 * Simpson's rule (smooth integrands). Only tilts and estimates depend on it.
 */
export function openMomentsApprox(k: number, s: number): DesignMoments {
  const head = Math.min(k, 32);
  let mean = 0;
  let variance = 0;
  const add = (i: number, weight: number) => {
    const z = i * s;
    mean += (weight * (1 - z / 2 + c1(z))) / s;
    variance += (weight * (1 - e2(z))) / (s * s);
  };
  for (let i = 1; i <= head; i++) add(i, 1);
  if (k > head) {
    const panels = 64;
    const a = head + 0.5;
    const h = (k + 0.5 - a) / panels;
    for (let p = 0; p <= panels; p++) add(a + p * h, ((p === 0 || p === panels ? 1 : p % 2 === 1 ? 4 : 2) * h) / 3);
  }
  return { mean, variance };
}

/**
 * designMoments for a finite k x b box in O(1): the first 32 rows summed, the rest by Simpson's
 * rule (smooth integrands; exact at s = 0). Only tilts and estimates depend on it.
 */
export function boxMomentsApprox(k: number, b: number, s: number): DesignMoments {
  if (s === 0 || k <= 96) return designMoments(k, b, s);
  let mean = 0;
  let variance = 0;
  const add = (i: number, weight: number) => {
    const z = i * s;
    const zA = (b + i) * s;
    mean += weight * (b / 2 + (c1(z) - c1(zA)) / s);
    variance += (weight * (e2(zA) - e2(z))) / (s * s);
  };
  for (let i = 1; i <= 32; i++) add(i, 1);
  const panels = 64;
  const a = 32.5;
  const h = (k + 0.5 - a) / panels;
  for (let p = 0; p <= panels; p++) add(a + p * h, ((p === 0 || p === panels ? 1 : p % 2 === 1 ? 4 : 2) * h) / 3);
  return { mean, variance };
}
