import { listLengthFeasible } from './length-feasibility.js';
import { subsetSumReachable } from './subset-sum-reach.js';
import { gcd, sizeCount, sizeGcd, type ConstrainedSpec, type SizeSet } from './spec.js';

/**
 * Whether a family has at least one member, decided without counting where a closed form
 * exists. Boltzmann samplers loop forever on an empty family, so the planner asks this first.
 * Returns undefined when deciding would cost more than `workLimit` steps (the caller then uses
 * a counting table, which decides emptiness by itself).
 */
export function isFeasible(spec: ConstrainedSpec, workLimit = 1e8): boolean | undefined {
  const { n, sizes, distinct } = spec;
  if (n === 0) return spec.length === undefined || spec.length === 0;
  if (sizeCount(sizes) === 0) return false;
  let kMin = 1;
  let kMax = spec.length ?? spec.maxLength ?? n;
  if (spec.length !== undefined) kMin = spec.length;
  if (kMin > kMax || kMax === 0) return false;
  if (sizes.kind === 'interval') return intervalFeasible(n, sizes.lo, sizes.hi, distinct, kMin, kMax);
  if (spec.length !== undefined || spec.maxLength !== undefined) return listLengthFeasible(sizes.values, n, kMin, kMax, distinct);
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
