import type { RandomSource } from '../random.js';
import { relabelInPlace, type SetPartition } from './set-partition.js';

/** Above this many urns the multiply-and-shift draw would not be exact in doubles (word × urns >= 2^53). */
const MULTIPLY_UP_TO = 2 ** 21;

/**
 * Fills `labels` with independent uniform urns 0..urns−1, one 32-bit word each. Up to 2^21 urns
 * by Lemire's multiply-and-shift with rejection ("Fast random integer generation in an
 * interval", ACM TOMACS 29, 2019): the urn is floor(word·urns / 2^32), and words whose low part
 * falls below (2^32 − urns) mod urns are redrawn, which makes every urn exactly equally likely;
 * word·urns < 2^53 keeps it exact in doubles. It is about 1.5x faster than the modulo here
 * (bench: set partitions). Beyond 2^21 urns, the modulo of words below the largest multiple of
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
 * The items 1..n split into blocks of the given sizes uniformly at random: item after item goes
 * to urn j with probability (room left in j) / (items left), i.e. the urn labels, each repeated
 * as often as its size, in a uniformly random order (sequential sampling without replacement;
 * Devroye 1986, §XI.1). Every assignment of items to labelled urns with these sizes is equally
 * likely, so every set partition with this multiset of block sizes is too.
 *
 * Two ways to draw that order, by the number of urns k (bench: set partitions, n = 10^6): up to
 * SEQUENTIAL_UP_TO urns, the urn of each item is found in a Fenwick tree of the room left
 * (Fenwick 1994; O(log k) in a k-entry table, labels written in order), ~1.5x faster than a
 * shuffle for k = 10; at k = 1000 the tree's depth already costs more than it saves (shuffle
 * ~1.5x faster), so for more urns the labels are shuffled (Fisher–Yates; Knuth TAOCP vol. 2,
 * §3.4.2, Algorithm P) — the same law.
 */
export function assignSizes(source: RandomSource, n: number, sizes: ArrayLike<number>, count = sizes.length): SetPartition {
  return count <= SEQUENTIAL_UP_TO ? assignSequentially(source, n, sizes, count) : assignByShuffle(source, n, sizes, count);
}

const SEQUENTIAL_UP_TO = 64;

export function assignByShuffle(source: RandomSource, n: number, sizes: ArrayLike<number>, count: number): SetPartition {
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

export function assignSequentially(source: RandomSource, n: number, sizes: ArrayLike<number>, count: number): SetPartition {
  const k = count;
  const tree = new Int32Array(k + 1);
  let total = 0;
  for (let j = 0; j < k; j++) {
    tree[j + 1] = sizes[j];
    total += sizes[j];
  }
  if (total !== n) throw new Error(`block sizes sum to ${total}, not ${n} (bug)`);
  // Fenwick tree: tree[j] holds the sum over the range (j − lowbit(j), j].
  for (let j = 1; j <= k; j++) {
    const parent = j + (j & -j);
    if (parent <= k) tree[parent] += tree[j];
  }
  let top = 1;
  while (top * 2 <= k) top *= 2;
  const labels = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const left = n - i;
    const limit = 2 ** 32 - (2 ** 32 % left);
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    let u = word % left;
    // The smallest urn whose cumulative room exceeds u.
    let at = 0;
    for (let step = top; step > 0; step >>= 1) {
      const next = at + step;
      if (next <= k && tree[next] <= u) {
        at = next;
        u -= tree[next];
      }
    }
    labels[i] = at;
    for (let j = at + 1; j <= k; j += j & -j) tree[j]--;
  }
  return relabelInPlace(labels, Math.max(k, 1));
}
