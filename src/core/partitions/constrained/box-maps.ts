import type { Partition } from '../../partition.js';
import type { Box } from './box-subset.js';

/**
 * The boxes of the length branch and the maps from a box back onto its family (all bijections,
 * Andrews 1976, §1.3): k parts in [lo, hi] <-> the k x (hi - lo) box by subtracting lo from every
 * part (zero rows are parts equal to lo); k distinct parts in [lo, hi] <-> the k x (hi - lo - k + 1)
 * box by subtracting lo and the staircase (k-1, ..., 1, 0); at most K parts <= hi is the K x hi box
 * itself.
 */

/** The box of "exactly k parts in [lo, hi]" (distinct or not), or null when there is no member. */
export function exactBox(n: number, lo: number, hi: number, distinct: boolean, k: number): Box | null {
  const cols = distinct ? hi - lo - (k - 1) : hi - lo;
  const size = n - k * lo - (distinct ? (k * (k - 1)) / 2 : 0);
  if (k < 1 || cols < 0 || size < 0 || size > k * cols) return null;
  // More rows or columns than the size can fill bind nothing.
  return { rows: Math.min(k, Math.max(size, 1)), cols: cols >= size ? Infinity : cols, size };
}

/** k parts: the box rows plus lo, zero rows becoming parts equal to lo. */
export function shiftMap(lo: number, k: number): (rows: Partition) => Partition {
  return (rows) => {
    let used = 0;
    for (const m of rows.multiplicities) used += m;
    const sizes = rows.sizes.map((s) => s + lo);
    const multiplicities = rows.multiplicities.slice();
    if (used < k) {
      sizes.push(lo);
      multiplicities.push(k - used);
    }
    return { sizes, multiplicities };
  };
}

/** k distinct parts: the box rows (zeros included) plus lo and the staircase k-1, ..., 0. */
export function staircaseMap(lo: number, k: number): (rows: Partition) => Partition {
  return (rows) => {
    const sizes: number[] = [];
    let rank = k - 1;
    for (let i = 0; i < rows.sizes.length; i++) {
      for (let j = 0; j < rows.multiplicities[i]; j++) sizes.push(rows.sizes[i] + lo + rank--);
    }
    while (rank >= 0) sizes.push(lo + rank--);
    return { sizes, multiplicities: sizes.map(() => 1) };
  };
}

/** An upper bound on the number of distinct part sizes of a box partition. */
export function distinctBound(box: Box): number {
  return Math.min(box.rows, box.cols, Math.floor(Math.sqrt(2 * box.size)) + 1);
}
