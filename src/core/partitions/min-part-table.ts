import type { RandomSource } from '../random.js';

/**
 * Counts c(k, m) of partitions of m into parts in [k, maxPart], for 0 <= m <= maxN and
 * 1 <= k <= maxN + 1, by
 *   c(k, m) = c(k + 1, m) + c(k, m − k)      (no part k, or remove one part k),
 * c(k, m) = [m = 0] for k > maxPart (maxPart = maxN, the default: parts >= k and nothing else). Only additions of positive numbers (relative error <= ~m roundings).
 * Drawing a uniform partition of m into parts >= b walks k = b, b + 1, ...: at (k, m) it takes a
 * part k with probability c(k, m − k)/c(k, m), else moves to k + 1 (Nijenhuis & Wilf 1978, ch. 10,
 * in the "smallest part" form). Every partition is reached by exactly one walk, with probability
 * the product of the ratios, which telescopes to 1/c(b, m).
 */
export class MinPartTable {
  private readonly values: Float64Array;
  private readonly width: number;

  constructor(
    readonly maxN: number,
    readonly maxPart: number = maxN,
  ) {
    if (!Number.isInteger(maxN) || maxN < 0 || maxN > 2000) throw new RangeError(`maxN must be an integer in [0, 2000], got ${maxN}`);
    if (!Number.isInteger(maxPart) || maxPart < 0) throw new RangeError(`maxPart must be a non-negative integer, got ${maxPart}`);
    this.width = maxN + 1;
    this.values = new Float64Array((maxN + 2) * this.width);
    this.values[(maxN + 1) * this.width] = 1; // c(maxN + 1, 0)
    for (let k = maxN; k >= 1; k--) {
      const row = k * this.width;
      const next = (k + 1) * this.width;
      if (k > maxPart) this.values[row] = 1; // only the empty partition
      else for (let m = 0; m <= maxN; m++) this.values[row + m] = this.values[next + m] + (m >= k ? this.values[row + m - k] : 0);
    }
  }

  /** Cells held (setup work). */
  get size(): number {
    return this.values.length;
  }

  /** c(k, m); k > maxN is clamped (only the empty partition, or none). */
  count(k: number, m: number): number {
    return this.values[Math.min(k, this.maxN + 1) * this.width + m];
  }

  /**
   * Appends a uniform partition of m into parts in [b, maxPart], each size times `scale`, to sizes /
   * multiplicities in ASCENDING size order; returns the steps taken. The family must be non-empty.
   */
  sample(source: RandomSource, m: number, b: number, scale: number, sizes: number[], multiplicities: number[]): number {
    if (!(m <= this.maxN)) throw new RangeError(`the min-part table covers m <= ${this.maxN}, got ${m}`);
    let k = Math.min(b, this.maxN + 1);
    let steps = 0;
    let mult = 0;
    while (m > 0) {
      steps++;
      const total = this.count(k, m);
      const take = m >= k ? this.count(k, m - k) : 0;
      if (source.nextDouble() * total < take) {
        mult++;
        m -= k;
      } else {
        if (mult > 0) {
          sizes.push(k * scale);
          multiplicities.push(mult);
          mult = 0;
        }
        k++;
      }
    }
    if (mult > 0) {
      sizes.push(k * scale);
      multiplicities.push(mult);
    }
    return steps;
  }
}
