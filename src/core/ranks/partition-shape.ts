import type { PartitionFamily } from '../family.js';
import { contradiction, emptyFamilyMessage, sizeCount, smallestSize, toSpec, type SizeSet } from '../partitions/constrained/spec.js';
import { bigintCellBytes, RANK_TABLE_BYTES, type TableSize } from './limits.js';

/**
 * A partition family in the terms of its rank table: the allowed part sizes b_1 < ... < b_r
 * (already cut to those a member can use), whether parts are distinct, and the rule on the number
 * of parts — none, exactly k, or at most K (dropped when every member satisfies it).
 */
export type LengthRule = 'any' | 'exactly' | 'atMost';

export interface PartitionShape {
  readonly n: number;
  readonly sizes: SizeSet;
  readonly distinct: boolean;
  readonly rule: LengthRule;
  /** k for 'exactly', K for 'atMost', 0 for 'any'. */
  readonly parts: number;
}

/** The family's shape, or the reason it has no member at all (counted 0, as countPartitions does). */
export function partitionShape(family: PartitionFamily): PartitionShape | { readonly empty: string } {
  const spec = toSpec(family); // throws RangeError for a malformed family
  const why = contradiction(family);
  if (why !== null) return { empty: why };
  const { n, distinct } = spec;
  let sizes = spec.sizes;
  if (sizeCount(sizes) === 0) return n === 0 && (spec.length ?? 0) === 0 ? { n, sizes, distinct, rule: 'any', parts: 0 } : { empty: emptyFamilyMessage(family) };
  const b1 = smallestSize(sizes);
  if (spec.length !== undefined) {
    const k = spec.length;
    if (k === 0) return n === 0 ? { n, sizes, distinct, rule: 'any', parts: 0 } : { empty: emptyFamilyMessage(family) };
    // The other k - 1 parts take at least the k - 1 smallest sizes (distinct) or b_1 each.
    const rest = distinct ? smallestSum(sizes, k - 1) : (k - 1) * b1;
    if (rest > n) return { empty: emptyFamilyMessage(family) };
    sizes = cutTo(sizes, n - rest);
    if (sizeCount(sizes) === 0) return { empty: emptyFamilyMessage(family) };
    return { n, sizes, distinct, rule: 'exactly', parts: k };
  }
  if (spec.maxLength !== undefined) {
    const most = maxParts(sizes, distinct, n);
    if (spec.maxLength < most) return { n, sizes, distinct, rule: 'atMost', parts: spec.maxLength };
  }
  return { n, sizes, distinct, rule: 'any', parts: 0 };
}

/** The j-th smallest allowed size (1-based). */
export function sizeAt(sizes: SizeSet, j: number): number {
  return sizes.kind === 'interval' ? sizes.lo + j - 1 : sizes.values[j - 1];
}

/** Sum of the `count` smallest sizes (Infinity when there are fewer). */
function smallestSum(sizes: SizeSet, count: number): number {
  if (count > sizeCount(sizes)) return Infinity;
  if (sizes.kind === 'interval') return count * sizes.lo + (count * (count - 1)) / 2;
  let total = 0;
  for (let j = 0; j < count; j++) total += sizes.values[j];
  return total;
}

function cutTo(sizes: SizeSet, top: number): SizeSet {
  if (sizes.kind === 'interval') return { kind: 'interval', lo: sizes.lo, hi: Math.min(sizes.hi, top) };
  return { kind: 'list', values: sizes.values.filter((v) => v <= top) };
}

/** The most parts a member can have: n / b_1, or for distinct parts as many smallest sizes as fit. */
function maxParts(sizes: SizeSet, distinct: boolean, n: number): number {
  if (!distinct) return Math.floor(n / smallestSize(sizes));
  let total = 0;
  const r = sizeCount(sizes);
  for (let j = 1; j <= r; j++) {
    total += sizeAt(sizes, j);
    if (total > n) return j - 1;
  }
  return r;
}

/**
 * Last remainder m stored in the row of (b_1..b_j, l): rows start at m = b_j (below it the row
 * equals a lower one: no part b_j fits) and end at the largest remainder a walk can meet there.
 * With the walk at sizes b_1..b_j, every part placed so far is >= b_j, so after p placed parts
 * m <= n - p * b_j; and l more parts from b_1..b_j reach at most l * b_j (distinct: the l largest
 * of them). A length rule knows p = (k or K) - l; without one, p >= 1 except at the start,
 * m = n, which the table keeps apart (one count per j). So every row is empty once b_j > n / 2.
 * `prefix(i)` is b_1 + ... + b_i (see prefixSums).
 */
export function rowEnd(shape: PartitionShape, j: number, l: number, prefix: (i: number) => number): number {
  const { n, distinct, rule } = shape;
  const b = sizeAt(shape.sizes, j);
  const placed = rule === 'any' ? 1 : shape.parts - l;
  if (placed === 0) return b - 1; // the start layer: only m = n, kept apart
  let end = n - placed * b;
  if (rule === 'any') return distinct ? Math.min(end, prefix(j)) : end;
  return Math.min(end, distinct ? prefix(j) - prefix(j - Math.min(l, j)) : l * b);
}

/**
 * First remainder m stored in the row of (b_1..b_j, l): m = b_j (below it the row equals a lower
 * one), and with "exactly" the l parts still due take at least l * b_1 (distinct: the l smallest
 * sizes), so the counts below are 0.
 */
export function rowStart(shape: PartitionShape, j: number, l: number, prefix: (i: number) => number): number {
  const b = sizeAt(shape.sizes, j);
  if (shape.rule !== 'exactly') return b;
  return Math.max(b, shape.distinct ? (l <= j ? prefix(l) : Infinity) : l * sizeAt(shape.sizes, 1));
}

/** i -> b_1 + ... + b_i: arithmetic for an interval, a table for a list (at most MAX_ALLOWED sizes). */
export function prefixSums(sizes: SizeSet): (i: number) => number {
  if (sizes.kind === 'interval') return (i) => i * sizes.lo + (i * (i - 1)) / 2;
  const sums = [0];
  for (const v of sizes.values) sums.push(sums[sums.length - 1] + v);
  return (i) => sums[i];
}

/** Layers of the table: one per length state (l = 0 ... k or K), or one when the length is free. */
export function layersOf(shape: PartitionShape): number {
  return shape.rule === 'any' ? 1 : shape.parts + 1;
}

/**
 * The size of the shape's rank table, without building it: the counts stored row by row, at the
 * largest count's size. Stops (Infinity) as soon as the count passes what the limit allows, and
 * rows are empty past b_j > n / 2 (see rowEnd), so the estimate is quick even for n = 10^9.
 */
export function partitionTableSize(shape: PartitionShape): TableSize {
  const r = sizeCount(shape.sizes);
  const cellBytes = bigintCellBytes(countBits(shape));
  const most = RANK_TABLE_BYTES / cellBytes;
  const over = { cells: Infinity, bytes: Infinity };
  let cells = r + 1; // the start column
  if (cells > most) return over;
  // Rows of every layer but the start one (k or K parts to go, when there is a length rule).
  const layers = shape.rule === 'any' ? [0] : Array.from({ length: Math.max(0, shape.parts - 1) }, (_, i) => i + 1);
  const prefix = prefixSums(shape.sizes);
  for (let j = 1; j <= r && layers.length > 0; j++) {
    const b = sizeAt(shape.sizes, j);
    if (2 * b > shape.n) break;
    for (const l of layers) cells += Math.max(0, rowEnd(shape, j, l, prefix) - rowStart(shape, j, l, prefix) + 1);
    if (cells > most) return over;
  }
  return { cells, bytes: cells * cellBytes };
}

/**
 * An upper bound on log2 of the family's count: p(n) < exp(π √(2n/3)) (Hardy & Ramanujan 1918;
 * the elementary bound of Erdős 1942), partitions into distinct parts at most 2^r and
 * e^(π √(n/3)), and with r sizes at most the product of (n / b_i + 1) choices of multiplicity.
 */
function countBits(shape: PartitionShape): number {
  const { n, distinct, sizes } = shape;
  const r = sizeCount(sizes);
  if (r === 0) return 1;
  const hardyRamanujan = (Math.PI * Math.sqrt((2 * n) / 3)) / Math.LN2;
  if (distinct) return Math.min(r, (Math.PI * Math.sqrt(n / 3)) / Math.LN2, hardyRamanujan) + 1;
  return Math.min(hardyRamanujan, r * Math.log2(n / smallestSize(sizes) + 1)) + 1;
}
