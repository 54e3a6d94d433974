import type { PartitionFamily } from '../family.js';
import type { Partition } from '../partition.js';
import { EXACT_LARGEST_PART_MAX_N, gumbelScaling, largestPartLaw, TRUNCATED_LAW_MAX_N, truncatedLargestPartLaw } from './largest-part.js';
import { onesLaw, onesQuantity, onesStatistic } from './ones.js';
import { BoundaryAverage, boundaryGrid, DISTINCT_LIMIT_SHAPE, PARTITION_LIMIT_SHAPE, type LimitShape } from './limit-shape.js';
import { exactLawReport, type ExactLawReport, gumbelCdf, integerKolmogorovSmirnov, type ChiSquareCell } from './statistics.js';
import { LimitExceededError } from '../errors.js';

/** The false-alarm level the check's verdict uses (one test per request). */
export const CHECK_ALPHA = 1e-4;

/** What the largest part looked like, against which law, and how well it fits. */
export interface LargestPartReport {
  /** "exact": counting tables; "erdos-lehner-gumbel": the asymptotic Gumbel law (large n). */
  readonly law: 'exact' | 'erdos-lehner-gumbel';
  readonly test: 'chi-square' | 'kolmogorov-smirnov';
  readonly statistic: number;
  readonly pValue: number | null;
  /** Degrees of freedom (chi-square only). */
  readonly degreesOfFreedom?: number;
  /** Observed counts: observed[v] samples had largest part offset + v. */
  readonly offset: number;
  readonly observed: number[];
  /** Expected probabilities of offset + v (exact law), or P(λ1 ≤ offset + v + 1/2) under the Gumbel law. */
  readonly expected: number[];
  /** Chi-square cells after pooling (exact law only). */
  readonly cells?: readonly ChiSquareCell[];
  /** Gumbel centring and scale: (λ1 − location)/scale is compared with the standard Gumbel law. */
  readonly gumbel?: { readonly location: number; readonly scale: number };
  /** true for the Gumbel law: a limit law, its p-value is shown but not used for `passed`. */
  readonly asymptotic?: boolean;
}

/** A statistic with an exact law at every n (ones.ts), tested by chi-square. */
export interface OnesReport extends ExactLawReport {
  readonly quantity: string;
}

/** The test `passed` comes from: always against an exact law, at alpha = CHECK_ALPHA. */
export interface Verdict {
  readonly quantity: string;
  readonly law: 'exact';
  readonly test: 'chi-square';
  readonly statistic: number;
  readonly pValue: number | null;
  readonly degreesOfFreedom: number;
}

export interface BoundaryReport {
  readonly curve: LimitShape['name'];
  readonly equation: string;
  readonly c: number;
  readonly points: { x: number; mean: number; limit: number }[];
  /** Largest |mean − limit| over the points: shrinks like O(log n / √n) plus noise. */
  readonly maxDeviation: number;
}

export interface PartitionCheckReport {
  readonly samples: number;
  readonly largestPart: LargestPartReport;
  /** null for families without a known limit shape (any constraint but distinct). */
  readonly boundary: BoundaryReport | null;
  /** The exact law of the ones statistic (unconstrained or distinct families; null otherwise). */
  readonly ones: OnesReport | null;
  /** The exact-law test `passed` uses: the largest part where its exact law is tabulated, else ones. */
  readonly verdict: Verdict;
}

/** The limit shape of a family, if one is known: unconstrained or distinct parts only. */
export function limitShapeOf(family: PartitionFamily): LimitShape | null {
  const others = family.minPart !== undefined || family.maxPart !== undefined || family.length !== undefined || family.maxLength !== undefined || family.allowed !== undefined;
  if (others) return null;
  return family.distinct ? DISTINCT_LIMIT_SHAPE : PARTITION_LIMIT_SHAPE;
}

/**
 * Checks samples claimed to be uniform members of `family`: the law of the largest part
 * (exact for n <= EXACT_LARGEST_PART_MAX_N, otherwise Erdős–Lehner's Gumbel law, which exists
 * for the unconstrained and distinct-parts families only) and the mean scaled boundary against
 * the limit shape. Any source of partitions can be fed in, which is how the tests show that a
 * biased generator fails.
 */
export function checkPartitionSamples(family: PartitionFamily, samples: Iterable<Partition>): PartitionCheckReport {
  const n = family.n;
  const shape = limitShapeOf(family);
  const distinct = family.distinct === true;
  const truncatedReach = distinct ? TRUNCATED_LAW_MAX_N.distinct : TRUNCATED_LAW_MAX_N.unrestricted;
  const truncated = shape !== null && n > EXACT_LARGEST_PART_MAX_N && n <= truncatedReach;
  const exact = n <= EXACT_LARGEST_PART_MAX_N || truncated;
  if (!exact && shape === null) {
    throw new LimitExceededError(
      `for n above ${EXACT_LARGEST_PART_MAX_N} the check knows a law only for unconstrained or distinct-parts partitions`,
      `n <= ${EXACT_LARGEST_PART_MAX_N} with these constraints`,
    );
  }
  const law = truncated ? truncatedLargestPartLaw(n, distinct) : exact ? largestPartLaw(family) : null;
  const ones = new Map<number, number>();
  const xs = shape && n > 0 ? boundaryGrid(shape) : [];
  const boundary = new BoundaryAverage(n, xs);
  const largest = new Map<number, number>();
  let total = 0;
  for (const partition of samples) {
    const top = partition.sizes.length > 0 ? partition.sizes[0] : 0;
    largest.set(top, (largest.get(top) ?? 0) + 1);
    if (xs.length > 0) boundary.add(partition);
    if (shape) {
      const x = onesStatistic(partition, distinct);
      ones.set(x, (ones.get(x) ?? 0) + 1);
    }
    total++;
  }
  const largestPart = law ? exactReport(law.probabilities, largest) : gumbelReport(n, distinct, largest);
  const onesReport = shape ? onesExactReport(n, distinct, ones) : null;
  let boundaryReport: BoundaryReport | null = null;
  if (shape && xs.length > 0 && total > 0) {
    const means = boundary.means();
    const points = xs.map((x, i) => ({ x, mean: means[i], limit: shape.y(x) }));
    boundaryReport = {
      curve: shape.name,
      equation: shape.equation,
      c: shape.c,
      points,
      maxDeviation: Math.max(...points.map((p) => Math.abs(p.mean - p.limit))),
    };
  }
  const source = largestPart.law === 'exact' ? { quantity: 'largest part', report: largestPart } : { quantity: onesReport!.quantity, report: onesReport! };
  const verdict: Verdict = {
    quantity: source.quantity,
    law: 'exact',
    test: 'chi-square',
    statistic: source.report.statistic,
    pValue: source.report.pValue,
    degreesOfFreedom: source.report.degreesOfFreedom!,
  };
  return { samples: total, largestPart, boundary: boundaryReport, ones: onesReport, verdict };
}

function onesExactReport(n: number, distinct: boolean, counts: Map<number, number>): OnesReport {
  const top = counts.size > 0 ? Math.max(...counts.keys()) : 0;
  const law = onesLaw(n, distinct, top);
  const report = exactReport(law, counts);
  return { quantity: onesQuantity(distinct), ...(report as ExactLawReport) };
}

function exactReport(probabilities: Float64Array, largest: Map<number, number>): LargestPartReport {
  // The support is trimmed to where the law or the data has mass, so the report stays small.
  let lo = probabilities.length - 1;
  let hi = 0;
  for (let m = 0; m < probabilities.length; m++) {
    if (probabilities[m] > 1e-12 || (largest.get(m) ?? 0) > 0) {
      lo = Math.min(lo, m);
      hi = Math.max(hi, m);
    }
  }
  for (const m of largest.keys()) {
    lo = Math.min(lo, m);
    hi = Math.max(hi, m);
  }
  if (hi < lo) [lo, hi] = [0, 0];
  const observed: number[] = [];
  const expected: number[] = [];
  for (let m = lo; m <= hi; m++) {
    observed.push(largest.get(m) ?? 0);
    expected.push(m < probabilities.length ? probabilities[m] : 0);
  }
  // Mass trimmed away (below 1e-12 per value) is added to the end cells so the law sums to 1.
  const kept = expected.reduce((a, b) => a + b, 0);
  if (expected.length > 0) expected[expected.length - 1] += Math.max(0, 1 - kept);
  return exactLawReport(observed, expected, lo);
}

function gumbelReport(n: number, distinct: boolean, largest: Map<number, number>): LargestPartReport {
  const { a, location } = gumbelScaling(n, distinct);
  const values = [...largest.keys()];
  const lo = values.length > 0 ? Math.min(...values) : Math.round(location);
  const hi = values.length > 0 ? Math.max(...values) : lo;
  const observed: number[] = [];
  const expected: number[] = [];
  const cdf = (m: number): number => gumbelCdf((m - location) / a);
  for (let m = lo; m <= hi; m++) {
    observed.push(largest.get(m) ?? 0);
    expected.push(cdf(m + 0.5));
  }
  const result = integerKolmogorovSmirnov(observed, lo, cdf);
  return {
    law: 'erdos-lehner-gumbel',
    test: 'kolmogorov-smirnov',
    statistic: result.statistic,
    pValue: result.pValue,
    offset: lo,
    observed,
    expected,
    gumbel: { location, scale: a },
    asymptotic: true,
  };
}
