import type { CompositionFamily, PartitionFamily, SetPartitionFamily } from '../core/family.js';
import { blockRange, resolveSetPartitions } from '../core/set-partitions/resolve.js';

/**
 * Corner members of a family, for the opt-in `edgeCases` of the arbitraries: built from the
 * constraints — one part; all parts equal (the two smallest and two largest sizes dividing n);
 * as many of the smallest size as fit; the largest sizes first (greedy); for a length, parts
 * as equal as possible and each part as large as the later ones allow — and kept only when they are
 * members (the caller checks). They are corners in the usual sense (fewest and most parts,
 * largest and smallest largest part, all parts equal), found by construction: for some
 * combinations of constraints the construction misses, and a family may have fewer corners.
 * Members of more than MAX_CORNER_PARTS parts are left out.
 */
export const MAX_CORNER_PARTS = 100_000;

interface Shape {
  readonly n: number;
  readonly distinct: boolean;
  readonly lo: number;
  readonly hi: number;
  readonly allowed?: readonly number[];
  readonly length?: number;
  readonly maxLength?: number;
}

/** Corner candidates of a partition family, each largest part first. */
export function partitionCorners(family: PartitionFamily): number[][] {
  const shape: Shape = {
    n: family.n,
    distinct: family.distinct === true,
    lo: family.minPart ?? 1,
    hi: Math.min(family.maxPart ?? family.n, family.n),
    allowed: family.allowed,
    length: family.length,
    maxLength: family.maxLength,
  };
  return candidates(shape).map((parts) => parts.sort((a, b) => b - a));
}

/** Corner candidates of a composition family: the partition corners in a few orders. */
export function compositionCorners(family: CompositionFamily): number[][] {
  const lo = family.minPart ?? 1;
  const shape: Shape = { n: family.n, distinct: false, lo, hi: Math.min(family.maxPart ?? family.n, family.n), allowed: family.allowed, length: family.length };
  const out: number[][] = [];
  for (const parts of candidates(shape)) {
    const descending = parts.slice().sort((a, b) => b - a);
    out.push(descending, descending.slice().reverse());
  }
  return out;
}

function candidates(shape: Shape): number[][] {
  const { n, lo, hi, length } = shape;
  const out: number[][] = [];
  const push = (parts: number[] | undefined) => {
    if (parts !== undefined && parts.length <= MAX_CORNER_PARTS) out.push(parts);
  };
  if (n === 0) push(length === undefined ? [] : new Array<number>(length).fill(0));
  push([n]);
  const sizes = shape.allowed?.filter((s) => s >= lo && s <= hi);
  // All parts equal: the two smallest and the two largest allowed sizes that divide n.
  const dividing = sizes ? sizes.filter((d) => d > 0 && n % d === 0) : divisorsBetween(n, Math.max(lo, 1), hi);
  for (const d of new Set([dividing[0], dividing[1], dividing[dividing.length - 2], dividing[dividing.length - 1]])) {
    if (d !== undefined && n / d <= MAX_CORNER_PARTS) push(new Array<number>(n / d).fill(d));
  }
  const smallest = sizes ? sizes[0] : lo;
  const largestFirst = greedy(shape, sizes);
  push(largestFirst);
  // As many of the smallest size as fit, the rest added to one part.
  if (smallest !== undefined && smallest > 0) {
    const k = Math.floor(n / smallest);
    if (k >= 1 && k <= MAX_CORNER_PARTS) push([smallest + (n - k * smallest), ...new Array<number>(k - 1).fill(smallest)]);
  }
  const k = length ?? shape.maxLength;
  if (k !== undefined && k > 0 && k <= MAX_CORNER_PARTS) {
    // k parts as equal as possible (the smallest largest part for k parts)...
    const q = Math.floor(n / k);
    push([...new Array<number>(n % k).fill(q + 1), ...new Array<number>(k - (n % k)).fill(q)]);
    // ...and the parts as large as they can be, first to last (the largest largest part for k parts).
    push(largestFirstOfLength(shape, k));
  }
  if (shape.distinct) {
    // The staircase lo, lo + 1, ... as long as it fits, the remainder added to its largest part.
    const stair: number[] = [];
    let total = 0;
    for (let s = lo; total + s <= n && stair.length < MAX_CORNER_PARTS; s++) {
      stair.push(s);
      total += s;
    }
    if (stair.length > 0) stair[stair.length - 1] += n - total;
    push(stair);
  }
  return out;
}

/**
 * The lexicographically first member with k parts from [lo, hi] (distinct: strictly decreasing):
 * each part as large as the parts after it still allow. Undefined when there is none.
 */
function largestFirstOfLength(shape: Shape, k: number): number[] | undefined {
  const { lo, hi, distinct } = shape;
  const out: number[] = [];
  let rest = shape.n;
  for (let i = 0; i < k; i++) {
    const after = k - i - 1;
    const leastAfter = distinct ? after * lo + (after * (after - 1)) / 2 : after * lo;
    const previous = i === 0 ? hi : distinct ? out[i - 1] - 1 : out[i - 1];
    const part = Math.min(hi, previous, rest - leastAfter);
    if (part < lo) return undefined;
    out.push(part);
    rest -= part;
  }
  return rest === 0 ? out : undefined;
}

/** The largest allowed size first, as many times as it fits, then the next (distinct: once each). */
function greedy(shape: Shape, sizes: readonly number[] | undefined): number[] | undefined {
  const list = sizes ?? (shape.hi - shape.lo <= 1000 ? Array.from({ length: Math.max(0, shape.hi - shape.lo + 1) }, (_, i) => shape.lo + i) : undefined);
  if (list === undefined) return undefined;
  const out: number[] = [];
  let rest = shape.n;
  for (let i = list.length - 1; i >= 0 && rest > 0; i--) {
    const s = list[i];
    if (s <= 0) continue;
    const times = shape.distinct ? Math.min(1, Math.floor(rest / s)) : Math.floor(rest / s);
    if (out.length + times > MAX_CORNER_PARTS) return undefined;
    for (let t = 0; t < times; t++) out.push(s);
    rest -= times * s;
  }
  return rest === 0 ? out : undefined;
}

/** Divisors of n in [lo, hi], ascending (trial division up to the square root: 31,623 steps at n = 10^9). */
function divisorsBetween(n: number, lo: number, hi: number): number[] {
  const small: number[] = [];
  const large: number[] = [];
  for (let d = 1; d * d <= n; d++) {
    if (n % d !== 0) continue;
    small.push(d);
    if (d * d !== n) large.unshift(n / d);
  }
  return [...small, ...large].filter((d) => d >= lo && d <= hi);
}

/**
 * Corner candidates of a set-partition family (kept when they are members; the caller checks):
 * one block; every item alone; for the fewest and the most blocks the family allows, blocks of
 * consecutive items as equal as possible, and items dealt round-robin; blocks of consecutive
 * items as large as allowed (the first member of the order when the sizes are free) and as
 * small as allowed. Families of more than MAX_CORNER_PARTS items have none.
 */
export function setPartitionCorners(family: SetPartitionFamily): number[][][] {
  const n = family.n;
  if (n > MAX_CORNER_PARTS) return [];
  if (n === 0) return [[]];
  const items = Array.from({ length: n }, (_, i) => i + 1);
  const out: number[][][] = [[items], items.map((i) => [i])];
  const { lo, hi } = blockRange(resolveSetPartitions(family));
  for (const k of new Set([lo, hi])) {
    if (k < 1 || k > n) continue;
    // k runs of consecutive items, the first n mod k one longer.
    const runs: number[][] = [];
    let next = 1;
    for (let b = 0; b < k; b++) {
      const size = Math.floor(n / k) + (b < n % k ? 1 : 0);
      runs.push(items.slice(next - 1, next - 1 + size));
      next += size;
    }
    out.push(runs);
    out.push(Array.from({ length: k }, (_, b) => items.filter((i) => (i - 1) % k === b)));
  }
  const chunks = (size: number) => Array.from({ length: Math.ceil(n / size) }, (_, b) => items.slice(b * size, (b + 1) * size));
  if (family.maxBlockSize !== undefined && family.maxBlockSize < n) out.push(chunks(family.maxBlockSize));
  const min = family.minBlockSize ?? 1;
  if (min > 1 && n >= min) {
    const small = chunks(min);
    if (small.length > 1 && small[small.length - 1].length < min) small[small.length - 2].push(...small.pop()!);
    out.push(small);
  }
  return out;
}
