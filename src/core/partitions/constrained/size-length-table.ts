import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import { countsToPartition } from './size-table.js';

/**
 * The general counting table over (sizes used, parts used, remaining size):
 * T[j][l][m] = number of partitions of m into exactly l parts, all among b_1 < ... < b_j,
 *   T[j][l][m] = T[j-1][l][m] + T[j][l-1][m - b_j]     (any multiplicities),
 *   T[j][l][m] = T[j-1][l][m] + T[j-1][l-1][m - b_j]   (distinct parts),
 * the coefficients of prod 1/(1 - y q^b) and prod (1 + y q^b) (Andrews 1976, ch. 1). It serves
 * every combination (allowed sizes or bounds together with length or maxLength); its size
 * (r + 1)(L + 1)(n + 1) cells makes it the method of last resort. Doubles, additions only.
 * Method "table-sizes-lengths/1".
 */
export class SizeLengthTable {
  private readonly cells: Float64Array;
  private readonly width: number;
  private readonly lengths: number[] = [];
  private readonly weights: number[] = [];
  readonly total: number;

  constructor(
    readonly sizes: readonly number[],
    readonly n: number,
    readonly distinct: boolean,
    readonly minLength: number,
    readonly maxLength: number,
  ) {
    const width = n + 1;
    const L = maxLength;
    this.width = width;
    const r = sizes.length;
    const cells = new Float64Array((r + 1) * (L + 1) * width);
    cells[0] = 1;
    const index = (j: number, l: number) => (j * (L + 1) + l) * width;
    for (let j = 1; j <= r; j++) {
      const b = sizes[j - 1];
      for (let l = 0; l <= L; l++) {
        const row = index(j, l);
        const prev = index(j - 1, l);
        const take = l > 0 ? index(this.distinct ? j - 1 : j, l - 1) : -1;
        for (let m = 0; m < width; m++) {
          cells[row + m] = cells[prev + m] + (take >= 0 && m >= b ? cells[take + m - b] : 0);
        }
      }
    }
    this.cells = cells;
    let total = 0;
    for (let l = minLength; l <= L; l++) {
      const w = cells[index(r, l) + n];
      if (w > 0) {
        this.lengths.push(l);
        this.weights.push(w);
        total += w;
      }
    }
    if (!Number.isFinite(total)) throw new RangeError('counting table overflowed double range');
    this.total = total;
  }

  static cells(sizeCount: number, n: number, maxLength: number): number {
    return (sizeCount + 1) * (maxLength + 1) * (n + 1);
  }

  /** Sequential choice (Nijenhuis & Wilf 1978, ch. 10): the length first, then part by part. */
  sample(source: RandomSource): Partition {
    let u = source.nextDouble() * this.total;
    let idx = 0;
    while (idx < this.lengths.length - 1 && u >= this.weights[idx]) u -= this.weights[idx++];
    let l = this.lengths[idx];
    const L1 = this.maxLength + 1;
    const w = this.width;
    const cells = this.cells;
    const counts = new Map<number, number>();
    let j = this.sizes.length;
    let m = this.n;
    while (m > 0) {
      const b = this.sizes[j - 1];
      const here = cells[(j * L1 + l) * w + m];
      if (m >= b && l > 0) {
        const take = cells[((this.distinct ? j - 1 : j) * L1 + l - 1) * w + m - b];
        if (source.nextDouble() * here < take) {
          counts.set(b, (counts.get(b) ?? 0) + 1);
          m -= b;
          l--;
          if (this.distinct) j--;
          continue;
        }
      }
      j--;
    }
    return countsToPartition(counts);
  }
}
