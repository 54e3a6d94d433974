/**
 * A set partition of the items 1..n as its restricted growth string (RGS): rgs[i] is the block
 * of item i + 1, blocks numbered 0, 1, 2, ... in order of their smallest items, so rgs[0] = 0
 * and each rgs[i] is at most 1 + max(rgs[0..i-1]) (Knuth, TAOCP vol. 4A, §7.2.1.5; the
 * Hutchinson restricted growth functions). One partition has exactly one RGS, so the RGS is
 * the partition's canonical form; a typed array keeps it compact at n = 10^6.
 */
export interface SetPartition {
  readonly rgs: Int32Array;
  /** The number of blocks (1 + the largest value of rgs; 0 for n = 0). */
  readonly blocks: number;
}

/**
 * Renumbers labels (any non-negative integers below `labelBound`, e.g. urns of a random
 * assignment) in place into the RGS of the partition they induce: items with equal labels share
 * a block, and blocks are numbered by first appearance.
 */
export function relabelInPlace(labels: Int32Array, labelBound: number): SetPartition {
  const map = new Int32Array(labelBound).fill(-1);
  let next = 0;
  for (let i = 0; i < labels.length; i++) {
    const label = labels[i];
    let block = map[label];
    if (block < 0) block = map[label] = next++;
    labels[i] = block;
  }
  return { rgs: labels, blocks: next };
}

/**
 * The blocks as lists of items (1..n): each block increasing, blocks ordered by their smallest
 * item (the order RGS numbers them in). A counting sort by block, linear in n.
 */
export function blocksOf(partition: SetPartition): number[][] {
  const { rgs, blocks } = partition;
  const out: number[][] = [];
  for (let b = 0; b < blocks; b++) out.push([]);
  for (let i = 0; i < rgs.length; i++) out[rgs[i]].push(i + 1);
  return out;
}

/** The sizes of the blocks, in block order. */
export function blockSizesOf(partition: SetPartition): Int32Array {
  const sizes = new Int32Array(partition.blocks);
  for (let i = 0; i < partition.rgs.length; i++) sizes[partition.rgs[i]]++;
  return sizes;
}

/**
 * The partition of items 1..n given as blocks (lists of items, in any order), as its RGS.
 * RangeError when the lists are not a partition of 1..n.
 */
export function fromBlocks(n: number, blocks: readonly (readonly number[])[]): SetPartition {
  const labels = new Int32Array(n).fill(-1);
  blocks.forEach((block, b) => {
    if (block.length === 0) throw new RangeError(`block ${b + 1} is empty: blocks are non-empty`);
    for (const item of block) {
      if (!Number.isInteger(item) || item < 1 || item > n) throw new RangeError(`item ${item} is not one of 1..${n}`);
      if (labels[item - 1] >= 0) throw new RangeError(`item ${item} is in two blocks`);
      labels[item - 1] = b;
    }
  });
  const missing = labels.indexOf(-1);
  if (missing >= 0) throw new RangeError(`item ${missing + 1} is in no block`);
  return relabelInPlace(labels, blocks.length);
}

/**
 * Why `rgs` is not a restricted growth string (null when it is): whole numbers, starting at 0,
 * each at most one more than the largest before it.
 */
export function rgsProblem(rgs: ArrayLike<number>): string | null {
  let max = -1;
  for (let i = 0; i < rgs.length; i++) {
    const v = rgs[i];
    if (!Number.isInteger(v) || v < 0) return `entry ${i} is ${v}, not a whole number >= 0`;
    if (v > max + 1) return `entry ${i} is ${v}, but a block number is at most one more than the largest before it (${max})`;
    if (v > max) max = v;
  }
  return null;
}
