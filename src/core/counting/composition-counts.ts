import { EmptyFamilyError, LimitExceededError } from '../errors.js';
import type { CompositionFamily } from '../family.js';
import { fixedCore, freeCore, type FixedCore, type FreeCore } from '../compositions/reduce.js';
import { partBounds, partCount, resolveCompositions } from '../compositions/resolve.js';
import { solveTilt } from '../compositions/tilt.js';
import { binomial, log2Binomial } from './binomial.js';

/**
 * Exact numbers of compositions of n (ordered sums of positive — or, with a length, possibly
 * zero — parts), in BigInt.
 *
 * Limits, checked from estimates BEFORE computing:
 *  - the count has at most MAX_COUNT_BITS bits (~315,000 decimal digits): printing it as a
 *    decimal string then takes ~0.1 s on V8 (measured), and a response stays under ~1 MB;
 *  - the computation takes at most MAX_COUNT_WORK word operations (BigInt additions cost about
 *    1 ns per 32-bit word on V8, measured: the budget is roughly half a second);
 *  - a recurrence keeps at most MAX_COUNT_MEMORY_BITS bits of table alive (32 MiB).
 */
export const MAX_COUNT_BITS = 2 ** 20;
export const MAX_COUNT_WORK = 4e8;
export const MAX_COUNT_MEMORY_BITS = 2 ** 28;

function checkBits(bits: number, what: string): void {
  if (bits > MAX_COUNT_BITS) {
    throw new LimitExceededError(
      `the number of ${what} has about ${Math.round(bits * Math.log10(2)).toLocaleString('en-US')} decimal digits, over the limit of ${Math.floor(MAX_COUNT_BITS * Math.log10(2)).toLocaleString('en-US')}`,
      `count bits <= ${MAX_COUNT_BITS}`,
    );
  }
}

function checkWork(work: number, memoryBits: number, what: string): void {
  if (work > MAX_COUNT_WORK) {
    throw new LimitExceededError(
      `counting ${what} exactly would take about ${work.toExponential(1)} word operations, over the limit of ${MAX_COUNT_WORK.toExponential(0)}`,
      `count work <= ${MAX_COUNT_WORK}`,
    );
  }
  if (memoryBits > MAX_COUNT_MEMORY_BITS) {
    throw new LimitExceededError(
      `counting ${what} exactly would hold about ${(memoryBits / 8 / 2 ** 20).toFixed(0)} MiB of table, over the limit of ${MAX_COUNT_MEMORY_BITS / 8 / 2 ** 20} MiB`,
      `count table bits <= ${MAX_COUNT_MEMORY_BITS}`,
    );
  }
}

/**
 * Number of compositions in the family; 0n when it has no member (the planner raises
 * EmptyFamilyError with the reason instead). RangeError for malformed families,
 * LimitExceededError past the limits above.
 */
export function countCompositions(family: CompositionFamily): bigint {
  const what = 'compositions';
  let core: FreeCore | FixedCore;
  try {
    const resolved = resolveCompositions(family);
    if (resolved.length === 0) return resolved.n === 0 ? 1n : 0n;
    if (resolved.length === undefined && resolved.n === 0) return 1n;
    core = resolved.length === undefined ? freeCore(resolved) : fixedCore(resolved);
  } catch (error) {
    if (error instanceof EmptyFamilyError) return 0n;
    throw error;
  }
  return core.kind === 'free' ? countFree(core, what) : countFixed(core, what);
}

/** Compositions of n with parts in S, any number of parts. */
export function countFree(core: FreeCore, what = 'compositions'): bigint {
  const { n, parts } = core;
  if (n === 0) return 1n;
  const { min, max } = partBounds(parts);
  if (min === 1 && max === 1) return 1n;
  if (parts.kind === 'range' && min === 1 && max >= n) {
    // Each of the n-1 gaps between units is cut or not: 2^(n-1) (Stanley EC1, §1.2).
    checkBits(n - 1, what);
    return 1n << BigInt(n - 1);
  }
  // c(m) grows like x^-m with x the tilt root (Flajolet & Sedgewick 2009, Thm V.1).
  const growthBits = solveTilt(parts).t / Math.LN2;
  const bits = n * growthBits + 1;
  checkBits(bits, what);
  const ops = parts.kind === 'range' ? 3 : partCount(parts);
  const reach = parts.kind === 'range' ? (max < n ? max + 1 : min) : max;
  checkWork(n * ops * (1 + bits / 64), (reach + 1) * bits, what);
  return freeRecurrence(n, parts.kind === 'range' ? null : parts.values, min, max);
}

/**
 * c(0) = 1, c(m) = sum_{v in S} c(m - v): first part v, then any composition of m - v
 * (the linear recurrence of a sequence construction; Flajolet & Sedgewick 2009, §I.3).
 * For a range [a, b] the telescoped form c(m) = c(m-1) + c(m-a) - c(m-b-1) (m >= 2) costs
 * three operations per step whatever the width of the range.
 */
function freeRecurrence(n: number, list: readonly number[] | null, a: number, b: number): bigint {
  const reach = list ? b : b < n ? b + 1 : a;
  const size = reach + 1;
  const ring: bigint[] = new Array(size).fill(0n);
  const at = (m: number): bigint => (m < 0 ? 0n : ring[m % size]);
  ring[0] = 1n;
  for (let m = 1; m <= n; m++) {
    let value: bigint;
    if (list) {
      value = 0n;
      for (const v of list) {
        if (v > m) break;
        value += at(m - v);
      }
    } else if (m === 1) {
      value = a === 1 ? 1n : 0n;
    } else {
      value = at(m - 1) + at(m - a) - (b < n ? at(m - b - 1) : 0n);
    }
    ring[m % size] = value;
  }
  return ring[n % size];
}

/** Compositions of n into exactly k parts from S (S's smallest member 0 after the shift). */
export function countFixed(core: FixedCore, what = 'compositions'): bigint {
  const { n, k, parts } = core;
  const { max } = partBounds(parts);
  if (max === 0) return n === 0 ? 1n : 0n;
  if (parts.kind === 'range') {
    const top = max;
    if (top >= n) {
      // Weak compositions of n into k parts: C(n+k-1, k-1) (stars and bars; Feller vol. 1, §II.5).
      const bits = log2Binomial(n + k - 1, k - 1);
      checkBits(bits, what);
      checkWork(Math.min(k, n) * (1 + bits / 64) * 4, 4 * bits, what);
      return binomial(n + k - 1, k - 1);
    }
    return boundedByInclusionExclusion(n, k, top, what);
  }
  return fixedListDp(n, k, parts.values, what);
}

/**
 * k parts in [0, L] summing to n: sum_j (-1)^j C(k, j) C(n - j(L+1) + k - 1, k - 1), by
 * inclusion–exclusion over the parts forced above L (classical; e.g. Riordan, An Introduction to
 * Combinatorial Analysis 1958, ch. 5 — reference from memory). Replacing every part v by L - v
 * maps sum n to sum kL - n, so the smaller of the two is used (fewer terms).
 */
export function boundedByInclusionExclusion(n: number, k: number, top: number, what = 'compositions'): bigint {
  if (n > k * top) return 0n;
  const m = Math.min(n, k * top - n);
  const terms = Math.min(k, Math.floor(m / (top + 1)));
  const bits = log2Binomial(m + k - 1, k - 1) + 1;
  checkBits(bits, what);
  checkWork((terms + 1) * Math.min(k, m + 1) * (2 + bits / 64) * 2, 8 * bits, what);
  let total = 0n;
  let choose = 1n; // C(k, j)
  for (let j = 0; j <= terms; j++) {
    const term = choose * binomial(m - j * (top + 1) + k - 1, k - 1);
    total = j % 2 === 0 ? total + term : total - term;
    choose = (choose * BigInt(k - j)) / BigInt(j + 1);
  }
  return total;
}

/** k parts from a list (0 first) summing to n: c_j(m) = sum_v c_{j-1}(m - v), one row per part. */
function fixedListDp(n: number, k: number, values: readonly number[], what: string): bigint {
  const bits = log2Binomial(n + k - 1, k - 1) + 1;
  checkBits(bits, what);
  checkWork(k * (n + 1) * values.length * (1 + bits / 64), 2 * (n + 1) * bits, what);
  let row: bigint[] = new Array(n + 1).fill(0n);
  row[0] = 1n;
  for (let j = 1; j <= k; j++) {
    const next: bigint[] = new Array(n + 1).fill(0n);
    for (let m = 0; m <= n; m++) {
      let s = 0n;
      for (const v of values) {
        if (v > m) break;
        s += row[m - v];
      }
      next[m] = s;
    }
    row = next;
  }
  return row[n];
}
