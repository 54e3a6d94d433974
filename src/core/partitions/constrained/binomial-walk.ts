import { designTermMean, designTermVariance } from './subset-design.js';

/**
 * The Gaussian binomial [N choose j]_x at a fixed x = e^(-s), s >= 0, walked a unit step at a
 * time in N and j: its logarithm and the mean and variance of the size law it generates (the
 * x-tilted law of partitions in a j x (N - j) box). Each step multiplies by one factor
 * (1 - x^A) / (1 - x^B), from the product [N choose j]_x = prod_(i=1..j) (1 - x^(N-j+i)) / (1 - x^i)
 * (Andrews, "The Theory of Partitions", 1976, (3.3.1)):
 *   [N+1 choose j+1] = [N choose j] (1 - x^(N+1)) / (1 - x^(j+1)),
 *   [N choose j+1]   = [N choose j] (1 - x^(N-j)) / (1 - x^(j+1)),
 *   [N+1 choose j]   = [N choose j] (1 - x^(N+1)) / (1 - x^(N+1-j)),
 * and their inverses. A factor adds ln(1 - x^A) - ln(1 - x^B) to the logarithm (the very terms,
 * in the same order, that logGaussianBinomial sums when only the diagonal step is taken) and,
 * the size being a signed sum of independent geometric laws, adds its cumulants:
 * mean (A - B)/2 + (c1(B s) - c1(A s)) / s and variance (e2(A s) - e2(B s)) / s^2
 * (subset-design.ts; at s = 0, (A - B)/2 and (A^2 - B^2)/12).
 *
 * box-mixture.ts walks the boxes of consecutive numbers of parts with it: O(1) per box instead
 * of a sum over the box's rows.
 */
export class BinomialWalk {
  /** Factors applied so far (setup accounting). */
  steps = 0;

  constructor(
    readonly s: number,
    public N: number,
    public j: number,
    /** ln [N choose j]_x (exact start: logGaussianBinomial), or NaN when not tracked. */
    public log: number,
    /** Mean and variance of the size law (a start that may be approximate: they only steer). */
    public mean: number,
    public variance: number,
  ) {}

  /** Multiplies (sign 1) or divides (sign -1) by (1 - x^A) / (1 - x^B), A, B >= 1. */
  private factor(A: number, B: number, sign: 1 | -1): void {
    const s = this.s;
    this.steps++;
    if (s === 0) {
      this.log += sign * (Math.log(A) - Math.log(B));
      this.mean += (sign * (A - B)) / 2;
      this.variance += (sign * (A * A - B * B)) / 12;
      return;
    }
    if (sign === 1) {
      this.log += Math.log(-Math.expm1(-s * A));
      this.log -= Math.log(-Math.expm1(-s * B));
    } else {
      this.log -= Math.log(-Math.expm1(-s * A));
      this.log += Math.log(-Math.expm1(-s * B));
    }
    this.mean += sign * ((A - B) / 2 + (designTermMean(B * s) - designTermMean(A * s)) / s);
    this.variance += (sign * (designTermVariance(A * s) - designTermVariance(B * s))) / (s * s);
  }

  /**
   * Moves to (N2, j2), 0 <= j2 <= N2, by unit steps (diagonal first); returns false, without
   * moving, when that takes more than maxSteps steps.
   */
  moveTo(N2: number, j2: number, maxSteps: number): boolean {
    if (!(j2 >= 0 && j2 <= N2)) throw new RangeError(`no Gaussian binomial [${N2} choose ${j2}]`);
    const diagonal = Math.sign(N2 - this.N) === Math.sign(j2 - this.j) ? Math.min(Math.abs(N2 - this.N), Math.abs(j2 - this.j)) : 0;
    if (Math.abs(N2 - this.N) + Math.abs(j2 - this.j) - diagonal > maxSteps) return false;
    while (this.N < N2 && this.j < j2) {
      this.factor(this.N + 1, this.j + 1, 1);
      this.N++;
      this.j++;
    }
    while (this.N > N2 && this.j > j2) {
      this.factor(this.N, this.j, -1);
      this.N--;
      this.j--;
    }
    while (this.j < j2) {
      this.factor(this.N - this.j, this.j + 1, 1);
      this.j++;
    }
    while (this.j > j2) {
      this.factor(this.N - this.j + 1, this.j, -1);
      this.j--;
    }
    while (this.N < N2) {
      this.factor(this.N + 1, this.N + 1 - this.j, 1);
      this.N++;
    }
    while (this.N > N2) {
      this.factor(this.N, this.N - this.j, -1);
      this.N--;
    }
    return true;
  }
}
