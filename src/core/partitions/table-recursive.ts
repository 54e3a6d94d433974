import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';

/**
 * Counts p(m, ≤k) of partitions of m into parts of size at most k, for 0 <= k <= m <= maxN, by
 *   p(m, ≤k) = p(m, ≤k−1) + p(m − k, ≤k)      (A&S 24.2.2; OEIS A026820 for the triangle)
 * (a partition of m into parts ≤ k either has no part k, or remove one part k). Only additions of
 * positive numbers, so the doubles carry a relative error of at most ~m rounding steps — unlike the
 * pentagonal recurrence, which cancels. Row m stores k = 0..m; p(m, ≤k) = p(m, ≤m) for k > m.
 * Filled lazily up to the largest m asked for; memory (maxN+1)(maxN+2)/2 doubles.
 */
export class RestrictedPartitionTable {
  /** Largest m the table will be built for (500,500 doubles: 4 MB). */
  static readonly MAX_N = 1000;

  private values = new Float64Array(1).fill(1); // row 0: p(0, ≤0) = 1
  private rows = 1;

  /** p(m, ≤k) as a double; k may exceed m. */
  get(m: number, k: number): number {
    this.ensure(m);
    return this.values[rowStart(m) + Math.min(k, m)];
  }

  /** Makes rows 0..m available. */
  ensure(m: number): void {
    if (m < this.rows) return;
    if (!Number.isInteger(m) || m < 0 || m > RestrictedPartitionTable.MAX_N) {
      throw new RangeError(`the restricted partition table covers m <= ${RestrictedPartitionTable.MAX_N}, got ${m}`);
    }
    const values = new Float64Array(rowStart(m + 1));
    values.set(this.values);
    for (let r = this.rows; r <= m; r++) {
      const base = rowStart(r);
      values[base] = 0; // p(r, ≤0) = 0 for r >= 1
      for (let k = 1; k <= r; k++) {
        const rest = r - k;
        values[base + k] = values[base + k - 1] + values[rowStart(rest) + Math.min(k, rest)];
      }
    }
    this.values = values;
    this.rows = m + 1;
  }

  /** The raw triangle and row layout, for the sampler's inner loop (rows 0..m must be ensured). */
  triangle(): Float64Array {
    return this.values;
  }
}

/** Offset of row m in the triangle: rows 0..m−1 hold 1 + 2 + ... + m entries. */
export function rowStart(m: number): number {
  return (m * (m + 1)) / 2;
}

/**
 * Draws a uniform partition of m into parts <= k, pushing (size, multiplicity) pairs in
 * DESCENDING size order into the given arrays, one distinct part size at a time
 * (Nijenhuis & Wilf 1978, ch. 10, in the "largest part" form, with the multiplicity of each
 * size drawn at once):
 *  - the largest part j has P(largest = j) = p(m − j, ≤j) / p(m, ≤k) = (p(m, ≤j) − p(m, ≤j−1)) / p(m, ≤k),
 *    so one uniform U and a binary search for the least j with p(m, ≤j) > U·p(m, ≤k) picks it;
 *  - given the largest part j, it occurs c >= 1 times with P(c) = p(m − cj, ≤j−1) / p(m − j, ≤j)
 *    (the other parts are < j; summed over c these count the partitions of m − j into parts ≤ j),
 *    found by one more uniform and a scan over c = 1, 2, ...;
 *  - the rest is a uniform partition of m − cj into parts <= j − 1.
 * Once only parts of size 1 remain, they are all 1s. Two uniforms per distinct size instead of
 * one per part of size >= 2: at m = 1000 about 47 draws instead of about 70, 2.0 instead of 2.9 µs.
 */
export function sampleRestricted(
  table: RestrictedPartitionTable,
  source: RandomSource,
  m: number,
  k: number,
  sizes: number[],
  multiplicities: number[],
): void {
  table.ensure(m);
  const t = table.triangle();
  while (m > 0) {
    if (k > m) k = m;
    if (k === 1) {
      sizes.push(1);
      multiplicities.push(m);
      return;
    }
    const base = rowStart(m);
    const target = source.nextDouble() * t[base + k];
    // least j in [1, k] with p(m, ≤j) > target; p(m, ≤0) = 0 <= target.
    let lo = 1;
    let hi = k;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (t[base + mid] > target) hi = mid;
      else lo = mid + 1;
    }
    const part = lo;
    let copies = 1;
    if (part === 1) {
      copies = m;
    } else {
      // p(m − j, ≤j) = Σ_{c>=1} p(m − cj, ≤j−1); pick c by inversion.
      const rest = m - part;
      let remaining = source.nextDouble() * t[rowStart(rest) + Math.min(part, rest)];
      for (let left = rest; ; left -= part) {
        remaining -= t[rowStart(left) + Math.min(part - 1, left)];
        if (remaining < 0 || left < part) break;
        copies++;
      }
    }
    sizes.push(part);
    multiplicities.push(copies);
    m -= part * copies;
    k = part - 1;
  }
}

/** Exact uniform sampler of partitions of n <= RestrictedPartitionTable.MAX_N by the table above. */
export class TableRecursiveSampler implements PartitionSampler {
  readonly method = 'table-recursive/1';
  private estimates: { length: number; distinct: number } | null = null;

  constructor(
    readonly n: number,
    private readonly table: RestrictedPartitionTable,
  ) {
    if (!Number.isInteger(n) || n < 0 || n > RestrictedPartitionTable.MAX_N) {
      throw new RangeError(`n must be an integer in [0, ${RestrictedPartitionTable.MAX_N}] for the table method, got ${n}`);
    }
    table.ensure(n);
  }

  get expectedLength(): number {
    return this.exactMeans().length;
  }

  get expectedDistinct(): number {
    return this.exactMeans().distinct;
  }

  /** Per distinct size two uniforms and a binary search of ~log2(n) steps; one scan step per part. */
  get expectedWork(): number {
    return 1 + this.expectedDistinct * (2 + Math.log2(this.n + 1)) + this.expectedLength;
  }

  /**
   * Exact means, computed on first use: E[X_k] = Σ_{j>=1} p(n − jk)/p(n) and
   * P(X_k >= 1) = p(n − k)/p(n) (remove j parts k / one part k; Andrews 1976, ch. 1). Summed
   * over k, grouped by m = jk: E[length]·p(n) = Σ_{m=1..n} d(m)·p(n − m), with d(m) the number
   * of divisors of m, and E[distinct]·p(n) = Σ_{m=0..n−1} p(m). One pass of n terms instead of
   * the double loop's ~n ln n (n = 1000: about 2 against 60 µs, once per new n; bench: serving,
   * "fresh server" rows).
   */
  private exactMeans(): { length: number; distinct: number } {
    if (this.estimates === null) {
      const n = this.n;
      const t = this.table.triangle();
      const divisors = divisorCounts(n);
      let length = 0;
      let distinct = 0;
      for (let m = 1; m <= n; m++) {
        const rest = n - m;
        const p = t[rowStart(rest) + rest]; // p(n − m), the triangle's diagonal
        length += divisors[m] * p;
        distinct += p;
      }
      const all = t[rowStart(n) + n];
      this.estimates = n === 0 ? { length: 0, distinct: 0 } : { length: length / all, distinct: distinct / all };
    }
    return this.estimates;
  }

  sample(source: RandomSource): Partition {
    const sizes: number[] = [];
    const multiplicities: number[] = [];
    sampleRestricted(this.table, source, this.n, this.n, sizes, multiplicities);
    return { sizes, multiplicities };
  }
}

/** d(m), the number of divisors of m, for m <= RestrictedPartitionTable.MAX_N (index 0 unused); made once. */
let DIVISOR_COUNTS: Int32Array | undefined;

function divisorCounts(upTo: number): Int32Array {
  if (DIVISOR_COUNTS === undefined || DIVISOR_COUNTS.length <= upTo) {
    const size = Math.max(upTo, RestrictedPartitionTable.MAX_N) + 1;
    const counts = new Int32Array(size);
    for (let k = 1; k < size; k++) for (let m = k; m < size; m += k) counts[m]++;
    DIVISOR_COUNTS = counts;
  }
  return DIVISOR_COUNTS;
}
