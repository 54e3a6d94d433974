import type { RandomSource } from '../random.js';
import { shuffleInPlace } from '../shuffle.js';
import { relabelInPlace, type SetPartition } from './set-partition.js';

/** Above this many urns the multiply-and-shift draw would not be exact in doubles (word × urns >= 2^53). */
const MULTIPLY_UP_TO = 2 ** 21;

const TWO_TO_32 = 2 ** 32;
const TWO_TO_MINUS_32 = 2 ** -32;

/**
 * How many urns one 32-bit word gives for `urns` urns (2 <= urns <= 2^21): the k with
 * urns^k <= 2^32 that gives the most accepted urns per word, k·(1 − (2^32 mod urns^k)/2^32).
 */
export function urnsPerWord(urns: number): number {
  let best = 1;
  let bestYield = 0;
  for (let k = 1, product = urns; product <= TWO_TO_32; k++, product *= urns) {
    const yieldPerWord = k * (1 - (TWO_TO_32 % product) / TWO_TO_32);
    if (yieldPerWord > bestYield) {
      best = k;
      bestYield = yieldPerWord;
    }
  }
  return best;
}

/**
 * Fills `labels` with independent uniform urns 0..urns−1.
 *
 * Up to 2^21 urns, k = urnsPerWord(urns) urns come from one 32-bit word w, by the batched form of
 * Lemire's multiply-and-shift (Brackett-Rozinsky & Lemire, "Batched ranged random integer
 * generation", Software: Practice and Experience, 2025; Lemire, "Fast random integer
 * generation in an interval", ACM TOMACS 29, 2019): x_0 = w, and for j = 1..k
 *   urn_j = floor(x_(j−1)·urns / 2^32),  x_j = x_(j−1)·urns mod 2^32.
 * Then w·urns^k = (urn_1·urns^(k−1) + … + urn_k)·2^32 + x_k, so (urn_1, …, urn_k) are the base-
 * `urns` digits of floor(w·urns^k / 2^32), and x_k = w·urns^k mod 2^32. Redrawing w while
 * x_k < 2^32 mod urns^k is Lemire's rejection for the bound urns^k: it leaves floor(w·urns^k/2^32)
 * exactly uniform on [0, urns^k), so the k digits are independent and exactly uniform. Every
 * product is below 2^32·2^21 = 2^53, exact in doubles. The last word of a fill may give more
 * urns than are left; the surplus digits are dropped (a prefix of independent uniform digits is
 * still that). With k = 1 (more than 2^16 urns) this is the one-word draw. Bench: set
 * partitions, the "uniform urns" rows.
 *
 * One urn takes no words (every label is 0). Beyond 2^21 urns, one word per urn: the modulo of words below the largest multiple of `urns`
 * under 2^32. This loop is Stam's and the uniform-maps sampler's whole cost at large n.
 */
export function fillUniformUrns(source: RandomSource, labels: Int32Array, urns: number): void {
  const n = labels.length;
  if (urns === 1) {
    labels.fill(0);
    return;
  }
  if (urns <= MULTIPLY_UP_TO) {
    const k = urnsPerWord(urns);
    const threshold = TWO_TO_32 % urns ** k;
    const whole = n - (n % k);
    for (let i = 0; i < whole; i += k) {
      let x: number;
      do {
        x = source.nextUint32();
        for (let j = i; j < i + k; j++) {
          const product = x * urns;
          const urn = Math.floor(product * TWO_TO_MINUS_32);
          labels[j] = urn;
          x = product - urn * TWO_TO_32;
        }
      } while (x < threshold);
    }
    if (whole < n) {
      const digits = new Int32Array(k);
      let x: number;
      do {
        x = source.nextUint32();
        for (let j = 0; j < k; j++) {
          const product = x * urns;
          const urn = Math.floor(product * TWO_TO_MINUS_32);
          digits[j] = urn;
          x = product - urn * TWO_TO_32;
        }
      } while (x < threshold);
      labels.set(digits.subarray(0, n - whole), whole);
    }
    return;
  }
  const limit = TWO_TO_32 - (TWO_TO_32 % urns);
  for (let i = 0; i < n; i++) {
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    labels[i] = word % urns;
  }
}

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
 * repeated as often as its size, in a uniformly random order (Fisher–Yates, several indices per
 * 32-bit word: shuffle.ts). Every assignment of items to labelled urns with these sizes is equally
 * likely, so every set partition with this multiset of block sizes is too. (Choosing each
 * item's urn in a Fenwick tree of the room left instead, labels written in order, was measured
 * no faster at 10 urns and 2–3x slower at 1000 and more: not kept.)
 */
export function assignSizes(source: RandomSource, n: number, sizes: ArrayLike<number>, count = sizes.length): SetPartition {
  const labels = new Int32Array(n);
  let at = 0;
  // A plain loop, not labels.fill: a fill call costs ~10 items' worth of loop (measured 63 against
  // 6 ns per item for blocks of one item), most of the work when blocks are small.
  for (let urn = 0; urn < count; urn++) {
    for (const end = at + sizes[urn]; at < end; at++) labels[at] = urn;
  }
  if (at !== n) throw new Error(`block sizes sum to ${at}, not ${n} (bug)`);
  shuffleInPlace(source, labels);
  return relabelInPlace(labels, Math.max(count, 1));
}
