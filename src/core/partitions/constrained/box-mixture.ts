import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { BoxDesign, BoxSubset, logSuccessFromBinomial, type Box } from './box-subset.js';
import { designTermMean, designTermVariance, logQPochhammer, openMomentsApprox, PowerSums } from './subset-design.js';

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
  /** Setup steps: tilt solving and normalisers, about 12 per row of every box. */
  readonly setupWork: number;
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
 * P(k) proportional to (1 / g(k)) c(k) g(k) = c(k), and within k a uniform member. Each k has its
 * own tilt (only speed depends on the tilts). Weights below 2^-1074 of the largest underflow to
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
  /** Cumulative weights proportional to 1 / g(k). */
  private readonly cumulative: Float64Array;

  constructor(
    entries: readonly MixtureEntry[],
    private readonly map: (parts: number, rows: Partition) => Partition,
    distinctParts: (parts: number) => number,
  ) {
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
    for (const entry of entries) {
      const { box } = entry;
      let design: BoxDesign;
      if (box.cols === Infinity && box.rows >= 2 && box.size > 0) {
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
      designs.push(design);
      widest = Math.max(widest, design.k);
    }
    const buffer = new Float64Array(widest);
    this.samplers = designs.map((d) => new BoxSubset(d, buffer));
    this.parts = entries.map((e) => e.parts);
    const logWeights = designs.map((d) => -d.logSuccessPerMember());
    const top = Math.max(...logWeights);
    this.cumulative = new Float64Array(entries.length);
    let total = 0;
    let success = 0;
    let parts = 0;
    let cost = 0;
    for (let i = 0; i < entries.length; i++) {
      const weight = Math.exp(logWeights[i] - top);
      total += weight;
      this.cumulative[i] = total;
      // Estimated success rate of this k's proposals and its share of the members.
      const rate = 1 / designs[i].expectedProposals;
      success += weight * rate;
      parts += weight * rate * this.parts[i];
      cost += weight * designs[i].proposalCost;
    }
    const expectedProposals = total / success;
    this.estimates = {
      expectedProposals,
      proposalCost: cost / total + Math.log2(entries.length + 1),
      expectedParts: parts / success,
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
