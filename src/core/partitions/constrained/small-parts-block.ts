import { nextBelow, nextOpenDouble, type RandomSource } from '../../random.js';
import { PairSolutions } from './multiset-boltzmann.js';

/**
 * The sizes 1..j of a Boltzmann proposal at x = e^t, determined together at the end: the weights
 * r(m) = p_j(m) x^m, p_j(m) the number of partitions of m into parts <= j, and a uniform such
 * partition of a given m (conjugate-mixture.ts uses it as its deterministic last step).
 *
 * r is tabulated for m <= M (M = the block's Boltzmann mean + 12 standard deviations + j) by the
 * recurrence p_i(m) = p_(i-1)(m) + p_i(m - i) (Andrews 1976, §1.2), scaled by x^m, in place:
 * j passes over M + 1 doubles. Beyond M, `accepts` first compares with the bound
 * r(m) <= prod_(i<=j) 1/(1 - y^i) (x/y)^m for y = x^c, 0 < c < 1 (the generating function at y
 * bounds each coefficient), which rejects all but a tiny share of such m; for the rest r(m) is
 * recomputed by the same recurrence with rows kept only for their last i values (O(j^2) memory,
 * O(j m) time), the same floating-point operations in the same order.
 *
 * A partition of m into parts <= j is drawn by Boltzmann proposals at x over the sizes 3..j with
 * the sizes 1 and 2 determined (multiset-boltzmann.ts): accepted with probability
 * Q(m') x^m' / U2, Q(m') = floor(m'/2) + 1 the solutions of Z_1 + 2 Z_2 = m', so each partition
 * of m ends with probability proportional to x^m: uniform.
 */
/** The shares c of the tilt at which the generating function bounds r(m) beyond the table. */
const BOUND_SHARES = [0.9, 0.75, 0.5, 0.3];

export class SmallPartsBlock {
  /** r(0..M). */
  readonly table: Float64Array;
  /** max over m >= 0 of r(m) (the table's maximum: the mode is within it). */
  readonly bound: number;
  readonly limit: number;
  private readonly pair = new PairSolutions(1, 2);
  /** ln max over real m of (m/2 + 1) x^m. */
  private readonly logPairBound: number;
  /** For each c of BOUND_SHARES: -sum_(i<=j) ln(1 - x^(c i)). */
  private readonly logShares: number[];

  constructor(
    readonly j: number,
    readonly t: number,
  ) {
    if (!(Number.isInteger(j) && j >= 3 && t < 0)) throw new RangeError('small-parts block needs j >= 3 and t < 0');
    this.limit = SmallPartsBlock.limitFor(j, t);
    const a = new Float64Array(this.limit + 1);
    // x^m: an exponential every 64 values, products between (relative error <= 64 roundings;
    // the exponentials alone took as long as the j passes).
    const x = Math.exp(t);
    for (let m = 0; m <= this.limit; m++) a[m] = (m & 63) === 0 ? Math.exp(t * m) : a[m - 1] * x;
    for (let i = 2; i <= j; i++) {
      const xi = Math.exp(t * i);
      for (let m = i; m <= this.limit; m++) a[m] += xi * a[m - i];
    }
    this.table = a;
    let bound = 0;
    for (let m = 0; m <= this.limit; m++) if (a[m] > bound) bound = a[m];
    this.bound = bound;
    this.logShares = BOUND_SHARES.map((c) => {
      let sum = 0;
      for (let i = 1; i <= j; i++) sum -= Math.log(-Math.expm1(c * t * i));
      return sum;
    });
    const peak = -1 / t - 2;
    this.logPairBound = peak > 0 ? Math.log(-1 / (t * 2)) + t * peak : 0;
  }

  /** M for block size j at tilt t: mean + 12 sd of sum_(i<=j) i Z_i under the Boltzmann law, plus j. */
  static limitFor(j: number, t: number): number {
    let mean = 0;
    let variance = 0;
    for (let i = 1; i <= j; i++) {
      const g = Math.exp(t * i) / -Math.expm1(t * i);
      mean += i * g;
      variance += i * i * g * (1 + g);
    }
    return Math.ceil(mean + 12 * Math.sqrt(variance)) + j;
  }

  /** Whether u * bound < r(m), u in [0, 1): the block's acceptance test. */
  accepts(u: number, m: number): boolean {
    if (m < 0) return false;
    if (m <= this.limit) return u * this.bound < this.table[m];
    const level = Math.log(u * this.bound);
    // r(m) <= e^(logShares[s] + (1 - c) t m): below the level, certainly rejected.
    for (let s = 0; s < BOUND_SHARES.length; s++) if (this.logShares[s] + (1 - BOUND_SHARES[s]) * this.t * m <= level) return false;
    return u * this.bound < this.weight(m);
  }

  /** r(m) = p_j(m) x^m (0 for m < 0). */
  weight(m: number): number {
    if (m < 0) return 0;
    if (m <= this.limit) return this.table[m];
    const value = this.rolling(m);
    if (value > this.bound) throw new Error('small-parts block: weight above its bound beyond the table');
    return value;
  }

  /** r(m) by the recurrence with rows kept for their last i values. */
  private rolling(m: number): number {
    const { j, t } = this;
    const rows = Array.from({ length: j + 1 }, (_, i) => new Float64Array(Math.max(1, i)));
    const powers = Array.from({ length: j + 1 }, (_, i) => Math.exp(t * i));
    let v = 0;
    for (let s = 0; s <= m; s++) {
      v = Math.exp(t * s);
      for (let i = 2; i <= j; i++) {
        const row = rows[i];
        const slot = s % i;
        if (s >= i) v += powers[i] * row[slot];
        row[slot] = v;
      }
      // Once every kept value has underflowed to 0, so has every later one (checked now and then).
      if ((s & 4095) === 4095 && Math.exp(t * s) === 0 && rows.every((row) => row.every((w) => w === 0))) return 0;
    }
    return v;
  }

  /**
   * A uniform partition of m >= 0 into parts <= j: z[i] (i = 1..j) is set to the multiplicity of
   * i. Returns the number of parts.
   */
  fill(source: RandomSource, m: number, z: Float64Array): number {
    const { j, t } = this;
    for (;;) {
      let total = 0;
      let parts = 0;
      for (let i = 3; i <= j; i++) {
        const v = Math.floor(Math.log(nextOpenDouble(source)) / (i * t));
        z[i] = v;
        total += i * v;
        parts += v;
        if (total > m) break;
      }
      if (total > m) continue;
      const rest = m - total;
      const solutions = this.pair.count(rest);
      if (!(source.nextDouble() < Math.exp(Math.log(solutions) + t * rest - this.logPairBound))) continue;
      const two = this.pair.nth(rest, solutions === 1 ? 0 : nextBelow(source, solutions));
      z[2] = two;
      z[1] = rest - 2 * two;
      return parts + z[1] + z[2];
    }
  }
}
