import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import { designMoments, drawDesign, logGaussianBinomial, solveDesignTilt } from './subset-design.js';
import { conjugate } from './transforms.js';

/**
 * A box: partitions of `size` with at most `rows` parts, each at most `cols` (cols may be
 * Infinity). Counted by the Gaussian binomial [rows + cols choose rows]_q (Andrews 1976, Thm 3.1).
 */
export interface Box {
  readonly rows: number;
  readonly cols: number;
  readonly size: number;
}

/** Basic steps per element of one design draw (two uniforms, a logarithm, sometimes an exponential). */
const STEPS_PER_ELEMENT = 3;

/**
 * How a box is sampled (see BoxSubset): the k x b box after conjugation, its size m after
 * complementing, and the design's tilt s = -ln x >= 0.
 */
export class BoxDesign {
  /** Rows of the box actually sampled (after conjugation): k = min(rows, cols). */
  readonly k: number;
  /** Columns of the sampled box. */
  readonly b: number;
  /** Size of the sampled box partition (after complementing). */
  readonly m: number;
  readonly conjugated: boolean;
  readonly complemented: boolean;
  readonly s: number;
  /** A single member (k <= 1 or nothing to place): drawn with probability 1. */
  readonly single: boolean;
  /** Mean proposals per sample (local limit estimate; >= 1). */
  readonly expectedProposals: number;
  /** Basic steps per proposal. */
  readonly proposalCost: number;

  private readonly givenLogSuccess?: number;

  /**
   * `tilt`: a start for the tilt solver, or (with `given`) the tilt to use as it is, together
   * with the design's variance and logSuccessPerMember already computed for it (box-mixture.ts
   * computes them incrementally across boxes).
   */
  constructor(
    readonly box: Box,
    tilt?: number,
    given?: { readonly variance: number; readonly logSuccess: number },
  ) {
    const { rows, cols, size } = box;
    if (!(size >= 0 && rows >= 0 && cols >= 0) || !(size <= rows * cols || size === 0)) {
      throw new RangeError(`no partition of ${size} fits in a ${rows} x ${cols} box`);
    }
    this.conjugated = cols < rows;
    this.k = this.conjugated ? cols : rows;
    this.b = this.conjugated ? rows : cols;
    this.complemented = this.b !== Infinity && size > (this.k * this.b) / 2;
    this.m = this.complemented ? this.k * this.b - size : size;
    this.single = this.k <= 1 || this.m === 0;
    if (this.single) {
      this.s = 0;
      this.expectedProposals = 1;
      this.proposalCost = 1;
      return;
    }
    let variance: number;
    if (given !== undefined && tilt !== undefined) {
      variance = given.variance;
      this.givenLogSuccess = given.logSuccess;
    } else {
      tilt = solveDesignTilt(this.k, this.b, this.m, tilt);
      variance = designMoments(this.k, this.b, tilt).variance;
      if (this.b !== Infinity && tilt * Math.sqrt(variance) < 1e-3) {
        // So close to half full that x = 1 costs under 1e-6 of the acceptance rate (the
        // design's mean moves by s Var, i.e. s sd standard deviations) and needs no exponentials.
        tilt = 0;
        variance = designMoments(this.k, this.b, 0).variance;
      }
    }
    this.s = tilt;
    const hit = Math.min(1, 1 / Math.sqrt(2 * Math.PI * variance));
    this.expectedProposals = Math.max(1, 1 / Math.min(1, this.lastPartWeight() * hit));
    this.proposalCost = STEPS_PER_ELEMENT * this.k + Math.log2(this.k + 1);
  }

  /** sum_(u=0..b) x^u: the weight of the last part's range. */
  private lastPartWeight(): number {
    const { s, b } = this;
    if (s === 0) return b + 1;
    if (b === Infinity) return 1 / -Math.expm1(-s);
    return Math.expm1(-s * (b + 1)) / Math.expm1(-s);
  }

  /**
   * ln of the exact probability that one proposal succeeds, divided by the number of members:
   * x^W (1 + x^-1 + ... + x^-(k-1)) / e_(k-1)(1, x, ..., x^(N-1)) with W = m + k(k-1)/2,
   * N = k + b, e_j = x^(j(j-1)/2) [N choose j]_x (see BoxSubset). 0 for a single member. Sums of
   * about k logarithms: relative error below ~k * 1e-15.
   */
  logSuccessPerMember(): number {
    if (this.single) return 0;
    if (this.givenLogSuccess !== undefined) return this.givenLogSuccess;
    const { k, b, m, s } = this;
    return logSuccessFromBinomial(k, m, s, logGaussianBinomial(k + b, k - 1, s));
  }
}

/**
 * BoxDesign.logSuccessPerMember from ln [N choose k-1]_x (N = k + b): -s W + ln(ranks) - ln e_(k-1),
 * W = m + k(k-1)/2, ln(1 + x^-1 + ... + x^-(k-1)) = s (k - 1) + ln((1 - x^k) / (1 - x)),
 * ln e_(k-1) = -s (k-1)(k-2)/2 + ln [N choose k-1]_x.
 */
export function logSuccessFromBinomial(k: number, m: number, s: number, logBinomial: number): number {
  const W = m + (k * (k - 1)) / 2;
  const logRanks = s === 0 ? Math.log(k) : s * (k - 1) + Math.log(Math.expm1(-s * k) / Math.expm1(-s));
  return -s * W + logRanks + s * (((k - 1) * (k - 2)) / 2) - logBinomial;
}

/**
 * Exact uniform partitions in a box, by probabilistic divide-and-conquer with a deterministic
 * last step (Arratia & DeSalvo 2016, CPC 25, §3.3) on the stars-and-bars encoding.
 *
 * After conjugating so that k = min(rows, cols) is the number of rows, and complementing in the
 * box when the size is over half its area (both bijections, Andrews 1976, §3.2), a partition in
 * the k x b box is a k-subset T of [0, N), N = k + b, with sum W = size + k(k-1)/2
 * (subset-design.ts). A proposal draws a (k-1)-subset S from the design at x = e^(-s) (tilt s
 * solved so that the design's mean size is the target), takes the last element w = W - sum(S),
 * and keeps T = S + {w} when w is a free position, with probability x^u, where u = w - (rank of w
 * in T) is the part w encodes (0 <= u <= b). Then for every member T with elements w_1 < ... < w_k,
 *   P(T) = sum_r P(S = T - w_r) x^(u_r) = sum_r x^(W - w_r) x^(w_r - (r - 1)) / e_(k-1)
 *        = x^W (1 + x^-1 + ... + x^-(k-1)) / e_(k-1),
 * the same for every member: exactly uniform. The acceptance rate per proposal is
 * (1 + x + ... + x^b) P(design size = target) (sum the same identity over the members), about
 * (b + 1) / (2.5 sd) at x = 1: of order sqrt(k) proposals, whatever the size.
 *
 * Method id "box-subset/1" (the planner adds the maps that carry its boxes onto the families:
 * minPart shift, staircase, zero rows).
 */
export class BoxSubset {
  readonly design: BoxDesign;
  private readonly buffer: Float64Array;

  constructor(box: Box | BoxDesign, buffer?: Float64Array) {
    this.design = box instanceof BoxDesign ? box : new BoxDesign(box);
    this.buffer = buffer ?? new Float64Array(Math.max(1, this.design.k));
  }

  /** The box partition's parts (its nonzero rows), largest first, in multiplicity form. */
  sample(source: RandomSource): Partition {
    let result: Partition | null = null;
    while (result === null) result = this.propose(source);
    return result;
  }

  /** One proposal: the box partition, or null when rejected. */
  propose(source: RandomSource): Partition | null {
    const d = this.design;
    const { k, b, m, s } = d;
    if (d.single) {
      const values = new Float64Array(k);
      if (k === 1) values[0] = m;
      return this.toPartition(values);
    }
    const others = this.buffer;
    const positions = k + b;
    const target = m + (k * (k - 1)) / 2;
    const drawn = drawDesign(source, k - 1, positions, s, others, target);
    if (drawn < 0) return null;
    const w = target - drawn;
    if (w < 0 || w >= positions) return null;
    // Rank of w among the others (binary search on the ascending draw).
    let lo = 0;
    let hi = k - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (others[mid] < w) lo = mid + 1;
      else hi = mid;
    }
    if (lo < k - 1 && others[lo] === w) return null;
    const u = w - lo;
    if (s > 0 && !(source.nextDouble() < Math.exp(-s * u))) return null;
    const values = new Float64Array(k);
    for (let i = 0; i < lo; i++) values[i] = others[i] - i;
    values[lo] = u;
    for (let i = lo + 1; i < k; i++) values[i] = others[i - 1] - i;
    return this.toPartition(values);
  }

  /** Ascending parts (zeros included) of the sampled k x b partition -> the box partition. */
  private toPartition(values: Float64Array): Partition {
    const { k, b, complemented, conjugated } = this.design;
    const sizes: number[] = [];
    const multiplicities: number[] = [];
    const push = (part: number) => {
      if (part === 0) return;
      const last = sizes.length - 1;
      if (last >= 0 && sizes[last] === part) multiplicities[last]++;
      else {
        sizes.push(part);
        multiplicities.push(1);
      }
    };
    if (complemented) for (let i = 0; i < k; i++) push(b - values[i]);
    else for (let i = k - 1; i >= 0; i--) push(values[i]);
    const partition = { sizes, multiplicities };
    return conjugated ? conjugate(partition) : partition;
  }
}
