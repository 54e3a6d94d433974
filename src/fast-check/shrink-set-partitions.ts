import { spread } from './spread.js';

/**
 * Shrink candidates of a set partition (its blocks, as the library writes them), most
 * aggressive first, worked out on its restricted growth string (entry i the block of item
 * i + 1) and written back as blocks, renumbered so that every candidate is in the written form:
 *   - fewer items: keep the first or the last half of the items, drop a block, drop one item,
 *     drop the largest item of every block or of two neighbouring blocks (items after a dropped
 *     one move down by one);
 *   - the same items in fewer blocks: merge a block into the one before it, or into the first;
 *   - the same items, towards the first member of the order: move an item to an earlier block
 *     (or the first), or swap the blocks of two neighbouring items when the later one's is earlier.
 * The arbitrary keeps the candidates that are strictly simpler (simplicity.ts) and members of
 * their family. Moves at single items and blocks look at the positions `spread` picks.
 */
export function* setPartitionShrinks(blocks: readonly (readonly number[])[]): Generator<number[][]> {
  const rgs = rgsOf(blocks);
  const n = rgs.length;
  if (n === 0) return;
  const k = blocks.length;
  const items = spread(n);
  const blockIndices = spread(k);
  if (n >= 2) {
    yield blocksOf(rgs.slice(0, Math.ceil(n / 2)));
    yield blocksOf(rgs.slice(Math.floor(n / 2)));
  }
  if (k >= 2) for (const b of blockIndices) yield blocksOf(rgs.filter((v) => v !== b));
  const lastOfEvery = blocks.map((block) => block[block.length - 1] - 1);
  const lasts = new Set(lastOfEvery);
  yield blocksOf(rgs.filter((_, i) => !lasts.has(i)));
  for (const b of blockIndices) {
    if (b + 1 < k) yield blocksOf(rgs.filter((_, i) => i !== lastOfEvery[b] && i !== lastOfEvery[b + 1]));
  }
  for (const i of items) yield blocksOf([...rgs.slice(0, i), ...rgs.slice(i + 1)]);
  for (const b of blockIndices) {
    if (b === 0) continue;
    yield blocksOf(rgs.map((v) => (v === b ? b - 1 : v)));
    if (b > 1) yield blocksOf(rgs.map((v) => (v === b ? 0 : v)));
  }
  for (const i of items) {
    if (rgs[i] === 0) continue;
    yield blocksOf(with_(rgs, i, rgs[i] - 1));
    if (rgs[i] > 1) yield blocksOf(with_(rgs, i, 0));
  }
  for (const i of items) {
    if (i + 1 < n && rgs[i] > rgs[i + 1]) {
      const swapped = with_(rgs, i, rgs[i + 1]);
      swapped[i + 1] = rgs[i];
      yield blocksOf(swapped);
    }
  }
}

/** The restricted growth string of blocks in the written form. */
export function rgsOf(blocks: readonly (readonly number[])[]): number[] {
  const rgs: number[] = [];
  blocks.forEach((block, b) => {
    for (const item of block) rgs[item - 1] = b;
  });
  return rgs;
}

/** The blocks of items labelled by any block numbers, renumbered by first appearance (the written form). */
function blocksOf(labels: readonly number[]): number[][] {
  const index = new Map<number, number>();
  const blocks: number[][] = [];
  labels.forEach((label, i) => {
    let b = index.get(label);
    if (b === undefined) {
      b = blocks.length;
      index.set(label, b);
      blocks.push([]);
    }
    blocks[b].push(i + 1);
  });
  return blocks;
}

function with_(rgs: readonly number[], i: number, value: number): number[] {
  const out = rgs.slice();
  out[i] = value;
  return out;
}
