import { listLengthFeasible } from './length-feasibility.js';
import { subsetSumReachable } from './subset-sum-reach.js';
import { sizeCount, sizeGcd, type ConstrainedSpec, type SizeSet } from './spec.js';

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
 * multiple of g is reachable; below it, a reachability table.
 */
function listFeasible(values: readonly number[], n: number, workLimit: number): boolean | undefined {
  const g = sizeGcd({ kind: 'list', values });
  if (n % g !== 0) return false;
  const first = values[0] / g;
  const last = values[values.length - 1] / g;
  if (n / g >= (first - 1) * (last - 1)) return true;
  if (values.length * n > workLimit) return undefined;
  const reach = new Uint8Array(n + 1);
  reach[0] = 1;
  for (const a of values) for (let m = a; m <= n; m++) if (reach[m - a]) reach[m] = 1;
  return reach[n] === 1;
}

/** Distinct parts from a list: subset-sum reachability (subset-sum-reach.ts; undefined beyond its work bound). */
function subsetSumFeasible(values: readonly number[], n: number): boolean | undefined {
  return subsetSumReachable(values, n);
}
