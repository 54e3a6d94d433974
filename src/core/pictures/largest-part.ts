import { EmptyFamilyError, LimitExceededError } from '../errors.js';
import type { PartitionFamily } from '../family.js';

/** Largest n for which the exact law of the largest part is tabulated (O(n · sizes) additions). */
export const EXACT_LARGEST_PART_MAX_N = 5000;

/** Cap on the additions one exact table may take (length constraints make the table 2-D). */
export const EXACT_TABLE_MAX_WORK = 40_000_000;

/** The part sizes a family allows, ascending. */
export function allowedSizes(family: PartitionFamily): number[] {
  const low = family.minPart ?? 1;
  const high = Math.min(family.maxPart ?? family.n, family.n);
  if (family.allowed) return family.allowed.filter((s) => s >= low && s <= high);
  const sizes: number[] = [];
  for (let s = low; s <= high; s++) sizes.push(s);
  return sizes;
}

/**
 * The exact law of the largest part of a uniform member of the family: probabilities[m] is
 * P(λ1 = m), for m = 0..n.
 *
 * Generating functions (Andrews, The Theory of Partitions, 1976, ch. 1): partitions with parts in
 * a set S have GF Π_{s∈S} 1/(1 − q^s), into distinct parts Π_{s∈S} (1 + q^s). Multiplying in the
 * factors in increasing s, the coefficient of q^n gains exactly the members whose largest part
 * is s, so the count with λ1 = s is c_s(n) − c_{s−}(n). With a length constraint the GF carries a
 * second variable z marking parts (Π 1/(1 − z q^s)) and the table is indexed by (parts, size).
 * Counts are doubles: sums of positive terms, relative error about n·2^-53, and p(5000) ≈ 1.7e74
 * is far from overflow.
 */
export function largestPartLaw(family: PartitionFamily): { probabilities: Float64Array; count: number } {
  const n = family.n;
  if (n > EXACT_LARGEST_PART_MAX_N) {
    throw new LimitExceededError(`the exact law of the largest part is tabulated for n up to ${EXACT_LARGEST_PART_MAX_N}`, `n <= ${EXACT_LARGEST_PART_MAX_N}`);
  }
  const sizes = allowedSizes(family);
  const byLargest = new Float64Array(n + 1);
  const maxParts = family.length ?? family.maxLength;
  if (n === 0) {
    byLargest[0] = maxParts === undefined || family.length === undefined || family.length === 0 ? 1 : 0;
  } else if (maxParts === undefined) {
    const ways = new Float64Array(n + 1);
    ways[0] = 1;
    for (const s of sizes) {
      const before = ways[n];
      if (family.distinct) for (let k = n; k >= s; k--) ways[k] += ways[k - s];
      else for (let k = s; k <= n; k++) ways[k] += ways[k - s];
      byLargest[s] = ways[n] - before;
    }
  } else {
    const rows = Math.min(maxParts, n);
    const work = (rows + 1) * (n + 1) * sizes.length;
    if (work > EXACT_TABLE_MAX_WORK) {
      throw new LimitExceededError(
        `the exact law of the largest part with a length constraint needs about ${work.toExponential(1)} additions here; the limit is ${EXACT_TABLE_MAX_WORK.toExponential(1)}`,
        `work <= ${EXACT_TABLE_MAX_WORK}`,
      );
    }
    // ways[j][k]: members of size k with j parts, using the sizes multiplied in so far.
    const ways = Array.from({ length: rows + 1 }, () => new Float64Array(n + 1));
    ways[0][0] = 1;
    const atN = (): number => {
      if (family.length !== undefined) return family.length <= rows ? ways[family.length][n] : 0;
      let total = 0;
      for (let j = 0; j <= rows; j++) total += ways[j][n];
      return total;
    };
    for (const s of sizes) {
      const before = atN();
      if (family.distinct) {
        for (let j = rows; j >= 1; j--) for (let k = n; k >= s; k--) ways[j][k] += ways[j - 1][k - s];
      } else {
        for (let j = 1; j <= rows; j++) for (let k = s; k <= n; k++) ways[j][k] += ways[j - 1][k - s];
      }
      byLargest[s] = atN() - before;
    }
  }
  let count = 0;
  for (const c of byLargest) count += c;
  if (!(count > 0)) throw new EmptyFamilyError(`no partition of ${n} satisfies these constraints`);
  const probabilities = new Float64Array(n + 1);
  for (let m = 0; m <= n; m++) probabilities[m] = byLargest[m] / count;
  return { probabilities, count };
}

/**
 * The Erdős–Lehner law (Erdős & Lehner 1941, Duke Math. J. 8, Thm 1.1): for a uniform partition
 * of n, (λ1 − a ln a)/a tends to the standard Gumbel law, a = √n / c with c = π/√6, i.e.
 * a = √(6n)/π. For partitions into distinct parts the same scaling holds with c = π/√12: in the
 * Boltzmann model the multiplicities are independent Bernoulli(x^k/(1 + x^k)), x = e^{−c/√n}, so
 * P(λ1 ≤ m) = Π_{k>m} 1/(1 + x^k) ≈ exp(−(√n/c) e^{−cm/√n}) (derived here as in Fristedt 1993 for
 * the unrestricted case), again Gumbel with a = √n/c. Returns the centring and scale.
 */
export function gumbelScaling(n: number, distinct: boolean): { a: number; location: number; c: number } {
  const c = distinct ? Math.PI / Math.sqrt(12) : Math.PI / Math.sqrt(6);
  const a = Math.sqrt(n) / c;
  return { a, location: a * Math.log(a), c };
}
