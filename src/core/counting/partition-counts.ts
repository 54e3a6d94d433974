import { LimitExceededError } from '../errors.js';
import type { PartitionFamily } from '../family.js';
import { isFeasible } from '../partitions/constrained/feasibility.js';
import {
  contradiction,
  isUnrestricted,
  sizeCount,
  sizeList,
  toSpec,
  type ConstrainedSpec,
} from '../partitions/constrained/spec.js';
import { PartitionNumbers } from './partition-numbers.js';

/**
 * Exact counts of constrained partition families, in BigInt.
 *
 * Limit: COUNT_WORK_LIMIT BigInt additions (3e7, a few seconds at most); a family whose cheapest
 * method needs more throws LimitExceededError. Unrestricted families use p(n) (n <= 100,000).
 * Malformed families throw RangeError; contradictory bounds (minPart > maxPart, length > n) and
 * empty families count 0.
 *
 * Methods, cheapest estimated work first:
 * - "series":   coefficient of q^n in prod_{k in S} 1/(1 - q^k) or prod (1 + q^k) (Andrews 1976,
 *               ch. 1), |S| * n additions; used for allowed lists and part-size bounds;
 * - "by-length": P(m, k) = P(m - 1, k - 1) + P(m - k, k) (exactly k parts, OEIS A008284) with
 *               the maps "subtract minPart - 1 from each part" and, for distinct parts, "subtract
 *               the staircase k(k - 1)/2" (Andrews 1976, §1.3); K * n additions for at most K parts;
 * - "box":      exactly k parts in [lo, hi] are, after subtracting lo (and the staircase), the
 *               partitions in a k x w box, counted by the Gaussian polynomial
 *               [k + w choose k]_q = prod_{i=1..k} (1 - q^(w+i)) / (1 - q^i) (Andrews 1976,
 *               Thm 3.1; DLMF 26.9.4); 2 min(k, w) n additions per length;
 * - "series-by-length": prod_{k in S} 1/(1 - y q^k) (or 1 + y q^k) tracking the number of parts
 *               y, |S| * (L + 1) * n additions: the general fallback.
 */
export const COUNT_WORK_LIMIT = 30_000_000;

interface CountMethod {
  readonly name: string;
  readonly work: number;
  readonly run: () => bigint;
}

const partitionNumbers = new PartitionNumbers();

/** Exact number of partitions in the family (0 when empty). */
export function countPartitions(family: PartitionFamily, workLimit: number = COUNT_WORK_LIMIT): bigint {
  const methods = countMethods(family);
  if (methods === null) return 0n;
  if (typeof methods === 'bigint') return methods;
  const best = methods.reduce((a, b) => (b.work < a.work ? b : a));
  if (best.work > workLimit) {
    throw new LimitExceededError(
      `counting this family needs about ${best.work.toExponential(1)} steps, over the limit of ${workLimit.toExponential(0)}`,
      `count work <= ${workLimit.toExponential(0)}`,
    );
  }
  return best.run();
}

/** Estimated work of the cheapest counting method (0 for families decided without counting). */
export function countWork(family: PartitionFamily): number {
  const methods = countMethods(family);
  if (methods === null || typeof methods === 'bigint') return 0;
  return Math.min(...methods.map((m) => m.work));
}

function countMethods(family: PartitionFamily): CountMethod[] | bigint | null {
  const spec0 = toSpec(family); // validates
  if (contradiction(family) !== null) return null;
  const spec = spec0;
  const { n, distinct, sizes } = spec;
  if (isFeasible(spec, 1e7) === false) return null;
  if (n === 0) return 1n;
  if (isUnrestricted(spec)) {
    if (n > PartitionNumbers.MAX_N) {
      throw new LimitExceededError(
        `the exact number of partitions is computed for n <= ${PartitionNumbers.MAX_N}, got ${n}`,
        `n <= ${PartitionNumbers.MAX_N}`,
      );
    }
    return partitionNumbers.get(n);
  }
  const kMin = spec.length ?? 0;
  const kMax = spec.length ?? spec.maxLength ?? n;
  const hasLength = spec.length !== undefined || (spec.maxLength !== undefined && spec.maxLength < n);
  const r = sizeCount(sizes);
  const methods: CountMethod[] = [];
  if (!hasLength) {
    methods.push({ name: 'series', work: r * n, run: () => series(sizeList(sizes), n, distinct) });
  }
  if (sizes.kind === 'interval' && sizes.hi >= n) {
    const lo = sizes.lo;
    const top = distinct ? Math.min(kMax, Math.ceil(Math.sqrt(2 * n)) + 1) : Math.min(kMax, Math.floor(n / lo));
    methods.push({ name: 'by-length', work: (top + 1) * (n + 1), run: () => byLength(n, lo, distinct, kMin, top) });
  }
  if (sizes.kind === 'interval' && hasLength) {
    const { lo, hi } = sizes;
    let work = 0;
    for (let k = kMin; k <= Math.min(kMax, n); k++) work += 2 * Math.min(k, hi - lo + 1) * (n + 1) + 1;
    methods.push({ name: 'box', work, run: () => boxSum(n, lo, hi, distinct, kMin, kMax) });
  }
  if (hasLength) {
    const L = Math.min(kMax, n);
    methods.push({ name: 'series-by-length', work: r * (L + 1) * (n + 1), run: () => seriesByLength(spec, L) });
  }
  return methods;
}

/** Coefficient of q^n in prod 1/(1 - q^a) (ascending sweep) or prod (1 + q^a) (descending). */
function series(values: readonly number[], n: number, distinct: boolean): bigint {
  const c: bigint[] = new Array(n + 1).fill(0n);
  c[0] = 1n;
  for (const a of values) {
    if (distinct) for (let m = n; m >= a; m--) c[m] += c[m - a];
    else for (let m = a; m <= n; m++) c[m] += c[m - a];
  }
  return c[n];
}

/** Sum over k in [kMin, kMax] of P(n - k(lo - 1) [- k(k - 1)/2], k), rows of P built in turn. */
function byLength(n: number, lo: number, distinct: boolean, kMin: number, kMax: number): bigint {
  const reduced = (k: number) => n - k * (lo - 1) - (distinct ? (k * (k - 1)) / 2 : 0);
  let prev: bigint[] = new Array(n + 1).fill(0n);
  prev[0] = 1n;
  let total = kMin === 0 && n === 0 ? 1n : 0n;
  for (let k = 1; k <= kMax; k++) {
    const row: bigint[] = new Array(n + 1).fill(0n);
    for (let m = k; m <= n; m++) row[m] = prev[m - 1] + row[m - k];
    const target = reduced(k);
    if (k >= kMin && target >= 0) total += row[target];
    prev = row;
  }
  return total;
}

/** Coefficient of q^N in the Gaussian polynomial [k + w choose k]_q: partitions in a k x w box. */
function gaussianCoefficient(N: number, k: number, w: number): bigint {
  if (N < 0 || w < 0 || N > k * w) return 0n;
  const a = Math.min(k, w);
  const b = Math.max(k, w);
  const c: bigint[] = new Array(N + 1).fill(0n);
  c[0] = 1n;
  for (let i = 1; i <= a; i++) {
    const drop = b + i;
    for (let m = N; m >= drop; m--) c[m] -= c[m - drop]; // times (1 - q^(b+i))
    for (let m = i; m <= N; m++) c[m] += c[m - i]; // divided by (1 - q^i)
  }
  return c[N];
}

/** Exactly k parts in [lo, hi] summed over k: boxes of k x (hi - lo) (distinct: k x (hi - lo - k + 1)). */
function boxSum(n: number, lo: number, hi: number, distinct: boolean, kMin: number, kMax: number): bigint {
  let total = 0n;
  for (let k = kMin; k <= Math.min(kMax, n); k++) {
    if (k === 0) {
      if (n === 0) total += 1n;
      continue;
    }
    const stair = distinct ? (k * (k - 1)) / 2 : 0;
    const width = hi - lo - (distinct ? k - 1 : 0);
    total += gaussianCoefficient(n - k * lo - stair, k, width);
  }
  return total;
}

/** prod over sizes of 1/(1 - y q^a) or (1 + y q^a), coefficient of y^l q^n summed over allowed l. */
function seriesByLength(spec: ConstrainedSpec, L: number): bigint {
  const { n, distinct } = spec;
  const width = n + 1;
  const c: bigint[] = new Array((L + 1) * width).fill(0n);
  c[0] = 1n;
  for (const a of sizeList(spec.sizes)) {
    if (distinct) {
      for (let l = L; l >= 1; l--) {
        for (let m = n; m >= a; m--) c[l * width + m] += c[(l - 1) * width + m - a];
      }
    } else {
      for (let l = 1; l <= L; l++) {
        for (let m = a; m <= n; m++) c[l * width + m] += c[(l - 1) * width + m - a];
      }
    }
  }
  let total = 0n;
  for (let l = spec.length ?? 0; l <= L; l++) total += c[l * width + n];
  return total;
}
