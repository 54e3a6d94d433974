import type { RandomSource } from '../random.js';
import { relabelInPlace, type SetPartition } from './set-partition.js';

/**
 * Throws each of n items into one of `urns` urns uniformly and independently, and returns the
 * partition the non-empty urns form. Each urn is a uniform 32-bit word reduced modulo `urns`,
 * words at or above the largest multiple of `urns` below 2^32 rejected (no modulo bias); the
 * check is written out here rather than calling nextBelow per item, since this loop is the
 * sampler's whole cost at large n (bench: set partitions).
 */
export function throwIntoUrns(source: RandomSource, n: number, urns: number): SetPartition {
  if (!Number.isInteger(urns) || urns < 1 || urns > 2 ** 31) throw new RangeError(`urns must be a whole number from 1 to 2^31, got ${urns}`);
  const labels = new Int32Array(n);
  const limit = 2 ** 32 - (2 ** 32 % urns);
  for (let i = 0; i < n; i++) {
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    labels[i] = word % urns;
  }
  return relabelInPlace(labels, urns);
}

/**
 * The items 1..n split into blocks of the given sizes uniformly at random: the urn labels,
 * each repeated as often as its size, in a uniformly random order (Fisher–Yates; Knuth TAOCP
 * vol. 2, §3.4.2, Algorithm P). Every assignment of items to labelled urns with these sizes
 * is equally likely, so every set partition with this multiset of block sizes is too.
 */
export function assignSizes(source: RandomSource, n: number, sizes: ArrayLike<number>, count = sizes.length): SetPartition {
  const labels = new Int32Array(n);
  let at = 0;
  for (let urn = 0; urn < count; urn++) {
    labels.fill(urn, at, at + sizes[urn]);
    at += sizes[urn];
  }
  if (at !== n) throw new Error(`block sizes sum to ${at}, not ${n} (bug)`);
  for (let i = n - 1; i > 0; i--) {
    const bound = i + 1;
    const limit = 2 ** 32 - (2 ** 32 % bound);
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    const j = word % bound;
    const swap = labels[i];
    labels[i] = labels[j];
    labels[j] = swap;
  }
  return relabelInPlace(labels, Math.max(count, 1));
}
