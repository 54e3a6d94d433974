import { LimitExceededError } from '../errors.js';
import type { SetPartitionFamily } from '../family.js';
import { blockRange, isFree, resolveSetPartitions, type ResolvedSetPartitions } from './resolve.js';
import { logBellNumber } from './stam-law.js';

/**
 * Exact numbers of set partitions, in BigInt:
 *  - Bell numbers B_n (every partition; OEIS A000110) by Aitken's array: each row starts with
 *    the last entry of the row before and adds it up, and B_n is the first entry of row n
 *    (Aitken 1933; Knuth TAOCP vol. 4A, §7.2.1.5) — additions only;
 *  - Stirling numbers of the second kind S(n, k) (exactly k blocks; A008277) by the recurrence
 *    S(m, j) = j·S(m−1, j) + S(m−1, j−1) (DLMF 26.8.22), or for few blocks by inclusion–exclusion
 *    S(n, k) = (1/k!)·sum_j (−1)^(k−j)·C(k, j)·j^n (DLMF 26.8.6), whichever is cheaper; at most K
 *    blocks likewise, by sum_(j<=K) S(n, j) = (1/K!)·sum_i C(K, i)·D_(K−i)·i^n with D the
 *    derangement numbers (from 26.8.6 summed over k — derived here, checked against the
 *    recurrence in the tests);
 *  - block sizes bounded to [a, b] with k blocks (a = 2: no singletons, A000296 summed over k):
 *    T(m, j) = j·T(m−1, j) + C(m−1, a−1)·T(m−a, j−1) − C(m−1, b)·T(m−1−b, j−1): the last item
 *    either starts a block of exactly a items, or joins a block of a partition of the others —
 *    not one already holding b (a recurrence of the kind of Comtet, Advanced Combinatorics 1974,
 *    §5.4; derived in the comment of blockTable);
 *  - bounded sizes with any number of blocks by the exponential formula's recurrence
 *    F(m) = sum_(s=a..b) C(m−1, s−1)·F(m−s) (the block holding item m has s items;
 *    Stanley, Enumerative Combinatorics vol. 2, §5.1).
 *
 * Limits, checked from estimates before computing (the same budgets as the composition counts):
 * the count has at most MAX_COUNT_BITS bits (~315,000 decimal digits), the computation takes at
 * most MAX_COUNT_WORK word operations (~0.5 s), and tables hold at most MAX_TABLE_BITS bits.
 * With them (planner estimates): B_n up to n ≈ 1750, S(n, 10) up to n ≈ 315,000 (the digits
 * limit), S(n, 100) up to ≈ 41,000, S(n, 1000) up to ≈ 6500, no singletons up to n ≈ 930.
 */
export const MAX_COUNT_BITS = 2 ** 20;
export const MAX_COUNT_WORK = 4e8;
export const MAX_TABLE_BITS = 2 ** 28;

/** A rough upper bound on log2 of the family's size (for limits, never for results). */
export function countBitsBound(resolved: ResolvedSetPartitions): number {
  const { n, kMax } = resolved;
  if (n === 0) return 1;
  const bell = logBellNumber(n) / Math.LN2;
  // k!·S(n, k) <= k^n surjections; sum_(j<=K) S(n, j) <= K^n maps.
  const maps = n * Math.log2(Math.max(kMax, 1)) - (resolved.fixed ? logFactorial2(kMax) : 0);
  return Math.max(1, Math.min(bell, maps)) + 1;
}

function logFactorial2(k: number): number {
  let s = 0;
  for (let i = 2; i <= k; i++) s += Math.log2(i);
  return s;
}

function digits(bits: number): string {
  return Math.round(bits * Math.log10(2)).toLocaleString('en-US');
}

function checkBits(bits: number): void {
  if (bits > MAX_COUNT_BITS) {
    throw new LimitExceededError(
      `the number of these set partitions has about ${digits(bits)} decimal digits, over the limit of ${digits(MAX_COUNT_BITS)}`,
      `count bits <= ${MAX_COUNT_BITS}`,
    );
  }
}

function checkWork(work: number, tableBits: number, what: string): void {
  if (work > MAX_COUNT_WORK) {
    throw new LimitExceededError(
      `counting ${what} exactly would take about ${work.toExponential(1)} word operations, over the limit of ${MAX_COUNT_WORK.toExponential(0)}`,
      `count work <= ${MAX_COUNT_WORK}`,
    );
  }
  if (tableBits > MAX_TABLE_BITS) {
    throw new LimitExceededError(
      `counting ${what} exactly would hold about ${Math.ceil(tableBits / 8 / 2 ** 20)} MiB of table, over the limit of ${MAX_TABLE_BITS / 8 / 2 ** 20} MiB`,
      `count table bits <= ${MAX_TABLE_BITS}`,
    );
  }
}

/** B_0 … B_n by Aitken's array (n²/2 additions). */
export function bellNumbers(n: number): bigint[] {
  const out: bigint[] = [1n];
  let row: bigint[] = [1n];
  for (let i = 1; i <= n; i++) {
    const next: bigint[] = new Array(i + 1);
    next[0] = row[i - 1];
    for (let j = 1; j <= i; j++) next[j] = next[j - 1] + row[j - 1];
    out.push(next[0]);
    row = next;
  }
  return out;
}

/** S(n, j) for j = 0..k by the recurrence over m = 1..n (a column of k + 1 numbers). */
export function stirlingColumn(n: number, k: number): bigint[] {
  const col: bigint[] = new Array(k + 1).fill(0n);
  col[0] = 1n;
  for (let m = 1; m <= n; m++) {
    for (let j = Math.min(m, k); j >= 1; j--) col[j] = BigInt(j) * col[j] + col[j - 1];
    col[0] = 0n;
  }
  return col;
}

/** D_0 … D_k, the derangement numbers: D_m = m·D_(m−1) + (−1)^m (DLMF 26.13.2 — reference from memory). */
function derangements(k: number): bigint[] {
  const d: bigint[] = [1n];
  for (let m = 1; m <= k; m++) d.push(BigInt(m) * d[m - 1] + (m % 2 === 0 ? 1n : -1n));
  return d;
}

function factorial(k: number): bigint {
  let f = 1n;
  for (let i = 2; i <= k; i++) f *= BigInt(i);
  return f;
}

/** S(n, k) by inclusion–exclusion over the empty urns (DLMF 26.8.6): k + 1 powers. */
export function stirlingByInclusionExclusion(n: number, k: number): bigint {
  let total = 0n;
  let choose = 1n; // C(k, j)
  for (let j = 0; j <= k; j++) {
    const term = choose * BigInt(j) ** BigInt(n);
    total += (k - j) % 2 === 0 ? term : -term;
    choose = (choose * BigInt(k - j)) / BigInt(j + 1);
  }
  return total / factorial(k);
}

/** sum_(j<=K) S(n, j) = (1/K!)·sum_i C(K, i)·D_(K−i)·i^n: K + 1 powers. */
export function atMostByInclusionExclusion(n: number, K: number): bigint {
  const d = derangements(K);
  let total = 0n;
  let choose = 1n; // C(K, i)
  for (let i = 0; i <= K; i++) {
    total += choose * d[K - i] * BigInt(i) ** BigInt(n);
    choose = (choose * BigInt(K - i)) / BigInt(i + 1);
  }
  return total / factorial(K);
}

/**
 * The table T[m][j] (m = 0..n, j = 0..kTop) of set partitions of m items into j blocks of a..b
 * items. Derivation of the recurrence: in a partition of m items, either item m is in a block of
 * exactly a items (choose its a − 1 companions: C(m−1, a−1)·T(m−a, j−1)), or removing item m
 * leaves a partition of m − 1 items into j blocks with sizes in [a, b] in which m's block
 * (now one item smaller) is any block but one of exactly b items: j·T(m−1, j) choices of
 * (partition, block) less the C(m−1, b)·T(m−1−b, j−1) that mark a block of b items.
 * `keep` columns of m are kept (a ring); the full table when keep > n.
 */
export function blockTable(n: number, kTop: number, a: number, b: number, keep = n + 1): bigint[][] {
  const ring = Math.min(keep, n + 1);
  const zero: bigint[] = new Array(kTop + 1).fill(0n);
  const cols: bigint[][] = new Array(ring);
  const at = (m: number): bigint[] => (m < 0 ? zero : cols[m % ring]);
  cols[0] = zero.slice();
  cols[0][0] = 1n;
  let ca = a === 1 ? 1n : 0n; // C(m−1, a−1), updated as m grows
  let cb = 0n; // C(m−1, b)
  for (let m = 1; m <= n; m++) {
    // C(m−1, r) from C(m−2, r): times (m−1)/(m−1−r); C(r, r) = 1.
    if (m - 1 === a - 1) ca = 1n;
    else if (m - 1 > a - 1) ca = (ca * BigInt(m - 1)) / BigInt(m - a);
    if (b < n) {
      if (m - 1 === b) cb = 1n;
      else if (m - 1 > b) cb = (cb * BigInt(m - 1)) / BigInt(m - 1 - b);
    }
    const prev = at(m - 1);
    const startA = at(m - a);
    const endB = at(m - 1 - b);
    const col: bigint[] = new Array(kTop + 1);
    col[0] = 0n;
    for (let j = 1; j <= kTop; j++) {
      let v = BigInt(j) * prev[j] + ca * startA[j - 1];
      if (cb !== 0n) v -= cb * endB[j - 1];
      col[j] = v;
    }
    cols[m % ring] = col;
  }
  return cols;
}

/**
 * F[m] for m = 0..n: set partitions of m items with every block of a..b items, any number of
 * blocks; F(m) = sum_(s=a..b) C(m−1, s−1)·F(m−s), with the row C(m−1, ·) of Pascal's triangle
 * kept up to b − 1.
 */
export function freeTable(n: number, a: number, b: number): bigint[] {
  const f: bigint[] = new Array(n + 1).fill(0n);
  f[0] = 1n;
  const top = Math.min(b, n) - 1;
  const row: bigint[] = new Array(top + 1).fill(0n); // C(m−1, i), i = 0..top
  for (let m = 1; m <= n; m++) {
    // Row m−1 from row m−2 (C(0, 0) = 1 at m = 1).
    for (let i = Math.min(top, m - 1); i >= 1; i--) row[i] += row[i - 1];
    row[0] = 1n;
    let sum = 0n;
    for (let s = a; s <= Math.min(b, m); s++) if (f[m - s] !== 0n) sum += row[s - 1] * f[m - s];
    f[m] = sum;
  }
  return f;
}

interface CountMethod {
  readonly work: number;
  readonly tableBits: number;
  readonly run: () => bigint;
}

/** Word operations of raising numbers to the n-th power to `bits` bits (schoolbook-to-Karatsuba guess). */
function powerWork(bits: number): number {
  const words = bits / 32 + 1;
  return 2 * words ** 1.6;
}

/**
 * The number of set partitions in the family, exactly; 0 for an empty family. RangeError
 * (ContradictoryConstraintError) for contradictory parameters, LimitExceededError past the limits.
 */
export function countSetPartitions(family: SetPartitionFamily): bigint {
  return countResolved(resolveSetPartitions(family));
}

export function countResolved(resolved: ResolvedSetPartitions): bigint {
  const { n, fixed, minSize: a, maxSize: b } = resolved;
  const { lo, hi } = blockRange(resolved);
  if (lo > hi) return 0n;
  if (n === 0) return 1n;
  const bits = countBitsBound(resolved);
  checkBits(bits);
  const words = bits / 32 + 1;
  const methods: CountMethod[] = [];
  const sizesFree = a === 1 && b >= n;
  if (isFree(resolved) || (sizesFree && !fixed && hi >= n)) {
    methods.push({ work: (n * n * words) / 3, tableBits: 2 * n * bits, run: () => bellNumbers(n)[n] });
  } else if (sizesFree && fixed) {
    const k = hi;
    methods.push({ work: n * k * words * 2, tableBits: (k + 1) * bits, run: () => stirlingColumn(n, k)[k] });
    methods.push({ work: (k + 1) * (powerWork(n * Math.log2(Math.max(k, 2))) + 2 * words), tableBits: 4 * bits, run: () => stirlingByInclusionExclusion(n, k) });
  } else if (sizesFree) {
    const K = hi;
    methods.push({ work: n * K * words * 2, tableBits: (K + 1) * bits, run: () => stirlingColumn(n, K).reduce((x, y) => x + y, 0n) });
    methods.push({ work: (K + 1) * (powerWork(n * Math.log2(Math.max(K, 2))) + 4 * words), tableBits: 4 * bits, run: () => atMostByInclusionExclusion(n, K) });
  } else if (!fixed && hi >= Math.floor(n / a)) {
    // No effective bound on the number of blocks: the one-dimensional recurrence.
    const width = Math.min(b, n) - a + 1;
    methods.push({ work: n * (width * 2 + Math.min(b, n) / 2) * words, tableBits: (n + Math.min(b, n)) * bits, run: () => freeTable(n, a, b)[n] });
  } else {
    const kTop = hi;
    const keep = b < n ? b + 2 : a + 1;
    const binomialWords = (b < n ? b * Math.log2(n) : a * Math.log2(n)) / 32 + 1;
    methods.push({
      work: (n + 1) * kTop * words * (3 + binomialWords),
      tableBits: keep * (kTop + 1) * bits,
      run: () => {
        const cols = blockTable(n, kTop, a, b, keep);
        let total = 0n;
        for (let j = lo; j <= hi; j++) total += cols[n % Math.min(keep, n + 1)][j];
        return total;
      },
    });
  }
  const best = methods.reduce((x, y) => (y.work < x.work ? y : x));
  checkWork(best.work, best.tableBits, 'these set partitions');
  return best.run();
}
