import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import { countsToPartition } from './size-table.js';

/**
 * Table of P(m, k), the number of partitions of m into exactly k parts (no bound on the parts):
 *   P(m, k) = P(m - 1, k - 1) + P(m - k, k)
 * (smallest part 1, or subtract 1 from every part; OEIS A008284, Andrews 1976 §6.1). With it:
 * - exactly k parts, all >= lo:   P(n - k(lo - 1), k)                (subtract lo - 1 from each part);
 * - exactly k distinct parts >= lo: P(n - k(k - 1)/2 - k(lo - 1), k) (subtract the staircase too);
 * - at most K parts, or no length bound: sum over k.
 * Doubles, additions of positives only (relative error below about (k + m) * 2^-53).
 */
export class LengthTable {
  private readonly cells: Float64Array;
  readonly width: number;

  constructor(
    readonly maxParts: number,
    readonly maxSize: number,
  ) {
    const width = maxSize + 1;
    this.width = width;
    const cells = new Float64Array((maxParts + 1) * width);
    cells[0] = 1;
    for (let k = 1; k <= maxParts; k++) {
      const row = k * width;
      const prev = row - width;
      for (let m = k; m < width; m++) cells[row + m] = cells[prev + m - 1] + cells[row + m - k];
    }
    this.cells = cells;
  }

  /** P(m, k); 0 outside the table's range of m >= 0. */
  at(k: number, m: number): number {
    if (m < 0 || k < 0 || k > this.maxParts || m > this.maxSize) return 0;
    return this.cells[k * this.width + m];
  }

  /**
   * A uniform partition of m into exactly k parts (P(m, k) > 0), by sequential choice on the
   * recurrence (Nijenhuis & Wilf 1978, ch. 10): either emit a part equal to 1 + (number of
   * subtractions so far) or subtract 1 from all k remaining parts. O(k + largest part) steps.
   * Parts are written into counts with `offset` added.
   */
  sampleInto(source: RandomSource, m: number, k: number, offset: number, counts: Map<number, number>): void {
    const w = this.width;
    const cells = this.cells;
    let lifted = 0;
    while (k > 0) {
      const here = cells[k * w + m];
      const one = m >= 1 ? cells[(k - 1) * w + m - 1] : 0;
      if (source.nextDouble() * here < one) {
        const part = lifted + 1 + offset;
        counts.set(part, (counts.get(part) ?? 0) + 1);
        k--;
        m--;
      } else {
        lifted++;
        m -= k;
      }
    }
  }
}

/**
 * Families over sizes [lo, n] (no upper bound below n, no allowed list) with distinct parts
 * and/or a length constraint, sampled by choosing the number of parts k with probability
 * proportional to its count, then the partition. Method "table-lengths/1".
 */
export class LengthFamilyTable {
  readonly table: LengthTable;
  /** Candidate numbers of parts and their counts (doubles). */
  private readonly ks: number[] = [];
  private readonly weights: number[] = [];
  readonly total: number;

  constructor(
    readonly n: number,
    readonly lo: number,
    readonly distinct: boolean,
    kMin: number,
    kMax: number,
  ) {
    const reduced = (k: number) => n - k * (lo - 1) - (distinct ? (k * (k - 1)) / 2 : 0);
    while (kMax > kMin && reduced(kMax) < kMax) kMax--; // k parts need reduced size >= k
    const maxSize = Math.max(0, reduced(Math.max(kMin, 0)));
    this.table = new LengthTable(Math.max(kMax, 0), Math.min(n, maxSize));
    let total = 0;
    for (let k = kMin; k <= kMax; k++) {
      const w = this.table.at(k, reduced(k));
      if (w > 0) {
        this.ks.push(k);
        this.weights.push(w);
        total += w;
      }
    }
    if (!Number.isFinite(total)) throw new RangeError('counting table overflowed double range');
    this.total = total;
  }

  /** Cells a table for these parameters would use (for planning, without building it). */
  static cells(n: number, lo: number, distinct: boolean, kMin: number, kMax: number): number {
    const reduced = (k: number) => n - k * (lo - 1) - (distinct ? (k * (k - 1)) / 2 : 0);
    while (kMax > kMin && reduced(kMax) < kMax) kMax--;
    return (Math.max(kMax, 0) + 1) * (Math.max(0, reduced(Math.max(kMin, 0))) + 1);
  }

  sample(source: RandomSource): Partition {
    let u = source.nextDouble() * this.total;
    let idx = 0;
    while (idx < this.ks.length - 1 && u >= this.weights[idx]) u -= this.weights[idx++];
    const k = this.ks[idx];
    const counts = new Map<number, number>();
    const m = this.n - k * (this.lo - 1) - (this.distinct ? (k * (k - 1)) / 2 : 0);
    this.table.sampleInto(source, m, k, this.lo - 1, counts);
    if (!this.distinct) return countsToPartition(counts);
    // Add the staircase k-1, ..., 0 to the parts sorted largest first (Andrews 1976, §1.3).
    const parts: number[] = [];
    for (const [size, mult] of counts) for (let i = 0; i < mult; i++) parts.push(size);
    parts.sort((a, b) => b - a);
    const sizes = parts.map((p, i) => p + (k - 1 - i));
    return { sizes, multiplicities: sizes.map(() => 1) };
  }
}
