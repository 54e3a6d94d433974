import { binomial } from '../counting/binomial.js';
import { nextBelow, nextBigBelow, type RandomSource } from '../random.js';
import type { SetPartitionSampler } from './sampler.js';
import type { SetPartition } from './set-partition.js';
import { blockRange, type ResolvedSetPartitions } from './resolve.js';
import { blockTable, freeTable } from './counts.js';

/**
 * The recursive method (Nijenhuis & Wilf, Combinatorial Algorithms 1978, ch. 12–13) on exact
 * BigInt counts, for every constraint shape while its table is small: the block holding the
 * smallest unplaced item gets s items with probability C(m−1, s−1)·W(m−s)/W(m) — m items left,
 * W the number of ways to finish (T(·, j−1) with j blocks still to form, or F for any number)
 * — its s − 1 companions are a uniform (s−1)-subset of the other m − 1 items, and the rest is
 * done the same way. Each choice is one uniform BigInt below W(m) walked down the candidate
 * sizes, so the law is exactly uniform, with no floating point at all. Blocks come out in
 * order of their smallest items, which is the restricted growth string's numbering.
 */
export interface TableShape {
  /** Every cell of the counting table, for the cost of building it. */
  readonly cells: number;
  /** Rough bits of the largest count (table memory is about cells × bits / 2). */
  readonly bits: number;
}

export function tableSampler(resolved: ResolvedSetPartitions, shape: TableShape): SetPartitionSampler {
  const { n, minSize: a, maxSize: b } = resolved;
  const { lo, hi } = blockRange(resolved);
  const anyCount = !resolved.fixed && hi >= Math.floor(n / a);
  const free = anyCount ? freeTable(n, a, b) : null;
  const cols = anyCount ? null : blockTable(n, hi, a, b);
  const ways = (m: number, j: number): bigint => (free ? free[m] : m < 0 ? 0n : cols![m][j]);
  let total = 0n;
  if (free) total = free[n];
  else for (let j = lo; j <= hi; j++) total += cols![n][j];
  let meanBlocks = 0;
  if (cols) for (let j = lo; j <= hi; j++) meanBlocks += j * ratio(cols[n][j], total);
  else meanBlocks = Math.max(1, n / Math.max(a, Math.min(b, Math.sqrt(n))));
  const wordsPerDraw = 1 + shape.bits / 32;
  return {
    method: 'table/1',
    total,
    expectedLength: n,
    expectedBlocks: meanBlocks,
    // Per block a BigInt draw and one multiply-compare per candidate size (at most the mean
    // block size on average), each over numbers of `bits` bits; one step per item placed.
    expectedWork: 2 * n + meanBlocks * wordsPerDraw * (1 + Math.min(b - a + 1, n / Math.max(meanBlocks, 1))),
    sample(source: RandomSource): SetPartition {
      let blocks = lo;
      if (!free && lo < hi) {
        let pick = nextBigBelow(source, total);
        for (blocks = lo; blocks < hi; blocks++) {
          if (pick < cols![n][blocks]) break;
          pick -= cols![n][blocks];
        }
      }
      return drawBlocks(source, n, a, b, blocks, ways);
    },
  } as SetPartitionSampler & { total: bigint };
}

/** a / b as a double for BigInts of any size. */
function ratio(a: bigint, b: bigint): number {
  const shift = Math.max(0, b.toString(2).length - 60);
  return Number(a >> BigInt(shift)) / Number(b >> BigInt(shift));
}

/** One partition: `blocks` blocks (ignored when `ways` ignores j), sizes in [a, b]. */
function drawBlocks(source: RandomSource, n: number, a: number, b: number, blocks: number, ways: (m: number, j: number) => bigint): SetPartition {
  const rgs = new Int32Array(n);
  // pool[0..left) holds the unplaced items (0-based); where[item] is its position in pool.
  const pool = new Int32Array(n);
  const where = new Int32Array(n);
  for (let i = 0; i < n; i++) pool[i] = where[i] = i;
  const placed = new Uint8Array(n);
  const take = (item: number, left: number): void => {
    // Move `item` to position left − 1 (the end of the unplaced part).
    const at = where[item];
    const last = pool[left - 1];
    pool[at] = last;
    where[last] = at;
    pool[left - 1] = item;
    where[item] = left - 1;
    placed[item] = 1;
  };
  let left = n;
  let smallest = 0;
  let block = 0;
  for (let j = blocks; left > 0; j--, block++) {
    while (placed[smallest]) smallest++;
    const m = left;
    let pick = nextBigBelow(source, ways(m, j));
    let choose = binomial(m - 1, a - 1); // C(m−1, s−1), advanced with s
    let size = -1;
    for (let s = a; s <= Math.min(b, m); s++) {
      const w = choose * ways(m - s, j - 1);
      if (pick < w) {
        size = s;
        break;
      }
      pick -= w;
      choose = (choose * BigInt(m - s)) / BigInt(s);
    }
    if (size < 0) throw new Error('set-partition count table inconsistent (bug)');
    take(smallest, left--);
    rgs[smallest] = block;
    // size − 1 companions: a uniform subset of the other unplaced items (partial Fisher–Yates).
    for (let c = 1; c < size; c++) {
      const item = pool[nextBelow(source, left)];
      take(item, left--);
      rgs[item] = block;
    }
  }
  return { rgs, blocks: block };
}
