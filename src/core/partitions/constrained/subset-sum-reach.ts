import { gcd } from './spec.js';

/**
 * Whether some subset of a list of distinct sizes sums to n (distinct parts from an allowed
 * list), decided exactly with bounded work, or undefined when that would take more than
 * `wordLimit` 32-bit word operations.
 *
 * Reductions: n > total or n not a multiple of g = gcd(sizes) is unreachable; dividing by g
 * leaves gcd 1; a subset sums to n iff its complement sums to total - n, so n <= total / 2.
 * Then, in order (each within `wordLimit`):
 * 1. the run argument: if the sums of the j smallest sizes contain every integer of [L, U] and
 *    the next size a is at most U - L + 1, adding it gives every integer of [L, U + a] (any m in
 *    (U, U + a] is (m - a) + a with m - a in [L, U]; the ones below stay). So once the bit set of
 *    a prefix holds a run at least as long as each later size needs, every integer of
 *    [L, U + (sum of the later sizes)] is a subset sum, and by complement every integer of
 *    [total - that, total - L];
 * 2. the reachable sums of the sizes <= n as a bit set (reach |= reach << a, one word operation
 *    per 32 sums and size);
 * 3. a meet-in-the-middle search over the two halves of a short list (at most 2 x 2^18 sums,
 *    Horowitz & Sahni 1974).
 */
export function subsetSumReachable(values: readonly number[], n: number, wordLimit = 3e6): boolean | undefined {
  let total = 0;
  let g = 0;
  for (const v of values) {
    total += v;
    g = gcd(v, g);
  }
  if (n === 0) return true;
  if (n > total || g === 0 || n % g !== 0) return false;
  const sizes = values.map((v) => v / g);
  let target = n / g;
  const sum = total / g;
  if (target > sum - target) target = sum - target;
  if (target === 0) return true;

  // 1. The run argument over growing prefixes.
  // Prefixes within the budget: build once, test the run at a few prefix lengths.
  let reach = new BitSet(1);
  let prefix = 0;
  let spent = 0;
  let nextCheck = 1;
  for (let j = 0; j < sizes.length; j++) {
    const cost = (prefix + sizes[j]) / 32 + 1;
    if (spent + cost > wordLimit) break;
    prefix += sizes[j];
    reach = reach.grown(prefix + 1);
    reach.orShifted(sizes[j]);
    spent += cost;
    if (j + 1 < nextCheck && j + 1 < sizes.length) continue;
    nextCheck = Math.ceil((j + 1) * 1.25);
    spent += prefix / 32 + 1;
    if (target <= prefix && target < (sizes[j + 1] ?? Infinity)) return reach.has(target); // no later size fits below it
    const run = reach.longestRun();
    if (run === null) continue;
    let [lo, hi] = run;
    let covered = true;
    for (let i = j + 1; i < sizes.length; i++) {
      if (sizes[i] > hi - lo + 1) {
        covered = false;
        break;
      }
      hi += sizes[i];
    }
    if (!covered) continue;
    // Every integer of [lo, hi] and of [sum - hi, sum - lo] is reached.
    if ((target >= lo && target <= hi) || (target >= sum - hi && target <= sum - lo)) return true;
    if (target < lo && target <= prefix) {
      // Below the run: reached by the prefix alone, or with a later size (each > target? then no).
      if (reach.has(target)) return true;
      if ((sizes[j + 1] ?? Infinity) > target) return false;
    }
  }

  // 2. The bit set up to the target.
  const usable = sizes.filter((v) => v <= target);
  if (usable.length * (target / 32 + 1) <= wordLimit) {
    const reach = new BitSet(target + 1);
    for (const a of usable) reach.orShifted(a);
    return reach.has(target);
  }

  // 3. Meet in the middle for short lists.
  if (sizes.length <= MEET_IN_THE_MIDDLE_SIZES) return meetInTheMiddle(sizes, target);
  return undefined;
}

/** All subset sums of each half, sorted; a two-pointer walk looks for a pair summing to the target. */
function meetInTheMiddle(sizes: readonly number[], target: number): boolean {
  const half = Math.floor(sizes.length / 2);
  const left = allSums(sizes.slice(0, half));
  const right = allSums(sizes.slice(half));
  let i = 0;
  let j = right.length - 1;
  while (i < left.length && j >= 0) {
    const s = left[i] + right[j];
    if (s === target) return true;
    if (s < target) i++;
    else j--;
  }
  return false;
}

function allSums(sizes: readonly number[]): Float64Array {
  const out = new Float64Array(2 ** sizes.length);
  let count = 1;
  for (const a of sizes) {
    for (let i = 0; i < count; i++) out[count + i] = out[i] + a;
    count *= 2;
  }
  return out.sort();
}

/** A fixed-width bit set over 0..width-1 with the in-place shift-or of a 0/1 knapsack step. */
class BitSet {
  readonly words: Uint32Array;
  constructor(readonly width: number, words?: Uint32Array) {
    this.words = words ?? new Uint32Array(Math.ceil(width / 32));
    if (words === undefined) this.words[0] = 1; // the empty sum
  }

  grown(width: number): BitSet {
    if (width <= this.width) return this;
    const words = new Uint32Array(Math.ceil(width / 32));
    words.set(this.words);
    return new BitSet(width, words);
  }

  has(i: number): boolean {
    return (this.words[i >>> 5] & (1 << (i & 31))) !== 0;
  }

  /** this |= this << a, within the width (descending, so every source word is read before it changes). */
  orShifted(a: number): void {
    const w = this.words;
    const ws = Math.floor(a / 32);
    const bs = a % 32;
    for (let i = w.length - 1; i >= ws; i--) {
      const lower = i - ws - 1 >= 0 && bs !== 0 ? w[i - ws - 1] >>> (32 - bs) : 0;
      w[i] |= (w[i - ws] << bs) | lower;
    }
    const tail = this.width % 32;
    if (tail !== 0) w[w.length - 1] &= (1 << tail) - 1;
  }

  /** The longest run of set bits as [first, last], or null when none has length >= 2. */
  longestRun(): [number, number] | null {
    const w = this.words;
    let best: [number, number] | null = null;
    let start = -1;
    const close = (last: number) => {
      if (best === null || last - start > best[1] - best[0]) best = [start, last];
      start = -1;
    };
    let i = 0;
    while (i < this.width) {
      if ((i & 31) === 0 && i + 32 <= this.width) {
        const word = w[i >>> 5];
        // Whole words inside a run or inside a gap.
        if (word === 0xffffffff && start >= 0) {
          i += 32;
          continue;
        }
        if (word === 0 && start < 0) {
          i += 32;
          continue;
        }
      }
      if (this.has(i)) {
        if (start < 0) start = i;
      } else if (start >= 0) close(i - 1);
      i++;
    }
    if (start >= 0) close(this.width - 1);
    const found = best as [number, number] | null;
    return found !== null && found[1] > found[0] ? found : null;
  }
}

/** Sizes up to which the meet-in-the-middle search decides any n. */
export const MEET_IN_THE_MIDDLE_SIZES = 36;

/**
 * For a list whose reachability subsetSumReachable left undecided: the n that it does decide
 * whatever the list (the bit set route: n, or total - n, up to about wordLimit x 32 / #sizes),
 * for the refusal's "what would fit".
 */
export function decidedRange(values: readonly number[], wordLimit = 3e6): { upTo: number; from: number; total: number } {
  let total = 0;
  let g = 0;
  for (const v of values) {
    total += v;
    g = gcd(v, g);
  }
  const upTo = Math.max(0, Math.floor(32 * (wordLimit / values.length - 1))) * Math.max(g, 1);
  return { upTo, from: total - upTo, total };
}
