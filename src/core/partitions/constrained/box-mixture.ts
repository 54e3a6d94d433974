import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { BinomialWalk } from './binomial-walk.js';
import { BoxDesign, BoxSubset, logSuccessFromBinomial, type Box } from './box-subset.js';
import {
  boxMomentsApprox,
  designMoments,
  designTermMean,
  designTermVariance,
  logGaussianBinomial,
  logQPochhammer,
  openMomentsApprox,
  PowerSums,
  type DesignMoments,
} from './subset-design.js';

/** One value of the number of parts: its box and the map from the box onto the family. */
export interface MixtureEntry {
  readonly parts: number;
  readonly box: Box;
}

/** Estimates the planner reads before building (the designs are solved then). */
export interface MixtureEstimates {
  readonly expectedProposals: number;
  readonly proposalCost: number;
  readonly expectedParts: number;
  /** Setup steps: tilt solving and normalisers (about 20 per box while a tilt is kept, more per new tilt). */
  readonly setupWork: number;
}

/** Tuning of the tilts (only speed depends on it). */
export interface MixtureOptions {
  /** A bounded box keeps the previous tilt while the design's mean is within this many sd of its target (default 0.5: by the local limit, an acceptance rate at least exp(-1/8) = 0.88 times that of the tilt solved for the box). */
  readonly keepWithin?: number;
  /** false: keep the walked tilts of the heaviest boxes too (tests; default: solve theirs). */
  readonly polish?: boolean;
  /** Setup steps after which construction stops with MixtureSetupExceeded (default none). */
  readonly setupLimit?: number;
}

/** Construction passed its setup limit while building the boxes of `parts` parts. */
export class MixtureSetupExceeded extends RangeError {
  constructor(readonly parts: number, readonly setupWork: number) {
    super(`box mixture over its setup limit at ${parts} parts`);
  }
}

/**
 * A bounded box's design step costs about this many open ones: its positions are visited by
 * thinning (about two candidates per element, each with two uniforms, a logarithm and two
 * exponentials) where an open box draws one geometric gap. Measured (process CPU time, 30
 * samples): 120-150 ns per BoxDesign step for the bounded mixtures of n = 1.5e7 and 2.7e7 with
 * about 2900 parts, 25-36 ns for the open ones of n = 1e8 with 2500 parts.
 */
const BOUNDED_STEP_COST = 5;

/** Unit steps a walk may take from one box to the next before its tilt is solved afresh. */
const WALK_STEPS = 4;

/**
 * The design tilt s >= 0 of a k x b box (after conjugation) with mean m <= k b / 2, by Newton
 * steps inside a bisection bracket on O(1) moments (boxMomentsApprox), to within 0.05 sd; 0 when
 * so close to half full that s sd < 1e-3 (as BoxDesign). `evaluations` counts moment evaluations.
 */
function steerBoxTilt(k: number, b: number, m: number, start: number | undefined): DesignMoments & { s: number; evaluations: number } {
  if (m >= (k * b) / 2 - 0.25) return { s: 0, ...designMoments(k, b, 0), evaluations: 1 };
  let lo = 0;
  let hi = 60;
  let s = start !== undefined && start > 0 && start < hi ? start : Math.min(hi / 2, Math.max(1e-12, Math.log1p(k / Math.max(m, 1e-9))));
  let moments = boxMomentsApprox(k, b, s);
  let evaluations = 1;
  for (let iter = 0; iter < 60; iter++) {
    const { mean, variance } = moments;
    if (mean > m) lo = s;
    else hi = s;
    if (Math.abs(mean - m) <= 0.05 * Math.sqrt(variance)) break;
    let next = s + (mean - m) / variance;
    if (!(next > lo && next < hi)) next = lo === 0 ? hi / 16 : Math.sqrt(lo * hi);
    if (Math.abs(next - s) <= 1e-13 * s) break;
    s = next;
    moments = boxMomentsApprox(k, b, s);
    evaluations++;
  }
  if (s * Math.sqrt(moments.variance) < 1e-3) return { s: 0, ...designMoments(k, b, 0), evaluations };
  return { s, ...moments, evaluations };
}

/**
 * Below this tilt the normaliser is summed term by term; at or above it, from three q-Pochhammer
 * symbols in O(1): ln [N choose j]_x = ln (x;x)_N - ln (x;x)_j - ln (x;x)_(N-j), each of size
 * below pi^2 / (6 s) < 165 with relative error ~1e-15 (logQPochhammer), so the difference is
 * good to ~1e-13 absolute, as the direct sum of j logarithms.
 */
const DIRECT_BELOW = 0.01;

/** ln [N choose j]_x, x = e^(-s): O(1) for s >= DIRECT_BELOW, else the direct product. */
export function logBinomialAt(N: number, j: number, s: number): number {
  if (s < DIRECT_BELOW || j <= 32) return logGaussianBinomial(N, j, s);
  return logQPochhammer(s, N) - logQPochhammer(s, j) - logQPochhammer(s, N - j);
}

/** The power sums at j (advanced; rebuilt when j went back). */
function advanceTo(sums: PowerSums, j: number): PowerSums {
  if (sums.j > j) return sums; // logQPochhammer then sums directly
  while (sums.j < j) sums.advance();
  return sums;
}

/**
 * Exact uniform partitions with at most K parts when each number of parts k is a box family
 * (k parts >= lo, optionally distinct, under a bound): the family is the disjoint union over k,
 * and k must be drawn with probability proportional to the count c(k) of its box, which is not
 * known. The mixture is made exact by restarting the choice of k after every failed proposal
 * (rejection sampling from a mixture, Devroye 1986, §II.3): a proposal of box k succeeds with
 * probability c(k) g(k), where g(k) is known in closed form (BoxDesign.logSuccessPerMember), so
 * drawing k with probability proportional to 1 / g(k) and stopping at the first success gives
 * P(k) proportional to (1 / g(k)) c(k) g(k) = c(k), and within k a uniform member. Any tilt is
 * exact (only speed depends on it), so consecutive k share one while it stays efficient, and
 * g(k) is advanced from k - 1 in O(1) (below): setup O(K). Weights below 2^-1074 of the largest underflow to
 * 0; those k hold a share of the family below ~1e-300 / (success rate of the best k).
 *
 * Method id "box-mixture/1".
 */
export class BoxMixture implements PartitionSampler {
  readonly method = 'box-mixture/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  readonly estimates: MixtureEstimates;
  private readonly parts: number[];
  private readonly samplers: BoxSubset[];
  /** The designs, one per entry (their tilts and normalisers; read by tests). */
  readonly designs: readonly BoxDesign[];
  /** Cumulative weights proportional to 1 / g(k). */
  private readonly cumulative: Float64Array;

  constructor(
    entries: readonly MixtureEntry[],
    private readonly map: (parts: number, rows: Partition) => Partition,
    distinctParts: (parts: number) => number,
    options: MixtureOptions = {},
  ) {
    const keepWithin = options.keepWithin ?? 0.5;
    const setupLimit = options.setupLimit ?? Infinity;
    if (entries.length === 0) throw new RangeError('box mixture needs at least one number of parts');
    const designs: BoxDesign[] = [];
    let start: number | undefined;
    let widest = 1;
    // Open boxes (no upper bound) with k = 1, 2, ... rows: the tilt is kept while the design's
    // mean stays within 0.75 sd of the target, the moments advanced a row at a time (exact terms
    // on an O(1) quadrature start, openMomentsApprox: they only steer the tilt), and the exact
    // normaliser ln [Infinity choose k-1]_x = -ln (x; x)_(k-1) taken in O(1) (logQPochhammer).
    type OpenState = { s: number; k: number; mean: number; variance: number };
    let open: OpenState | null = null as OpenState | null;
    let setup = 0;
    const sums = new PowerSums();
    // Bounded boxes (k rows x c columns; c fixed, or k + c fixed for distinct parts): the size law
    // of the box under the tilt is generated by [k + c choose k]_x whatever the orientation
    // (conjugation and complementing leave it unchanged), and the design's normaliser is
    // [k + c choose min(k, c) - 1]_x: both are walked from one k to the next (BinomialWalk, O(1)
    // per k) while the tilt is kept, i.e. while the design's mean stays within keepWithin sd of
    // its target; else the tilt is solved afresh on O(1) moments and the normaliser summed anew.
    let moments: BinomialWalk | null = null;
    let normaliser: BinomialWalk | null = null;
    // About 8 steps per factor (two logarithms, two exponentials and the moment terms).
    const walk = (w: BinomialWalk, N: number, j: number): boolean => {
      const before = w.steps;
      const moved = w.moveTo(N, j, WALK_STEPS);
      setup += 8 * (w.steps - before);
      return moved;
    };
    for (const entry of entries) {
      const { box } = entry;
      let design: BoxDesign;
      const kd = Math.min(box.rows, box.cols);
      const bd = Math.max(box.rows, box.cols);
      const complemented = box.size > (kd * bd) / 2;
      const m = complemented ? kd * bd - box.size : box.size;
      if (box.cols !== Infinity && kd >= 2 && m > 0) {
        const N = box.rows + box.cols;
        if (moments !== null && !walk(moments, N, box.rows)) moments = null;
        if (moments === null || !(moments.variance > 0) || Math.abs(moments.mean - m) > keepWithin * Math.sqrt(moments.variance)) {
          // The kept mean drifted off its target in one direction: aim the new tilt at the far
          // side, 0.8 keepWithin sd beyond the target, so that the next run lasts twice as long.
          let aim = m;
          if (moments !== null && moments.variance > 0 && keepWithin < Infinity) {
            aim = m + Math.sign(m - moments.mean) * 0.8 * keepWithin * Math.sqrt(moments.variance);
            if (!(aim > 0)) aim = m;
          }
          const solved = steerBoxTilt(kd, bd, Math.min(aim, (kd * bd) / 2), moments?.s ?? start);
          setup += solved.evaluations * 4 * Math.min(kd, 97);
          moments = new BinomialWalk(solved.s, N, box.rows, NaN, solved.mean, solved.variance);
        }
        const s = moments.s;
        if (normaliser === null || normaliser.s !== s || !walk(normaliser, N, kd - 1)) {
          normaliser = new BinomialWalk(s, N, kd - 1, logBinomialAt(N, kd - 1, s), 0, 0);
          setup += s >= DIRECT_BELOW ? 150 : 2 * kd;
        }
        setup += 20;
        design = new BoxDesign(box, s, {
          variance: moments.variance,
          logSuccess: logSuccessFromBinomial(kd, m, s, normaliser.log),
        });
      } else if (box.cols === Infinity && box.rows >= 2 && box.size > 0) {
        const k = box.rows;
        if (open !== null && open.k === k - 1) {
          const z = k * open.s;
          open.mean += (1 - z / 2 + designTermMean(z)) / open.s;
          open.variance += (1 - designTermVariance(z)) / (open.s * open.s);
          open.k = k;
          setup += 4;
        } else {
          const s0: number = open !== null ? open.s : (start ?? Math.log1p(k / box.size));
          open = { s: s0, k, ...openMomentsApprox(k, s0) };
          setup += 200;
        }
        for (let step = 0; step < 30 && Math.abs(open.mean - box.size) > 0.75 * Math.sqrt(open.variance); step++) {
          // Newton step (d mean / ds = -variance), halved towards 0 if it overshoots.
          let next: number = open.s + (open.mean - box.size) / open.variance;
          if (!(next > 0)) next = open.s / 4;
          open = { s: Math.min(next, 60), k, ...openMomentsApprox(k, Math.min(next, 60)) };
          setup += 200;
        }
        design = new BoxDesign(box, open.s, {
          variance: open.variance,
          logSuccess: logSuccessFromBinomial(k, box.size, open.s, -logQPochhammer(open.s, k - 1, advanceTo(sums, k - 1))),
        });
        setup += 60;
      } else {
        design = new BoxDesign(box, start);
        setup += 12 * design.k;
      }
      if (!design.single) start = design.s;
      if (setup > setupLimit) throw new MixtureSetupExceeded(entry.parts, setup);
      designs.push(design);
      widest = Math.max(widest, design.k);
    }
    // Proposals land on k in proportion to its weight 1 / g(k): the bounded boxes that take 95% of
    // them (often a few of the largest k) get the tilt solved for them on exact moments (BoxDesign,
    // ~12 steps per row), within at most as many setup steps again as the walk took.
    let logWeights = designs.map((d) => -d.logSuccessPerMember());
    if (options.polish !== false) {
      const heaviest = Math.max(...logWeights);
      const order = logWeights.map((_, i) => i).sort((a, b) => logWeights[b] - logWeights[a]);
      let total = 0;
      for (const w of logWeights) total += Math.exp(w - heaviest);
      let budget = Math.min(setup, setupLimit - setup);
      let mass = 0;
      for (const i of order) {
        if (mass >= 0.95 * total) break;
        mass += Math.exp(logWeights[i] - heaviest);
        const d = designs[i];
        if (d.single || d.b === Infinity) continue;
        const cost = 12 * d.k;
        if (cost > budget) break;
        budget -= cost;
        setup += cost;
        designs[i] = new BoxDesign(entries[i].box, d.s);
      }
      logWeights = designs.map((d) => -d.logSuccessPerMember());
    }
    this.designs = designs;
    const buffer = new Float64Array(widest);
    this.samplers = designs.map((d) => new BoxSubset(d, buffer));
    this.parts = entries.map((e) => e.parts);
    const mixed = mixtureWeights(
      logWeights,
      designs.map((d) => 1 / d.expectedProposals),
      this.parts,
      designs.map((d) => d.proposalCost * (d.b === Infinity || d.single ? 1 : BOUNDED_STEP_COST)),
    );
    this.cumulative = mixed.cumulative;
    const expectedProposals = mixed.expectedProposals;
    this.estimates = {
      expectedProposals,
      proposalCost: mixed.meanProposalCost + Math.log2(entries.length + 1),
      expectedParts: mixed.expectedParts,
      setupWork: setup,
    };
    this.expectedLength = this.estimates.expectedParts;
    this.expectedDistinct = Math.min(this.expectedLength, distinctParts(Math.round(this.expectedLength)));
    this.expectedWork = expectedProposals * this.estimates.proposalCost + this.expectedDistinct;
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
      const rows = this.samplers[lo].propose(source);
      if (rows !== null) return this.map(this.parts[lo], rows);
    }
  }
}

/** A mixture over k drawn with probability ∝ exp(logWeights) (cumulative, scaled to the largest) and its estimates. */
export interface MixtureWeights {
  readonly cumulative: Float64Array;
  /** Proposals per sample: the weights' total over the expected successes. */
  readonly expectedProposals: number;
  /** Mean number of parts of a sample (each k by its weight times its success rate). */
  readonly expectedParts: number;
  /** Mean cost of one proposal (each k by its weight). */
  readonly meanProposalCost: number;
}

/**
 * The cumulative weights of a rejection mixture over k (k drawn ∝ 1 / g(k), restarted after each
 * failed proposal; see BoxMixture) and its estimates from each k's success rate, parts and cost
 * per proposal. Weights below 2^−1074 of the largest underflow to 0.
 */
export function mixtureWeights(logWeights: readonly number[], rates: readonly number[], parts: readonly number[], costs: readonly number[]): MixtureWeights {
  const top = Math.max(...logWeights);
  const cumulative = new Float64Array(logWeights.length);
  let total = 0;
  let success = 0;
  let length = 0;
  let cost = 0;
  for (let i = 0; i < logWeights.length; i++) {
    const weight = Math.exp(logWeights[i] - top);
    total += weight;
    cumulative[i] = total;
    // Estimated success rate of this k's proposals and its share of the members.
    success += weight * rates[i];
    length += weight * rates[i] * parts[i];
    cost += weight * costs[i];
  }
  return { cumulative, expectedProposals: total / success, expectedParts: length / success, meanProposalCost: cost / total };
}
