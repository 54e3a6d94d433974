import type { RandomSource } from '../../random.js';
import { AllowedSubsetMixture } from './allowed-subset-mixture.js';

/**
 * Whether a partition of n with parts from an allowed list S (ascending) has between kMin and
 * kMax parts, decided without counting tables where a closed form or a small search does it.
 * Returns undefined when deciding would cost more than `workLimit` steps.
 *
 * Any multiplicities: exactly k parts <=> N = n - k s_1 is a sum of at most k elements of
 * D = {s - s_1 : s in S, s > s_1} (the other parts are s_1); at most K parts <=> n is a sum of at
 * most K elements of S. Both ask whether the fewest elements summing to N is at most c; for large
 * N this is a shortest path over the residues modulo d = max D (the round-robin method for
 * Frobenius problems, Böcker & Lipták 2007): an element e < d costs d - e and adds e, and d itself
 * is free, so a sum of V with C elements costs d C - V; N is reachable with at most c elements
 * iff some sum V <= N with V = N (mod d) has d C - V <= c d - N. The round-robin pass gives, per residue, the
 * cheapest cost and the smallest V attaining it; when that V exceeds N, a table of the fewest
 * elements for each value up to N decides instead.
 *
 * Distinct parts: a subset of S with between kMin and kMax elements and sum n; decided by the
 * bounds (sums of the smallest and largest elements) or by a table of reachable sums per number
 * of elements (bit sets).
 */
export function listLengthFeasible(
  values: readonly number[],
  n: number,
  kMin: number,
  kMax: number,
  distinct: boolean,
  workLimit = 3e7,
  /** Skip the table of fewest elements (tests use it to exercise the residue shortest paths). */
  pathsOnly = false,
): boolean | undefined {
  const r = values.length;
  if (r === 0) return n === 0 && kMin === 0;
  kMax = Math.min(kMax, distinct ? r : n);
  if (kMin > kMax) return false;
  if (distinct) return distinctFeasible(values, n, kMin, kMax, workLimit);
  if (kMin === kMax) {
    const k = kMin;
    if (k === 0) return n === 0;
    const N = n - k * values[0];
    if (N < 0) return false;
    return fewestAtMost(values.slice(1).map((s) => s - values[0]), N, k, workLimit, pathsOnly);
  }
  // At most kMax parts (a partition of n > 0 has at least one part anyway).
  if (kMin > 1 || (kMin === 1 && n === 0)) return undefined; // not needed by the planner
  return fewestAtMost(values, n, kMax, workLimit, pathsOnly);
}

/** Is N a sum of at most c elements of D (positive, ascending)? */
function fewestAtMost(D: readonly number[], N: number, c: number, workLimit: number, pathsOnly: boolean): boolean | undefined {
  if (N === 0) return true;
  if (D.length === 0 || c === 0) return false;
  const d = D[D.length - 1];
  if (N > c * d) return false;
  // Small N: the fewest elements for every value up to N.
  if (!pathsOnly && D.length * N <= workLimit && N <= 5e6) return fewestTable(D, N) <= c;
  if (d * D.length * 2 > workLimit) return undefined;
  const { cost, value } = residuePaths(D, d);
  const rho = N % d;
  if (cost[rho] === Infinity) return false;
  if (cost[rho] > c * d - N) return false;
  if (value[rho] <= N) return true;
  return undefined;
}

/** Fewest elements of D summing to each value up to N (unbounded coin change); returns that of N. */
function fewestTable(D: readonly number[], N: number): number {
  const fewest = new Float64Array(N + 1).fill(Infinity);
  fewest[0] = 0;
  for (let v = 1; v <= N; v++) {
    let best = Infinity;
    for (const e of D) {
      if (e > v) break;
      const f = fewest[v - e] + 1;
      if (f < best) best = f;
    }
    fewest[v] = best;
  }
  return fewest[N];
}

/**
 * Least d C - V per residue mod d and the smallest V attaining it (also feasibility.ts's length test): the round-robin pass of
 * feasibility.ts (Böcker & Lipták 2007) with the lexicographic weight (d - e, e) per element e < d;
 * each element's pass goes once around each cycle p -> p + e mod d from its least entry, which is
 * exact for positive weights (a shortest path never wraps a whole cycle). O(|D| d) steps, replacing
 * a binary-heap Dijkstra (O(|D| d log d), with allocations per push).
 */
export function residuePaths(D: readonly number[], d: number): { cost: Float64Array; value: Float64Array } {
  const cost = new Float64Array(d).fill(Infinity);
  const value = new Float64Array(d).fill(Infinity);
  cost[0] = 0;
  value[0] = 0;
  const less = (c1: number, v1: number, p: number) => c1 < cost[p] || (c1 === cost[p] && v1 < value[p]);
  for (const e of D) {
    if (e === d) continue;
    const cycles = gcdOf(d, e);
    const cycleLength = d / cycles;
    for (let p = 0; p < cycles; p++) {
      let start = p;
      for (let q = p, i = 0; i < cycleLength; i++, q = (q + e) % d) if (less(cost[q], value[q], start)) start = q;
      if (cost[start] === Infinity) continue;
      for (let q = start, i = 0; i < cycleLength; i++) {
        const next = (q + e) % d;
        const nc = cost[q] + (d - e);
        const nv = value[q] + e;
        if (less(nc, nv, next)) {
          cost[next] = nc;
          value[next] = nv;
        }
        q = next;
      }
    }
  }
  return { cost, value };
}

function distinctFeasible(values: readonly number[], n: number, kMin: number, kMax: number, workLimit: number): boolean | undefined {
  const r = values.length;
  // For each k the sums lie between the k smallest and the k largest.
  let low = 0;
  let high = 0;
  let possible = false;
  for (let k = 1; k <= kMax; k++) {
    low += values[k - 1];
    high += values[r - k];
    if (k >= kMin && low <= n && n <= high) possible = true;
  }
  if (kMin === 0 && n === 0) return true;
  if (!possible) return false;
  // k elements sum to k s_1 modulo g, the gcd of the differences.
  let g = 0;
  for (const v of values) g = gcdOf(g, v - values[0]);
  if (g > 1) {
    let some = false;
    for (let k = Math.max(kMin, 1); k <= kMax && !some; k++) some = (((n - k * values[0]) % g) + g) % g === 0;
    if (!some) return false;
  }
  // Reachable sums per number of elements, as bit sets over 0..n.
  const words = Math.ceil((n + 1) / 32);
  if (r * (kMax + 1) * words > workLimit) {
    for (let k = Math.max(kMin, 1); k <= kMax; k++) if (greedyWitness(values, n, k)) return true;
    return samplerWitness(values, n, Math.max(kMin, 1), kMax, workLimit);
  }
  const rows: Uint32Array[] = [];
  for (let k = 0; k <= kMax; k++) rows.push(new Uint32Array(words));
  rows[0][0] = 1;
  for (const s of values) {
    if (s > n) break;
    for (let k = kMax; k >= 1; k--) orShifted(rows[k], rows[k - 1], s);
  }
  for (let k = kMin; k <= kMax; k++) if ((rows[k][n >>> 5] >>> (n & 31)) & 1) return true;
  return false;
}

/** target |= source << shift (bit sets of equal length). */
function orShifted(target: Uint32Array, source: Uint32Array, shift: number): void {
  const wordShift = shift >>> 5;
  const bitShift = shift & 31;
  for (let i = target.length - 1; i >= wordShift; i--) {
    const j = i - wordShift;
    let word = source[j] << bitShift;
    if (bitShift !== 0 && j > 0) word |= source[j - 1] >>> (32 - bitShift);
    target[i] |= word;
  }
}

function gcdOf(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return Math.abs(a);
}

/**
 * A k-subset of `values` (ascending) with sum n, found constructively, or false when this does not
 * find one (which decides nothing): start from the k smallest and raise the largest chosen
 * element, then the next, each as far as the remaining gap allows (binary search); a member
 * exists when the gap closes. For lists with small gaps between sizes it lands exactly.
 */
function greedyWitness(values: readonly number[], n: number, k: number): boolean {
  const r = values.length;
  if (k > r) return false;
  const chosen = Array.from({ length: k }, (_, i) => i);
  let sum = 0;
  for (let i = 0; i < k; i++) sum += values[i];
  if (sum > n) return false;
  for (let t = k - 1; t >= 0 && sum < n; t--) {
    const ceiling = t === k - 1 ? r - 1 : chosen[t + 1] - 1;
    // Largest q in [chosen[t], ceiling] with sum - values[chosen[t]] + values[q] <= n.
    let lo = chosen[t];
    let hi = ceiling;
    const budget = n - sum + values[chosen[t]];
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (values[mid] <= budget) lo = mid;
      else hi = mid - 1;
    }
    sum += values[lo] - values[chosen[t]];
    chosen[t] = lo;
  }
  return sum === n;
}

/** Work bound (table cells plus proposals x sizes) of the witness search below. */
const WITNESS_WORK = 4e6;

/**
 * A member found by the sampler's own proposals (allowed-subset-mixture.ts, fixed seed, at most
 * WITNESS_WORK steps): true when one is accepted (it is checked to be a member), else undefined —
 * a search that finds nothing decides nothing. Lists with large gaps between sizes, where the
 * greedy witness misses, are decided this way when their family is not sparse.
 */
function samplerWitness(values: readonly number[], n: number, kMin: number, kMax: number, workLimit: number): boolean | undefined {
  const r = values.length;
  const cells = r * (kMax + 1);
  if (kMax >= r || cells > Math.min(workLimit, WITNESS_WORK) / 2) return undefined;
  let sampler: AllowedSubsetMixture;
  try {
    sampler = new AllowedSubsetMixture(values, n, kMin, kMax);
  } catch (error) {
    // No number of parts in [kMin, kMax] fits the sums' bounds and residues: empty.
    if (error instanceof RangeError && error.message.includes('needs a family with members')) return false;
    throw error;
  }
  const proposals = Math.floor((Math.min(workLimit, WITNESS_WORK) - sampler.setupWork) / (r + 1));
  if (proposals < 1) return undefined;
  const found = sampler.search(witnessSource(), proposals);
  if (found === null) return undefined;
  const allowed = new Set(values);
  let sum = 0;
  for (const part of found.sizes) sum += part;
  const ok = sum === n && found.sizes.length >= kMin && found.sizes.length <= kMax && new Set(found.sizes).size === found.sizes.length && found.sizes.every((p) => allowed.has(p));
  return ok ? true : undefined;
}

/** A fixed xorshift128+ stream for the witness search (its outcome is a function of the family only). */
function witnessSource(): RandomSource {
  let a = 0x9e3779b9;
  let b = 0x243f6a88;
  let c = 0xb7e15162;
  let d = 0x85a308d3;
  const next = () => {
    // xorshift128 (Marsaglia 2003), 32-bit words.
    const t = a ^ (a << 11);
    a = b;
    b = c;
    c = d;
    d = (d ^ (d >>> 19) ^ (t ^ (t >>> 8))) >>> 0;
    return d;
  };
  return {
    nextUint32: next,
    nextDouble: () => ((next() >>> 5) * 67108864 + (next() >>> 6)) / 2 ** 53,
  };
}
