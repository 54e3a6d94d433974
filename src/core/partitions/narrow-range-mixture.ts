import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import { BoxMixture, MixtureSetupExceeded, mixtureWeights, type MixtureEntry } from './constrained/box-mixture.js';
import { BoxRotation } from './constrained/box-rotation.js';
import { BoxSubset, type Box } from './constrained/box-subset.js';
import { exactBox, shiftMap, staircaseMap } from './constrained/box-maps.js';
import { logQPochhammer } from './constrained/subset-design.js';
import { logGamma } from '../counting/binomial.js';

/**
 * Exact uniform partitions of n into parts in a narrow range [a, b] of large sizes (2 <= a < b < n),
 * where the number of parts k lies between ⌈n/b⌉ and ⌊n/a⌋ and few values of k carry the family.
 *
 * With exactly k parts, the parts minus a form a partition of n − k a with at most k parts, each
 * at most b − a: the k × (b − a) box (Andrews 1976, ch. 3), so the family is the disjoint union over
 * k of boxes, box k with c(k) members (not known). Each k gets an exact box sampler whose success
 * probability per proposal is c(k) g(k) with g(k) known in closed form:
 * - near half full, box-rotation (box-rotation.ts): uniform k'-subsets of Z_M shifted onto the box's
 *   size, k' = min(k, b − a), every member produced with probability g = M / (C(M, k') d) per
 *   proposal (d = gcd(k', M));
 * - elsewhere, box-subset's tilted design (box-subset.ts), g = exp(BoxDesign.logSuccessPerMember),
 *   the designs walked from one k to the next as box-mixture.ts does (built by it).
 * For each k the cheaper of the two (estimated time per sample) is used. The mixture is made exact
 * by drawing k with probability ∝ 1 / g(k) and restarting that choice after every failed proposal
 * (rejection from a mixture, Devroye 1986, §II.3): P(k) ∝ (1 / g(k)) c(k) g(k) = c(k), and within k
 * a uniform member. Weights below 2^−1074 of the largest underflow to 0 (as in box-mixture.ts).
 *
 * Box-mixture alone serves these families with box-subset at every k; where boxes are near half
 * full (the centre of the law of k, for a narrow range of large parts) box-rotation's proposals
 * cost O(k') draws against box-subset's thinning over k' + k positions: ~5x fewer nanoseconds per
 * sample at n = 8.4e8, parts in [55093, 58395] (`npm run bench -- shapes`, narrow-huge rows).
 *
 * Distinct parts (option `distinct`): k distinct parts in [a, b] less the staircase (k − 1, ..., 1, 0)
 * and a are a partition of n − k a − k(k − 1)/2 into at most k parts <= b − a − k + 1 (box-maps.ts's
 * staircase), so the family is again a union over k of boxes, k from the least with
 * k b − k(k − 1)/2 >= n to the most with k a + k(k − 1)/2 <= n; the same mixture serves it.
 *
 * Method id "narrow-range-mixture/1".
 */
export class NarrowRangeMixture implements PartitionSampler {
  readonly method = 'narrow-range-mixture/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  /** In box-rotation draws (its 50 ns row; box-subset's steps converted). */
  readonly expectedWork: number;
  /** Box-mixture setup steps plus the rotation boxes' binomial sums (box-mixture's 60 ns unit). */
  readonly setupWork: number;
  /** Numbers of parts, their samplers and the boxes' share of proposals (cumulative 1 / g). */
  private readonly parts: number[];
  private readonly proposers: Array<(source: RandomSource) => Partition | null>;
  private readonly cumulative: Float64Array;
  /** Which k use box-rotation (tests). */
  readonly rotated: readonly boolean[];

  /** `rotation`: 'never' uses box-subset at every k, 'always' box-rotation wherever it applies with at most 64 expected proposals (tests; default by estimate). */
  constructor(
    readonly n: number,
    readonly a: number,
    readonly b: number,
    options: { readonly rotation?: 'auto' | 'never' | 'always'; readonly setupLimit?: number; readonly distinct?: boolean } = {},
  ) {
    const distinct = options.distinct === true;
    if (!Number.isInteger(a) || !Number.isInteger(b) || !Number.isInteger(n) || a < 1 || b <= a || b >= n) {
      throw new RangeError(`need integers 1 <= a < b < n, got a = ${a}, b = ${b}, n = ${n}`);
    }
    const entries = heavyEntries(narrowEntries(n, a, b, distinct), n, a, b, distinct);
    if (entries.length === 0) throw new RangeError(`no partition of ${n} into ${distinct ? 'distinct ' : ''}parts in [${a}, ${b}]`);
    const mixture = new BoxMixture(entries, (_k, rows) => rows, (k) => k, { polish: false, setupLimit: options.setupLimit });
    let setup = mixture.estimates.setupWork;
    const logWeights: number[] = [];
    const rates: number[] = [];
    const costs: number[] = [];
    const rotated: boolean[] = [];
    this.proposers = [];
    let widest = 1;
    for (const d of mixture.designs) widest = Math.max(widest, d.k);
    const buffer = new Float64Array(widest);
    entries.forEach((entry, i) => {
      const design = mixture.designs[i];
      const subsetCost = design.proposalCost * (design.single || design.b === Infinity || design.s === 0 ? 1 : BOUNDED_STEP_COST) * SUBSET_DRAWS_PER_STEP;
      const subsetWork = design.expectedProposals * subsetCost;
      const rotation = options.rotation === 'never' ? null : rotationEstimate(entry.box);
      const rotationWork = rotation === null ? Infinity : rotation.expectedProposals * rotation.proposalCost + rotation.placeCost;
      const k = entry.parts;
      const map = distinct ? staircaseMap(a, k) : shiftMap(a, k);
      if (rotation !== null && (rotationWork < subsetWork || (options.rotation === 'always' && rotation.expectedProposals <= 64))) {
        const sampler = new BoxRotation(entry.box);
        const { k: side, M, d } = sampler.estimate;
        logWeights.push(logBinomial(M, side) + Math.log(d) - Math.log(M));
        setup += side / 8;
        rates.push(1 / rotation.expectedProposals);
        costs.push(rotation.proposalCost);
        rotated.push(true);
        this.proposers.push((source) => {
          const rows = sampler.propose(source);
          return rows === null ? null : map(rows);
        });
      } else {
        const sampler = new BoxSubset(design, buffer);
        logWeights.push(-design.logSuccessPerMember());
        rates.push(1 / design.expectedProposals);
        costs.push(subsetCost);
        rotated.push(false);
        this.proposers.push((source) => {
          const rows = sampler.propose(source);
          return rows === null ? null : map(rows);
        });
      }
    });
    this.rotated = rotated;
    this.parts = entries.map((e) => e.parts);
    const mixed = mixtureWeights(logWeights, rates, this.parts, costs);
    this.cumulative = mixed.cumulative;
    const proposals = mixed.expectedProposals;
    this.expectedLength = mixed.expectedParts;
    // Parts near a + (b − a)/2 on average, of b − a + 1 possible sizes.
    this.expectedDistinct = distinct ? this.expectedLength : Math.min(this.expectedLength, b - a + 1);
    this.expectedWork = proposals * (mixed.meanProposalCost + Math.log2(entries.length + 1)) + this.expectedDistinct;
    this.setupWork = setup;
  }

  sample(source: RandomSource): Partition {
    const cumulative = this.cumulative;
    const last = cumulative.length - 1;
    for (;;) {
      const u = source.nextDouble() * cumulative[last];
      let lo = 0;
      let hi = last;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (cumulative[mid] <= u) lo = mid + 1;
        else hi = mid;
      }
      const p = this.proposers[lo](source);
      if (p !== null) return p;
    }
  }

  /** Most numbers of parts (⌊n/a⌋ − ⌈n/b⌉ + 1) the planner offers it for (setup ~O(1) per k). */
  static readonly MAX_PARTS_RANGE = 20_000;

  /** Whether the planner offers it: 2 <= a < b < n and at most MAX_PARTS_RANGE numbers of parts. */
  static applies(n: number, a: number, b: number, distinct = false): boolean {
    if (!(a >= 2 && b > a && b < n)) return false;
    const [first, last] = NarrowRangeMixture.partsRange(n, a, b, distinct);
    return last >= first && last - first + 1 <= NarrowRangeMixture.MAX_PARTS_RANGE;
  }

  /** Built with box-mixture's setup stopped at `setupLimit` steps; null when over it. */
  static within(n: number, a: number, b: number, setupLimit: number, distinct = false): NarrowRangeMixture | null {
    try {
      return new NarrowRangeMixture(n, a, b, { setupLimit, distinct });
    } catch (error) {
      if (error instanceof MixtureSetupExceeded) return null;
      throw error;
    }
  }

  /**
   * The numbers of parts a member can have: ⌈n / b⌉ .. ⌊n / a⌋; for distinct parts the k with
   * k a + k(k − 1)/2 <= n <= k b − k(k − 1)/2 (and k <= b − a + 1).
   */
  static partsRange(n: number, a: number, b: number, distinct = false): [number, number] {
    if (!distinct) return [Math.ceil(n / b), Math.floor(n / a)];
    const most = Math.min(b - a + 1, largestWithin((k) => k * a + (k * (k - 1)) / 2 <= n));
    // The largest sum of k distinct parts <= b, k b − k(k − 1)/2, increases up to k = b + 1/2.
    const top = Math.min(most, b);
    if (top < 1 || top * b - (top * (top - 1)) / 2 < n) return [1, 0];
    let lo = 1;
    let hi = top;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (mid * b - (mid * (mid - 1)) / 2 >= n) hi = mid;
      else lo = mid + 1;
    }
    return [lo, most];
  }
}

/** Box-subset's bounded design step in open ones (box-mixture.ts's BOUNDED_STEP_COST). */
const BOUNDED_STEP_COST = 5;
/** Box-subset steps (box-mixture's 20 ns row) in box-rotation draws (its 50 ns row). */
const SUBSET_DRAWS_PER_STEP = 20 / 50;
/** Boxes with more positions are left to box-subset (as plan-length.ts does for box-rotation). */
const ROTATION_MAX_POSITIONS = 1 << 21;

function rotationEstimate(box: Box): ReturnType<typeof BoxRotation.estimate> | null {
  if (box.cols === Infinity || Math.min(box.rows, box.cols) < 2 || box.rows + box.cols > ROTATION_MAX_POSITIONS) return null;
  return BoxRotation.estimate(box);
}

/**
 * The boxes "exactly k parts in [a, b]" (distinct or not) for the k of partsRange: box-maps.ts's
 * exactBox (k rows of b − a columns, or b − a − k + 1 for distinct parts; Infinity when the size
 * cannot fill one).
 */
export function narrowEntries(n: number, a: number, b: number, distinct = false): MixtureEntry[] {
  const [first, last] = NarrowRangeMixture.partsRange(n, a, b, distinct);
  const entries: MixtureEntry[] = [];
  for (let k = Math.max(1, first); k <= last; k++) {
    const box = exactBox(n, a, b, distinct, k);
    if (box !== null) entries.push({ parts: k, box });
  }
  return entries;
}

/** The largest k >= 0 with ok(k), for ok true at 0 and monotone (doubling, then bisection). */
function largestWithin(ok: (k: number) => boolean): number {
  let hi = 1;
  while (ok(hi)) hi *= 2;
  let lo = hi / 2;
  if (hi === 1) return 0;
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (ok(mid)) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * Nats below the estimated largest ln c(k) at which k is dropped: 1000 less the estimate's error
 * (the local limit of the box's size law, O(1) nats) is far below double precision's
 * 2^−1074 = e^−744.4, so these k are ones whose mixture weight would underflow to 0 anyway (as
 * box-mixture.ts's do); the bound below makes the cut rigorous on each side.
 */
const DROP_NATS = 1000;

/**
 * ln of a bound on the partitions of m into parts <= w (any number of them), which bounds c(k)
 * with m = min(n − k a, k b − n) (the box's size or, by the symmetry c(m) = c(kw − m), its
 * complement's): Chernoff, p_w(m) x^m <= Π_(i<=w) 1/(1 − x^i) for x = e^(−s) in (0, 1), minimised
 * over s by golden section on ln s (any s gives a bound). Increasing in m, and m decreases as k
 * moves away from the centre on either side, so beyond the first k below the cut all are below.
 */
export function logPartsAtMostBound(m: number, w: number): number {
  if (m <= 0) return 0;
  const f = (u: number) => {
    const s = Math.exp(u);
    return s * m - logQPochhammer(s, w);
  };
  let lo = Math.log(1e-10);
  let hi = Math.log(40);
  const g = (Math.sqrt(5) - 1) / 2;
  let x1 = hi - g * (hi - lo);
  let x2 = lo + g * (hi - lo);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let i = 0; i < 40; i++) {
    if (f1 < f2) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - g * (hi - lo);
      f1 = f(x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + g * (hi - lo);
      f2 = f(x2);
    }
  }
  return Math.min(f1, f2);
}

/**
 * The entries (consecutive k) that can hold a share of the family above e^−DROP_NATS of the
 * largest: the largest ln c(k) estimated by the local limit of the box's size law (mean kw/2,
 * variance kw(k + w + 1)/12: the sum of a uniform k-subset, sampling without replacement) over
 * the k near the centre, then on each side of the centre a binary search for the first k whose
 * bound (logPartsAtMostBound) is below the cut.
 */
function heavyEntries(entries: MixtureEntry[], n: number, a: number, b: number, distinct: boolean): MixtureEntry[] {
  if (entries.length <= 2) return entries;
  if (distinct) return heavyDistinctEntries(entries, n, a, b);
  const w = b - a;
  const ks = entries.map((e) => e.parts);
  const estimate = (k: number) => {
    const mean = (k * w) / 2;
    const variance = (k * w * (k + w + 1)) / 12;
    const z = (n - k * a - mean) / Math.sqrt(variance);
    return logGamma(k + w + 1) - logGamma(k + 1) - logGamma(w + 1) - 0.5 * Math.log(2 * Math.PI * variance) - (z * z) / 2;
  };
  const centre = Math.min(ks.length - 1, Math.max(0, Math.round(n / (a + w / 2)) - ks[0]));
  let top = -Infinity;
  for (let i = Math.max(0, centre - 200); i <= Math.min(ks.length - 1, centre + 200); i++) top = Math.max(top, estimate(ks[i]));
  const cut = top - DROP_NATS;
  const below = (i: number) => logPartsAtMostBound(Math.min(n - ks[i] * a, ks[i] * b - n), w) < cut;
  // Lowest kept index: the first i <= centre not below (below for all smaller ones).
  let lo = 0;
  let hi = centre;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (below(mid)) lo = mid + 1;
    else hi = mid;
  }
  const first = lo;
  lo = centre;
  hi = ks.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (below(mid)) hi = mid - 1;
    else lo = mid;
  }
  return entries.slice(first, lo + 1);
}

/**
 * heavyEntries for distinct parts: box k has k rows of w = b − a − k + 1 columns and size
 * m = n − k a − k(k − 1)/2; ln c(k) estimated as above over every k, then from each end inwards the
 * k are dropped while their bound is below the cut: the bound on partitions of min(m, k w − m)
 * into parts <= min(k, w) (the box's members, or its complements', by conjugation within the box).
 */
function heavyDistinctEntries(entries: MixtureEntry[], n: number, a: number, b: number): MixtureEntry[] {
  const side = (k: number) => b - a - k + 1;
  const size = (k: number) => n - k * a - (k * (k - 1)) / 2;
  let top = -Infinity;
  for (const { parts: k } of entries) {
    const w = side(k);
    const variance = (k * w * (k + w + 1)) / 12;
    const z = (size(k) - (k * w) / 2) / Math.sqrt(variance);
    const estimate = logGamma(k + w + 1) - logGamma(k + 1) - logGamma(w + 1) - 0.5 * Math.log(2 * Math.PI * variance) - (z * z) / 2;
    if (variance > 0) top = Math.max(top, estimate);
  }
  if (!(top > -Infinity)) return entries;
  const cut = top - DROP_NATS;
  const below = (i: number) => {
    const k = entries[i].parts;
    const w = side(k);
    const m = size(k);
    return logPartsAtMostBound(Math.min(m, k * w - m), Math.min(k, w)) < cut;
  };
  let first = 0;
  while (first < entries.length - 1 && below(first)) first++;
  let last = entries.length - 1;
  while (last > first && below(last)) last--;
  return entries.slice(first, last + 1);
}

/** ln C(M, j) as a sum of j logarithms of ratios (relative error ~ j · 1e-16 of its terms). */
function logBinomial(M: number, j: number): number {
  const r = Math.min(j, M - j);
  let sum = 0;
  for (let i = 0; i < r; i++) sum += Math.log((M - i) / (r - i));
  return sum;
}
