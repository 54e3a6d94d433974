import { EmptyFamilyError, LimitExceededError } from '../errors.js';
import type { PartitionFamily } from '../family.js';
import { LogDistinctPartitionNumbers } from '../counting/log-distinct-partition-number.js';
import { LogPartitionNumbers } from '../counting/log-partition-number.js';

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

/** P(λ1 > m) below this is left in one tail cell by the truncated exact law. */
export const LARGEST_PART_TAIL = 1e-15;

/**
 * Largest n for which truncatedLargestPartLaw tabulates the unconstrained (resp. distinct-parts)
 * family within EXACT_TABLE_MAX_WORK additions: truncatedLawWork at these n is just below the cap
 * (measured maxima 13653 and 11602; test/pictures/largest-part-law.test.ts checks the cap holds).
 */
export const TRUNCATED_LAW_MAX_N = { unrestricted: 13_600, distinct: 11_600 } as const;

/**
 * The smallest m with P(λ1 > m) < LARGEST_PART_TAIL, from the union bound
 * P(λ1 > m) <= Σ_{k>m} P(k is a part), and P(k is a part) = p(n − k)/p(n) (remove one k), resp.
 * <= q(n − k)/q(n) for distinct parts (remove k: a distinct partition of n − k without k).
 */
export function largestPartCut(n: number, distinct: boolean): number {
  const logs = distinct ? new LogDistinctPartitionNumbers() : new LogPartitionNumbers();
  let tail = 0;
  for (let m = n - 1; m >= 0; m--) {
    tail += Math.exp(logs.logRatio(n - (m + 1), n));
    if (tail >= LARGEST_PART_TAIL) return Math.min(n, m + 1);
  }
  return 0;
}

/** The additions truncatedLargestPartLaw makes: Σ_{s=1}^{cut} (n − s + 1). */
export function truncatedLawWork(n: number, distinct: boolean): number {
  const cut = largestPartCut(n, distinct);
  return cut * (n + 1) - (cut * (cut - 1)) / 2;
}

/**
 * The exact law of the largest part of a uniform partition of n (unconstrained, or into distinct
 * parts), truncated where the tail is negligible: probabilities[m] = P(λ1 = m) for m <= cut, and
 * probabilities[cut + 1] = P(λ1 > cut) (< LARGEST_PART_TAIL, computed as 1 − the rest).
 *
 * The same table as largestPartLaw multiplies in the factors 1/(1 − q^s) (resp. 1 + q^s) only for
 * s <= cut, so it costs n·cut additions instead of n², and the total count comes independently
 * from log p(n) (Rademacher) or log q(n) (Hua). No scaling is needed: within the work cap
 * (n <= 13600) the largest entry p(n) ≈ 1e127, far from the double range's end; a
 * non-finite entry is refused all the same. Relative rounding of each entry about cut·2^-53.
 */
export function truncatedLargestPartLaw(n: number, distinct: boolean): { probabilities: Float64Array; cut: number; work: number } {
  const work = truncatedLawWork(n, distinct);
  if (work > EXACT_TABLE_MAX_WORK) {
    throw new LimitExceededError(
      `the exact law of the largest part needs about ${work.toExponential(1)} additions at n = ${n}; the limit is ${EXACT_TABLE_MAX_WORK.toExponential(1)}`,
      `n <= ${distinct ? TRUNCATED_LAW_MAX_N.distinct : TRUNCATED_LAW_MAX_N.unrestricted}`,
    );
  }
  const cut = largestPartCut(n, distinct);
  const logCount = distinct ? new LogDistinctPartitionNumbers().log(n) : new LogPartitionNumbers().log(n);
  const ways = new Float64Array(n + 1);
  ways[0] = 1;
  const probabilities = new Float64Array(cut + 2);
  if (n === 0) probabilities[0] = 1;
  let kept = 0;
  for (let s = 1; s <= cut; s++) {
    const before = ways[n];
    if (distinct) for (let k = n; k >= s; k--) ways[k] += ways[k - s];
    else for (let k = s; k <= n; k++) ways[k] += ways[k - s];
    probabilities[s] = Math.exp(Math.log(ways[n] - before) - logCount);
    if (ways[n] === before) probabilities[s] = 0;
    kept += probabilities[s];
  }
  if (!Number.isFinite(ways[n])) throw new RangeError(`the largest-part table overflowed at n = ${n}`);
  if (n > 0) probabilities[cut + 1] = Math.max(0, 1 - kept);
  return { probabilities, cut, work };
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
