import type { RandomSource } from '../random.js';

/**
 * Terms whose weight is below e^-CUT times the largest are left out of a law's table: e^-45 is
 * ~3e-20, far below the 2^-53 resolution of the uniform that inverts the table, so leaving them
 * out is within double rounding.
 */
export const LOG_CUT = 45;

/**
 * A law on the whole numbers lo..hi given by log-weights (any common offset), tabulated for
 * sampling by inversion (one uniform, a binary search over the cumulative sums; Devroye 1986,
 * §III.2) and for reading probabilities back. Exact up to double rounding.
 */
export class DiscreteLaw {
  /** P(value = lo + i), summing to 1. */
  readonly pmf: Float64Array;
  private readonly cdf: Float64Array;
  /** The largest probability. */
  readonly pmax: number;
  readonly mean: number;
  readonly variance: number;
  /** ln of the sum of exp(logWeights), in the weights' own scale. */
  readonly logTotal: number;

  constructor(
    readonly lo: number,
    logWeights: Float64Array,
  ) {
    let top = -Infinity;
    for (const w of logWeights) if (w > top) top = w;
    const m = logWeights.length;
    this.pmf = new Float64Array(m);
    let total = 0;
    for (let i = 0; i < m; i++) total += this.pmf[i] = Math.exp(logWeights[i] - top);
    this.logTotal = top + Math.log(total);
    this.cdf = new Float64Array(m);
    let running = 0;
    let mean = 0;
    let pmax = 0;
    for (let i = 0; i < m; i++) {
      const p = (this.pmf[i] /= total);
      running += p;
      this.cdf[i] = running;
      mean += i * p;
      if (p > pmax) pmax = p;
    }
    this.cdf[m - 1] = 1; // the total is 1 up to rounding; no uniform in [0, 1) may fall past it
    let variance = 0;
    for (let i = 0; i < m; i++) variance += (i - mean) ** 2 * this.pmf[i];
    this.pmax = pmax;
    this.mean = lo + mean;
    this.variance = variance;
  }

  get hi(): number {
    return this.lo + this.pmf.length - 1;
  }

  /** P(value = v) (0 outside lo..hi). */
  probability(v: number): number {
    const i = v - this.lo;
    return i >= 0 && i < this.pmf.length ? this.pmf[i] : 0;
  }

  sample(source: RandomSource): number {
    const u = source.nextDouble();
    const cdf = this.cdf;
    let lo = 0;
    let hi = cdf.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (u < cdf[mid]) hi = mid;
      else lo = mid + 1;
    }
    return this.lo + lo;
  }
}

/**
 * Log-weights around a mode, extended each way while within LOG_CUT of the mode's weight and
 * inside [min, max]. `step(v)` is logWeight(v + 1) − logWeight(v), so the weights are built by
 * adding small differences (no cancellation of large logarithms).
 */
export function windowAround(mode: number, min: number, max: number, step: (v: number) => number): { lo: number; logWeights: Float64Array } {
  const up: number[] = [];
  for (let v = mode, w = 0; v < max; v++) {
    w += step(v);
    if (w < -LOG_CUT) break;
    up.push(w);
  }
  const down: number[] = [];
  for (let v = mode, w = 0; v > min; v--) {
    w -= step(v - 1);
    if (w < -LOG_CUT) break;
    down.push(w);
  }
  const logWeights = new Float64Array(down.length + 1 + up.length);
  for (let i = 0; i < down.length; i++) logWeights[down.length - 1 - i] = down[i];
  logWeights.set(up, down.length + 1);
  return { lo: mode - down.length, logWeights };
}
