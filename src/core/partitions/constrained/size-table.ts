import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';

/**
 * Counting table over (number of allowed sizes used, remaining size) for a product-form family:
 * T[j][m] = number of partitions of m with parts among the j smallest allowed sizes b_1 < ... < b_j,
 *   T[j][m] = T[j-1][m] + T[j][m - b_j]        (any multiplicities),
 *   T[j][m] = T[j-1][m] + T[j-1][m - b_j]      (distinct parts),
 * the coefficient recurrences of prod 1/(1 - q^b) and prod (1 + q^b) (Andrews 1976, ch. 1).
 * Entries are doubles: only additions of positive numbers, so the relative error stays below
 * about (r + n) * 2^-53 (Higham 2002, §4.2). Cells (r + 1) * (n + 1); the caller bounds them.
 */
export class SizeTable {
  readonly width: number;
  private readonly cells: Float64Array;

  constructor(
    readonly sizes: readonly number[],
    readonly n: number,
    readonly distinct: boolean,
  ) {
    const width = n + 1;
    this.width = width;
    const r = sizes.length;
    const cells = new Float64Array((r + 1) * width);
    cells[0] = 1;
    for (let j = 1; j <= r; j++) {
      const b = sizes[j - 1];
      const row = j * width;
      const prev = row - width;
      const source = distinct ? prev : row; // row the part b_j is removed from
      for (let m = 0; m < width; m++) {
        cells[row + m] = cells[prev + m] + (m >= b ? cells[source + m - b] : 0);
      }
    }
    if (!Number.isFinite(cells[r * width + n])) {
      throw new RangeError('counting table overflowed double range');
    }
    this.cells = cells;
  }

  /** T[j][m]. */
  at(j: number, m: number): number {
    return this.cells[j * this.width + m];
  }

  /** Number of partitions of n in the family (as a double). */
  get total(): number {
    return this.at(this.sizes.length, this.n);
  }

  /**
   * A uniform member, by sequential choice down the table (Nijenhuis & Wilf 1978, ch. 10): at
   * (j, m) take a part b_j with probability T[j or j-1][m - b_j] / T[j][m], else drop to j - 1.
   * O(r + number of parts) steps. Returns a multiplicity map by size.
   */
  sampleCounts(source: RandomSource, m: number = this.n): Map<number, number> {
    const counts = new Map<number, number>();
    const w = this.width;
    const cells = this.cells;
    let j = this.sizes.length;
    while (m > 0) {
      const b = this.sizes[j - 1];
      const here = cells[j * w + m];
      if (m >= b) {
        const take = cells[(this.distinct ? j - 1 : j) * w + m - b];
        if (source.nextDouble() * here < take) {
          counts.set(b, (counts.get(b) ?? 0) + 1);
          m -= b;
          if (this.distinct) j--;
          continue;
        }
      }
      j--;
    }
    return counts;
  }
}

/** Multiplicity form of a count map (largest first). */
export function countsToPartition(counts: Map<number, number>): Partition {
  const sizes = [...counts.keys()].filter((s) => counts.get(s)! > 0).sort((a, b) => b - a);
  return { sizes, multiplicities: sizes.map((s) => counts.get(s)!) };
}
