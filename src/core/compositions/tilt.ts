import type { PartSet } from './resolve.js';

/**
 * The Boltzmann tilt of a part set S (all members >= 1, at least two members, gcd 1): the
 * x in (0, 1) with sum_{v in S} x^v = 1. Parts drawn i.i.d. with P(v) = x^v then form a renewal
 * process, and any composition (v_1..v_j) of n is produced with probability x^n whatever j is:
 * conditioned on the running sum hitting n the composition is uniform (Flajolet & Sedgewick,
 * Analytic Combinatorics 2009, §V.2 on supercritical sequences; Feller vol. 1, ch. XIII).
 * The root is kept as t = -ln x, which stays accurate when x is close to 1 (large parts).
 */
export interface Tilt {
  /** -ln x. */
  readonly t: number;
  /** x = exp(-t). */
  readonly x: number;
  /** Mean part mu = sum v x^v; the renewal theorem gives P(sum hits n) -> 1/mu. */
  readonly mean: number;
}

/** ln sum_{v in S} e^{-v t}, computed without overflow or cancellation. */
export function logWeight(set: PartSet, t: number): number {
  if (set.kind === 'range') {
    // sum_{v=a}^{b} e^{-vt} = e^{-at} (1 - e^{-Lt}) / (1 - e^{-t}), L = b - a + 1.
    const len = set.max - set.min + 1;
    return -set.min * t + Math.log(-Math.expm1(-len * t)) - Math.log(-Math.expm1(-t));
  }
  // log-sum-exp over the list, led by its smallest member.
  const first = set.values[0];
  let sum = 0;
  for (const v of set.values) sum += Math.exp(-(v - first) * t);
  return -first * t + Math.log(sum);
}

/** Mean part sum v e^{-vt} / sum e^{-vt}. */
export function meanPart(set: PartSet, t: number): number {
  if (set.kind === 'range') {
    // -d/dt of logWeight: a - L / (e^{Lt} - 1) + 1 / (e^t - 1).
    const len = set.max - set.min + 1;
    const tail = len * t > 700 ? 0 : len / Math.expm1(len * t);
    return set.min - tail + 1 / Math.expm1(t);
  }
  const first = set.values[0];
  let sum = 0;
  let weighted = 0;
  for (const v of set.values) {
    const w = Math.exp(-(v - first) * t);
    sum += w;
    weighted += v * w;
  }
  return weighted / sum;
}

/** Solves sum_{v in S} x^v = 1 by bisection on ln t (the left side falls as t grows). */
export function solveTilt(set: PartSet): Tilt {
  let lo = -745; // ln t; at t = e^-745 the sum is ~|S| > 1
  let hi = Math.log(60); // at t = 60 the sum is < e^-60 / (1 - e^-60) < 1
  for (let i = 0; i < 200 && hi - lo > 1e-15; i++) {
    const mid = (lo + hi) / 2;
    if (logWeight(set, Math.exp(mid)) > 0) lo = mid;
    else hi = mid;
  }
  const t = Math.exp((lo + hi) / 2);
  return { t, x: Math.exp(-t), mean: meanPart(set, t) };
}
