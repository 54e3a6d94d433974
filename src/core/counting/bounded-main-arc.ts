import { complexLi2ExpNeg } from './complex-dilog.js';
import { boundedSaddle, realDerivatives, shapeOf } from './bounded-log-generating.js';

/**
 * Where the main-arc integral counts partitions into parts in [a, b] accurately (the damping of
 * the arc at q = −1 by the odd sizes; see log-bounded-part-count.ts), and so where its table must end.
 */

/** Largest size counted (the service's limit on n; LogBoundedPartCounts.MAX_M). */
export const BOUNDED_MAX_M = 1_000_000_000;

/** Main-arc threshold on A(t) (see the class comment and the test file). */
export const A_MIN = 36;

/**
 * A(t) = Σ_{odd k∈[a,b]} log coth(kt/2): the first ARC_TERMS odd terms summed, the rest by the
 * midpoint rule, (1/2t)∫ log coth(u/2) du over [(k0 − 1)t, (b + 1)t] with the antiderivative
 * Li₂(−e^{−u}) − Li₂(e^{−u}) (relative error below 1e-4, measured: A is only compared with A_MIN, and
 * mainArcStart adds 10% to the size). Terms below 1e-18 are dropped (they only fall).
 */
export function arcDamping(a: number, b: number, t: number): number {
  let sum = 0;
  let k = a % 2 === 1 ? a : a + 1;
  for (let i = 0; i < ARC_TERMS && k <= b; i++, k += 2) {
    const e = Math.exp(-k * t);
    const term = Math.log1p((2 * e) / -Math.expm1(-k * t));
    sum += term;
    if (term < 1e-18) return sum;
  }
  if (k > b) return sum;
  const F = (u: number) => 0.5 * complexLi2ExpNeg(2 * u, 0)[0] - 2 * complexLi2ExpNeg(u, 0)[0]; // Li₂(−e^{−u}) − Li₂(e^{−u})
  return sum + (F((b + 1) * t) - F((k - 1) * t)) / (2 * t);
}

const ARC_TERMS = 200;

/** Whether the main arc is accurate at size m for [a, b] (A(t_m) >= A_MIN). */
export function mainArcHolds(a: number, b: number, m: number): boolean {
  if (m < 1) return false;
  return arcDamping(a, b, boundedSaddle(shapeOf(a, b), m)) >= A_MIN;
}

/**
 * Where the table must end for the main arc to be accurate above it, for [a, b] (a <= b): the
 * size at which A(t) reaches A_MIN (A falls with t: bisection on t, then the mean size −L'(t)
 * there), plus 10%, at least 200; Infinity when A < A_MIN even at MAX_M (few sizes, e.g. b = 2).
 */
export function mainArcStart(a: number, b: number): number {
  const shape = shapeOf(a, b);
  if (!mainArcHolds(a, b, BOUNDED_MAX_M)) return Infinity;
  let hi = boundedSaddle(shape, 1); // few parts: A small
  let lo = boundedSaddle(shape, BOUNDED_MAX_M);
  if (arcDamping(a, b, hi) >= A_MIN) return 200;
  for (let i = 0; i < 100 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (arcDamping(a, b, mid) >= A_MIN) lo = mid;
    else hi = mid;
  }
  const [d1] = realDerivatives(shape, 0, lo);
  return Math.max(200, Math.ceil(1.1 * -d1));
}

/** The table end for sizes up to cap: mainArcStart, or cap when that is smaller. */
export function defaultTableEnd(a: number, b: number, cap: number): number {
  if (b < a) return 0;
  return Math.min(cap, mainArcStart(a, b));
}
