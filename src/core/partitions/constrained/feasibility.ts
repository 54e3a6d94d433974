import { listLengthFeasible, residuePaths } from './length-feasibility.js';
import { subsetSumReachable } from './subset-sum-reach.js';
import { gcd, sizeCount, sizeGcd, type ConstrainedSpec, type SizeSet } from './spec.js';

/**
 * Whether a family has at least one member, decided without counting where a closed form
 * exists. Boltzmann samplers loop forever on an empty family, so the planner asks this first.
 * Returns undefined when deciding would cost more than `workLimit` steps (the caller then uses
 * a counting table, which decides emptiness by itself).
 */
/** Work bound (|D| d steps) for the round-robin residue paths tried before length-feasibility.ts. */
const ROUND_ROBIN_LIMIT = 4e6;

export function isFeasible(spec: ConstrainedSpec, workLimit = 1e8): boolean | undefined {
  const { n, sizes, distinct } = spec;
  if (n === 0) return spec.length === undefined || spec.length === 0;
  if (sizeCount(sizes) === 0) return false;
  let kMin = 1;
  let kMax = spec.length ?? spec.maxLength ?? n;
  if (spec.length !== undefined) kMin = spec.length;
  if (kMin > kMax || kMax === 0) return false;
  if (sizes.kind === 'interval') return intervalFeasible(n, sizes.lo, sizes.hi, distinct, kMin, kMax);
  if (spec.length !== undefined || spec.maxLength !== undefined) {
    // Any multiplicities: the residue shortest paths by round robin first (|D| d steps, d the
    // largest size), the slower general decision (length-feasibility.ts: a table of fewest parts
    // in |D| n steps, or Dijkstra) only when they leave it undecided or d is too large.
    const quick = distinct ? undefined : lengthByRoundRobin(sizes.values, n, kMin, kMax);
    return quick ?? listLengthFeasible(sizes.values, n, kMin, kMax, distinct);
  }
  return distinct ? subsetSumFeasible(sizes.values, n) : listFeasible(sizes.values, n, workLimit);
}

/**
 * Parts in [lo, hi], between kMin and kMax of them. Any multiplicities: k parts reach exactly the
 * sizes k*lo..k*hi. Distinct parts: k parts reach exactly k*lo + k(k-1)/2 .. k*hi - k(k-1)/2
 * (every sum in between: raise one part at a time), with k <= hi - lo + 1.
 */
function intervalFeasible(n: number, lo: number, hi: number, distinct: boolean, kMin: number, kMax: number): boolean {
  if (!distinct) {
    const from = Math.max(kMin, Math.ceil(n / hi));
    const to = Math.min(kMax, Math.floor(n / lo));
    return from <= to;
  }
  const top = Math.min(kMax, hi - lo + 1);
  for (let k = kMin; k <= top; k++) {
    const stair = (k * (k - 1)) / 2;
    if (k * lo + stair > n) return false;
    if (k * hi - stair >= n) return true;
  }
  return false;
}

/**
 * Any multiplicities from a list: n must be a multiple of g = gcd; beyond Schur's bound on the
 * Frobenius number, (a_1/g - 1)(a_r/g - 1) (Brauer 1942, "On a problem of partitions"), every
 * multiple of g is reachable; below it, the residue table of the smallest size (round robin).
 */
function listFeasible(values: readonly number[], n: number, workLimit: number): boolean | undefined {
  const g = sizeGcd({ kind: 'list', values });
  if (n % g !== 0) return false;
  const first = values[0] / g;
  const last = values[values.length - 1] / g;
  if (n / g >= (first - 1) * (last - 1)) return true;
  if (values.length * first > workLimit) return undefined;
  return smallestInResidue(values.map((v) => v / g))[(n / g) % first] <= n / g;
}

/**
 * For sizes a_1 < ... < a_r with gcd 1: d[p] = the smallest sum of sizes (any multiplicities)
 * that is = p mod a_1, so that m is a sum iff m >= d[m mod a_1] (m - d[m mod a_1] is a
 * multiple of a_1). Round-robin algorithm (Böcker & Lipták 2007, "A fast and simple algorithm
 * for the money changing problem", Algorithmica 48): adding a size a splits the residues into
 * gcd(a_1, a) cycles p -> p + a mod a_1; starting each cycle at its smallest entry, one pass of
 * d[p + a] = min(d[p + a], d[p] + a) around it is exact (a shortest path never wraps the whole
 * cycle). O(r a_1) steps.
 */
export function smallestInResidue(sizes: readonly number[]): Float64Array {
  const a1 = sizes[0];
  const d = new Float64Array(a1).fill(Infinity);
  d[0] = 0;
  for (let i = 1; i < sizes.length; i++) {
    const a = sizes[i];
    const step = a % a1;
    if (step === 0) continue;
    const cycles = gcd(a1, step);
    const cycleLength = a1 / cycles;
    for (let p = 0; p < cycles; p++) {
      // The cycle's smallest entry.
      let start = p;
      for (let q = p, c = 0; c < cycleLength; c++, q = (q + step) % a1) if (d[q] < d[start]) start = q;
      if (d[start] === Infinity) continue;
      for (let q = start, c = 0; c < cycleLength; c++) {
        const next = (q + step) % a1;
        const via = d[q] + a;
        if (via < d[next]) d[next] = via;
        q = next;
      }
    }
  }
  return d;
}

/** Distinct parts from a list: subset-sum reachability (subset-sum-reach.ts; undefined beyond its work bound). */
function subsetSumFeasible(values: readonly number[], n: number): boolean | undefined {
  return subsetSumReachable(values, n);
}

/**
 * Exactly k parts (kMin = kMax) or at most kMax parts (kMin <= 1) from a list, any
 * multiplicities, or undefined. The reduction of length-feasibility.ts: exactly k parts <=> N =
 * n - k s_1 is a sum of at most c = k elements of D = {s - s_1 : s > s_1}; at most K parts <=> N = n
 * is a sum of at most c = K elements of D = S. With d = max D, a sum of C elements with value V
 * from the elements below d, topped up with d's, reaches N iff V <= N and V = N (mod d), using
 * C_V + (N - V) / d elements, i.e. iff d C_V - V <= c d - N: each element e < d costs d - e >= 0.
 * The least cost per residue mod d, and the smallest V with it, by the round-robin pass of
 * smallestInResidue with the lexicographic weight (d - e, e) (the pass is exact for any positive
 * weight per element: a shortest path never wraps a whole cycle). Then: least cost > c d - N:
 * no member; its smallest V <= N: a member; otherwise undecided.
 */
function lengthByRoundRobin(values: readonly number[], n: number, kMin: number, kMax: number): boolean | undefined {
  let D: number[];
  let N: number;
  let c: number;
  if (kMin === kMax) {
    D = values.slice(1).map((s) => s - values[0]);
    N = n - kMin * values[0];
    c = kMin;
    if (N < 0) return false;
  } else if (kMin <= 1) {
    D = values.slice();
    N = n;
    c = kMax;
  } else return undefined;
  if (N === 0) return true;
  if (D.length === 0 || c === 0) return false;
  const d = D[D.length - 1];
  if (N > c * d) return false;
  if (D.length * d > ROUND_ROBIN_LIMIT) return undefined;
  const { cost, value } = residuePaths(D, d);
  const rho = N % d;
  if (cost[rho] === Infinity || cost[rho] > c * d - N) return false;
  return value[rho] <= N ? true : undefined;
}
