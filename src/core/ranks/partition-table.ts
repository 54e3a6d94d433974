import { sizeCount } from '../partitions/constrained/spec.js';
import { layersOf, prefixSums, rowEnd, rowStart, sizeAt, type PartitionShape } from './partition-shape.js';

/**
 * The exact counting table a partition family is ranked with, in BigInt:
 *   T(j, l, m) = number of partitions of m with parts among the j smallest allowed sizes
 *                b_1 < ... < b_j, and (with a length rule) exactly / at most l parts,
 *   T(j, l, m) = T(j - 1, l, m) + T(j, l - 1, m - b_j)       (any multiplicities),
 *   T(j, l, m) = T(j - 1, l, m) + T(j - 1, l - 1, m - b_j)   (distinct parts),
 * with T(0, l, m) = [m = 0] (and l = 0 for "exactly"): either no part b_j, or take one b_j —
 * the coefficient recurrences of prod 1/(1 - y q^b) and prod (1 + y q^b) (Andrews, The Theory of
 * Partitions 1976, ch. 1). Without a length rule the l index is dropped.
 *
 * Read largest size first, the table counts the members that come before a given one in
 * reverse lexicographic order: after a prefix, with sizes b_1..b_j still usable and m left, the
 * members continuing with a part b_j come first, T(j or j - 1, l - 1, m - b_j) of them, then
 * those continuing with smaller parts, T(j - 1, l, m).
 *
 * Memory: row (j, l) keeps only the remainders where a walk can meet a count other than 0 (see
 * rowStart, rowEnd): from m = b_j (below it the row equals a lower one; with "exactly", from the
 * least sum of the parts due) to n - (parts placed) * b_j, plus the start column m = n apart —
 * for unrestricted partitions j <= m <= n - j, a quarter of the square. Counts outside are never
 * asked for (0 is returned). `partitionTableSize` estimates the size beforehand.
 */
export class PartitionRankTable {
  /** Number of allowed sizes r. */
  readonly r: number;
  /** The length state at the start: k or K parts to go (0 without a length rule). */
  readonly firstState: number;
  /** What one part takes off the length state: 1 with a length rule, 0 without. */
  readonly step: number;
  readonly distinct: boolean;
  readonly n: number;
  private readonly sizes: Int32Array;
  private readonly rows: bigint[][];
  /** The remainder m of each row's first count. */
  private readonly rowFirst: Int32Array;
  /** T(j, firstState, n) for j = 0..r: the start column. */
  private readonly start: bigint[];
  private readonly layers: number;
  private readonly exactly: boolean;
  /** Smallest size when the sizes are an interval (then "sizes <= m" is arithmetic), else -1. */
  private readonly intervalLo: number;

  constructor(shape: PartitionShape) {
    const r = sizeCount(shape.sizes);
    this.r = r;
    this.n = shape.n;
    this.distinct = shape.distinct;
    this.layers = layersOf(shape);
    this.exactly = shape.rule === 'exactly';
    this.step = shape.rule === 'any' ? 0 : 1;
    this.firstState = shape.rule === 'any' ? 0 : shape.parts;
    this.intervalLo = shape.sizes.kind === 'interval' ? shape.sizes.lo : -1;
    const sizes = new Int32Array(r);
    for (let j = 1; j <= r; j++) sizes[j - 1] = sizeAt(shape.sizes, j);
    const prefix = prefixSums(shape.sizes);
    this.sizes = sizes;
    this.rows = new Array<bigint[]>(r * this.layers);
    this.rowFirst = new Int32Array(r * this.layers);
    this.start = [this.base(this.firstState, this.n)];
    const firstLayer = shape.rule === 'any' ? 0 : 1;
    for (let j = 1; j <= r; j++) {
      const b = sizes[j - 1];
      const take = this.distinct ? j - 1 : j;
      for (let l = 0; l < this.layers; l++) {
        const first = rowStart(shape, j, l, prefix);
        const length = l >= firstLayer ? Math.max(0, rowEnd(shape, j, l, prefix) - first + 1) : 0;
        const row = new Array<bigint>(length);
        this.rows[(j - 1) * this.layers + l] = row;
        this.rowFirst[(j - 1) * this.layers + l] = length > 0 ? first : b;
        const lower = l - this.step;
        for (let k = 0; k < length; k++) row[k] = this.at(j - 1, l, first + k) + this.at(take, lower, first + k - b);
      }
      this.start.push(this.start[j - 1] + this.at(take, this.firstState - this.step, this.n - b));
    }
  }

  /** The j-th smallest size (1-based). */
  size(j: number): number {
    return this.sizes[j - 1];
  }

  /** Number of allowed sizes <= m (the index of the largest of them). */
  below(m: number): number {
    if (this.intervalLo >= 0) return Math.max(0, Math.min(this.r, m - this.intervalLo + 1));
    const sizes = this.sizes;
    let lo = 0;
    let hi = sizes.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (sizes[mid] <= m) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }

  /** T(j, l, m): members completing a remainder m with sizes b_1..b_j and length state l. */
  at(j: number, l: number, m: number): bigint {
    if (m < 0 || l < 0) return 0n;
    if (j > 0 && this.sizes[j - 1] > m) j = this.below(m);
    if (m === this.n && l === this.firstState) return this.start[j];
    if (j === 0) return this.base(l, m);
    const at = (j - 1) * this.layers + l;
    const row = this.rows[at];
    const k = m - this.rowFirst[at];
    return k >= 0 && k < row.length ? row[k] : 0n;
  }

  /** T(0, l, m): only the empty partition of 0, and with "exactly" only when no part is due. */
  private base(l: number, m: number): bigint {
    return m === 0 && (!this.exactly || l === 0) ? 1n : 0n;
  }

  /** Members of the whole family. */
  get count(): bigint {
    return this.at(this.r, this.firstState, this.n);
  }
}
