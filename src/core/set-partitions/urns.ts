import type { RandomSource } from '../random.js';
import { relabelInPlace, type SetPartition } from './set-partition.js';

/** Above this many urns the multiply-and-shift draw would not be exact in doubles (word × urns >= 2^53). */
const MULTIPLY_UP_TO = 2 ** 21;

/**
 * Fills `labels` with independent uniform urns 0..urns−1, one 32-bit word each. Up to 2^21 urns
 * by Lemire's multiply-and-shift with rejection ("Fast random integer generation in an
 * interval", ACM TOMACS 29, 2019): the urn is floor(word·urns / 2^32), and words whose low part
 * falls below (2^32 − urns) mod urns are redrawn, which makes every urn exactly equally likely;
 * word·urns < 2^53 keeps it exact in doubles. It avoids a floating-point modulo per item
 * (bench: set partitions, the "uniform urns" row, measures the two side by side). Beyond 2^21 urns, the modulo of words below the largest multiple of
 * `urns` under 2^32. This loop is Stam's and the uniform-maps sampler's whole cost at large n.
 */
export function fillUniformUrns(source: RandomSource, labels: Int32Array, urns: number): void {
  const n = labels.length;
  if (urns <= MULTIPLY_UP_TO) {
    const threshold = (2 ** 32 - urns) % urns;
    for (let i = 0; i < n; i++) {
      let product = source.nextUint32() * urns;
      let urn = Math.floor(product * TWO_TO_MINUS_32);
      while (product - urn * 2 ** 32 < threshold) {
        product = source.nextUint32() * urns;
        urn = Math.floor(product * TWO_TO_MINUS_32);
      }
      labels[i] = urn;
    }
    return;
  }
  const limit = 2 ** 32 - (2 ** 32 % urns);
  for (let i = 0; i < n; i++) {
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    labels[i] = word % urns;
  }
}

const TWO_TO_MINUS_32 = 2 ** -32;

/**
 * Throws each of n items into one of `urns` urns uniformly and independently, and returns the
 * partition the non-empty urns form.
 */
export function throwIntoUrns(source: RandomSource, n: number, urns: number): SetPartition {
  if (!Number.isInteger(urns) || urns < 1 || urns > 2 ** 31) throw new RangeError(`urns must be a whole number from 1 to 2^31, got ${urns}`);
  const labels = new Int32Array(n);
  fillUniformUrns(source, labels, urns);
  return relabelInPlace(labels, urns);
}

/**
 * The items 1..n split into blocks of the given sizes uniformly at random: the urn labels, each
 * repeated as often as its size, in a uniformly random order (Fisher–Yates; Knuth TAOCP vol. 2,
 * §3.4.2, Algorithm P). Every assignment of items to labelled urns with these sizes is equally
 * likely, so every set partition with this multiset of block sizes is too. (Choosing each
 * item's urn in a Fenwick tree of the room left instead, labels written in order, was measured
 * no faster at 10 urns and 2–3x slower at 1000 and more: not kept.)
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
