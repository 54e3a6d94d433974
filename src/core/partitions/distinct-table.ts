import { nextBelow, type RandomSource } from '../random.js';

/**
 * Uniform partitions of m <= maxN into distinct parts by unranking (Nijenhuis & Wilf 1978,
 * ch. 10, for the count table): T[k][m] = number of partitions of m into distinct parts <= k,
 *   T[k][m] = T[k − 1][m] + T[k − 1][m − k],   T[0][0] = 1.
 * Every entry is at most q(maxN) < 2^53 for maxN <= MAX_N (q(566) < 2^53 < q(567), OEIS
 * A000009), so the table is exact in doubles, and one uniform integer rank in [0, q(m)) unranked
 * by the recurrence gives an exactly uniform partition (those containing the part k first).
 * Filled lazily on first use; (maxN + 1)² cells.
 *
 * With a smallest part lo > 1 the same table counts partitions into distinct parts in [lo, k]
 * (rows k < lo hold only T[k][0] = 1), so the walk stops at lo (distinct parts >= lo).
 */
export class DistinctPartitionTable {
  /** Largest maxN with every count below 2^53. */
  static readonly MAX_N = 566;
  private cells: Float64Array | null = null;

  constructor(
    readonly maxN: number,
    readonly lo = 1,
  ) {
    if (!Number.isInteger(lo) || lo < 1) throw new RangeError(`smallest part must be an integer >= 1, got ${lo}`);
    if (!Number.isInteger(maxN) || maxN < 0 || maxN > DistinctPartitionTable.MAX_N) {
      throw new RangeError(`distinct table size must be an integer in [0, ${DistinctPartitionTable.MAX_N}], got ${maxN}`);
    }
  }

  /** Cells of the table (its setup work). */
  get size(): number {
    return (this.maxN + 1) * (this.maxN + 1);
  }

  /** Number of partitions of m into distinct parts in [lo, k] (k, m <= maxN). */
  count(k: number, m: number): number {
    return this.table()[k * (this.maxN + 1) + m];
  }

  /**
   * A uniform partition of m into distinct parts >= lo (the caller guarantees one exists): its parts, descending, each multiplied by
   * `scale`, are appended to `out`. With hi, only parts <= hi (the caller guarantees one exists).
   * Returns the number of steps taken (for work counters).
   */
  sample(source: RandomSource, m: number, scale: number, out: number[], hi = Infinity): number {
    if (!Number.isInteger(m) || m < 0 || m > this.maxN) throw new RangeError(`m must be in [0, ${this.maxN}], got ${m}`);
    const t = this.table();
    const w = this.maxN + 1;
    let k = Math.min(m, hi);
    let rank = nextBelow(source, t[k * w + m]);
    let rest = m;
    let steps = 0;
    while (rest > 0) {
      steps++;
      // Partitions of rest into distinct parts <= k that contain k: T[k − 1][rest − k].
      const withK = k <= rest ? t[(k - 1) * w + rest - k] : 0;
      if (rank < withK) {
        out.push(k * scale);
        rest -= k;
      } else rank -= withK;
      k--;
    }
    return steps;
  }

  private table(): Float64Array {
    if (this.cells === null) {
      const w = this.maxN + 1;
      const t = new Float64Array(w * w);
      t[0] = 1;
      for (let k = 1; k <= this.maxN; k++) {
        if (k < this.lo) {
          t[k * w] = 1;
          continue;
        }
        for (let m = 0; m <= this.maxN; m++) t[k * w + m] = t[(k - 1) * w + m] + (m >= k ? t[(k - 1) * w + m - k] : 0);
      }
      this.cells = t;
    }
    return this.cells;
  }
}
