import type { Partition } from '../../partition.js';
import { nextBelow, nextOpenDouble, type RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { PairSolutions } from './multiset-boltzmann.js';
import { normalCdf } from './length-law.js';
import { solveTilt } from './tilt.js';
import { SmallPartsBlock } from './small-parts-block.js';
import { visitThinned } from './thinning.js';

/**
 * Exact uniform partitions of n into at most K parts, every part in [lo, hi] (hi may be >= n:
 * no bound), through the conjugate, with the number of parts drawn under one tilt.
 *
 * A partition λ with exactly k parts, all >= lo, has a conjugate λ' (Andrews 1976, §1.3) whose
 * lo largest parts all equal k: λ' = (k^lo) ∪ ν with ν any partition of n - lo k into parts <= k,
 * and λ_1 = lo + (number of parts of ν), so λ_1 <= hi is a bound on ν's number of parts. The
 * family is the disjoint union over k <= K of these pairs (k, ν). A proposal (Boltzmann
 * sampling, Duchon, Flajolet, Louchard & Schaeffer 2004, CPC 13, with probabilistic
 * divide-and-conquer, Arratia & DeSalvo 2016, CPC 25, §3, as multiset-boltzmann.ts), at x = e^t:
 *  1. k with probability proportional to x^(lo k) / prod_(i=3..k) (1 - x^i) (weights summed once,
 *     O(K) setup; for k <= 2 the product is empty);
 *  2. for 3 <= i <= k the multiplicity Z_i of i in ν, independent, P(Z_i >= j) = x^(ij);
 *  3. the remainder m = n - lo k - sum i Z_i is left to the sizes 1 and 2 (only 1 when k = 1):
 *     accepted with probability Q(m) x^m / U, Q(m) the number of solutions of Z_1 + 2 Z_2 = m
 *     (m/2 + 1, or 1 when k = 1), U = max over real m of (m/2 + 1) x^m, and the solution then
 *     taken uniformly;
 *  4. accepted when lo + (number of parts of ν) <= hi.
 * A pair (k, ν) is thus proposed and accepted with probability
 *   x^(lo k) / prod (1 - x^i) * prod (1 - x^i) x^(i Z_i) * x^m / U / W = x^n / (U W),
 * W the sum of the weights of step 1: the same for every member, so the accepted λ is exactly
 * uniform, whatever the tilt (it only sets the speed; t is solved for ν at k = K). The
 * acceptance rate is P(lo k + |ν| = n) / ((1 - x)(1 - x^2) U) times the chance of step 4 (local
 * limit estimate below): of order K^(-1/2), with proposals of about K geometric draws, as
 * "bounded-boltzmann/1+conjugate" for lo = 1. Weights below 2^-1074 of the largest underflow to 0;
 * those k hold a share of the family below ~1e-300 / (acceptance rate).
 *
 * The sizes 1..j determined together (j >= 3, small-parts-block.ts; chosen by chooseBlock): for
 * k >= j, step 2 draws only the sizes j+1..k, and step 3 accepts the remainder m with probability
 * p_j(m) x^m / max_m p_j(m) x^m, p_j(m) the partitions of m into parts <= j, then takes one of
 * them uniformly; step 1's weight of k carries that maximum (and U for k < j, which keep steps
 * 2-3 as above), so every member still ends with probability x^n / W. The block absorbs j of the
 * k sizes' share of the variance of the size: the acceptance rate grows like sqrt(j) (at
 * n = 9.04e8, parts >= 187, at most 23013 parts: 175 proposals per sample with j = 0, 55 with j = 9).
 *
 * Method id "conjugate-mixture/2" (/1: the sizes 1 and 2 only).
 */
export class ConjugateMixture implements PartitionSampler {
  readonly method = 'conjugate-mixture/2';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  readonly expectedProposals: number;
  readonly proposalCost: number;
  /** Steps of the setup (weights and moments, O(K)). */
  readonly setupWork: number;
  /** ln x. */
  readonly t: number;
  /** Largest number of parts (min(K, n / lo)). */
  readonly top: number;
  private readonly cumulative: Float64Array;
  private readonly logBound: number;
  private readonly pair = new PairSolutions(1, 2);
  private readonly denseEnd: number;
  private readonly z: Float64Array;
  /** x^i and 1 / (i t) for the dense sizes. */
  private readonly q: Float64Array;
  private readonly inverse: Float64Array;
  /** The smallest sizes 1..j determined together (null: the sizes 1 and 2 only). */
  private readonly block: SmallPartsBlock | null;
  readonly j: number;

  constructor(
    readonly n: number,
    readonly lo: number,
    readonly hi: number,
    K: number,
    tilt?: number,
    /** The block of smallest sizes determined at the end (0: the sizes 1 and 2 only); chosen when omitted. */
    block?: number,
  ) {
    if (!(Number.isInteger(n) && n >= 1 && Number.isInteger(lo) && lo >= 1 && K >= 1)) throw new RangeError('conjugate mixture needs n >= 1, lo >= 1, K >= 1');
    const top = Math.min(K, Math.floor(n / lo));
    if (top < 1) throw new RangeError(`no partition of ${n} into at most ${K} parts >= ${lo}`);
    this.top = top;
    const target = Math.max(n - lo * top, top);
    const t = tilt ?? (top >= 2 ? solveTilt({ kind: 'interval', lo: 1, hi: top }, target, false) : -1 / Math.max(1, target));
    this.t = t;
    // max over m >= 0 of (m / 2 + 1) e^(t m): at m* = -1/t - 2 when positive (multiset-boltzmann.ts).
    const peak = -1 / t - 2;
    this.logBound = peak > 0 ? Math.log(-1 / (t * 2)) + t * peak : 0;
    this.denseEnd = Math.floor(Math.log(4) / -t);
    const j = block ?? chooseBlock(top, t, Math.min(top, this.denseEnd + 2 / -t) * Math.sqrt(top));
    if (!(Number.isInteger(j) && (j === 0 || (j >= 3 && j <= top)))) throw new RangeError('conjugate mixture block must be 0 or in [3, top]');
    this.block = j === 0 ? null : new SmallPartsBlock(j, t);
    this.j = j;
    const logBlockBound = this.block === null ? 0 : Math.log(this.block.bound);
    // Step 1's log-weights (the proposal's, and the family's Boltzmann weights
    // x^(lo k) / prod_(i<=k) (1 - x^i) for the estimates), and per k the mean and variance of
    // lo k + |ν| (all Z_i geometric) and of ν's number of parts.
    const logWeights = new Float64Array(top);
    const logTrue = new Float64Array(top);
    let logW = 0;
    let logV = 0;
    let logTail = 0;
    let sizeMean = 0;
    let sizeVar = 0;
    let partsMean = 0;
    let partsVar = 0;
    const means = new Float64Array(top);
    const vars = new Float64Array(top);
    const pMeans = new Float64Array(top);
    const pVars = new Float64Array(top);
    for (let k = 1; k <= top; k++) {
      const xi = Math.exp(t * k);
      const g = xi / -Math.expm1(t * k); // E Z_k
      sizeMean += k * g;
      sizeVar += k * k * g * (1 + g);
      partsMean += g;
      partsVar += g * (1 + g);
      const log1m = Math.log1p(-xi);
      logW += lo * t - (k >= 3 ? log1m : 0);
      logV += lo * t - log1m;
      if (k > j) logTail += log1m;
      logTrue[k - 1] = logV;
      // k >= j: the sizes j+1..k drawn, the block's bound; else sizes 3..k and the pair's bound.
      logWeights[k - 1] = j > 0 && k >= j ? lo * t * k - logTail + logBlockBound : logW + this.logBound;
      means[k - 1] = lo * k + sizeMean;
      vars[k - 1] = sizeVar;
      pMeans[k - 1] = partsMean;
      pVars[k - 1] = partsVar;
    }
    let heaviest = -Infinity;
    for (const w of logWeights) heaviest = Math.max(heaviest, w);
    this.cumulative = new Float64Array(top);
    let total = 0;
    let hit = 0;
    let length = 0;
    for (let i = 0; i < top; i++) {
      total += Math.exp(logWeights[i] - heaviest);
      this.cumulative[i] = total;
      // Local limit: P(lo k + |ν| = n) ~ normal density; step 4 by the normal law of ν's parts.
      const sd = Math.sqrt(vars[i]);
      const zn = (n - means[i]) / sd;
      const density = sd > 0 ? Math.exp((-zn * zn) / 2) / (Math.sqrt(2 * Math.PI) * sd) : 1;
      const slack = hi - lo + 0.5 - pMeans[i];
      const fits = hi >= n ? 1 : normalCdf(slack / Math.sqrt(Math.max(pVars[i], 1e-300)));
      // A proposal with k parts succeeds with probability density / (prod over the determined sizes of (1 - x^i) times their bound).
      const success = Math.exp(logTrue[i] - heaviest) * density * fits;
      hit += success;
      length += success * (i + 1);
    }
    const rate = hit / total;
    this.expectedProposals = Math.max(1, 1 / Math.min(1, rate));
    const first = Math.max(3, j + 1);
    const dense = Math.max(0, Math.min(top, this.denseEnd) - first + 1);
    const tail = top > this.denseEnd ? Math.min(top - this.denseEnd, (2 * Math.exp(t * (this.denseEnd + 1))) / -Math.expm1(t)) : 0;
    // The block's partition: a few proposals of j draws, on accepted proposals only.
    this.proposalCost = dense + tail + Math.log2(top + 1) + 3;
    this.expectedLength = hit > 0 ? length / hit : top;
    // Distinct part sizes of λ: corners of the diagram, those of ν (sizes with Z_i >= 1) at most.
    let corners = 0;
    for (let k = 1; k <= Math.min(top, 5000); k++) corners += Math.exp(t * k);
    if (top > 5000) corners += (Math.exp(t * 5000) - Math.exp(t * top)) / -t;
    this.expectedDistinct = Math.max(1, Math.min(this.expectedLength, corners + 1));
    this.expectedWork = this.expectedProposals * this.proposalCost + 4 * j + this.expectedLength / 8 + this.expectedDistinct;
    // Per number of parts: the tilt's Newton sums and the weights; the block's table (additions, ~1/20 unit each).
    this.setupWork = 12 * top + (this.block === null ? 0 : (j * this.block.limit) / 20);
    this.z = new Float64Array(top + 1);
    this.q = new Float64Array(Math.min(top, this.denseEnd) + 1);
    this.inverse = new Float64Array(this.q.length);
    for (let i = 1; i < this.q.length; i++) {
      this.q[i] = Math.exp(t * i);
      this.inverse[i] = 1 / (i * t);
    }
  }

  sample(source: RandomSource): Partition {
    for (;;) {
      const p = this.propose(source);
      if (p !== null) return p;
    }
  }

  /** One proposal: the partition, or null when rejected. */
  propose(source: RandomSource): Partition | null {
    const { n, lo, hi, t, z, cumulative } = this;
    const last = cumulative.length - 1;
    const u = source.nextDouble() * cumulative[last];
    let a = 0;
    let b = last;
    while (a < b) {
      const mid = (a + b) >> 1;
      if (cumulative[mid] <= u) a = mid + 1;
      else b = mid;
    }
    const k = a + 1;
    const room = n - lo * k;
    const block = this.block !== null && k >= this.j ? this.block : null;
    let total = 0;
    z.fill(0, 0, k + 1);
    // Z_i = floor(ln U / (i t)) has P(Z_i >= j) = x^(ij); sizes with x^i < 1/4 by thinning.
    const first = block === null ? 3 : this.j + 1;
    const denseTop = Math.min(k, this.denseEnd);
    // Z_i = 0 exactly when U > x^i: the logarithm only for the others (x^i tabulated).
    const q = this.q;
    const inverse = this.inverse;
    for (let i = first; i <= denseTop; i++) {
      const u = nextOpenDouble(source);
      if (u > q[i]) continue;
      const v = Math.floor(Math.log(u) * inverse[i]);
      z[i] = v;
      total += i * v;
    }
    if (total > room) return null;
    if (k > denseTop && k >= first) {
      const alive = visitThinned(
        source,
        Math.max(denseTop + 1, first),
        k,
        (i) => Math.exp(t * i),
        (i) => {
          const v = 1 + Math.floor(Math.log(nextOpenDouble(source)) / (i * t));
          z[i] = v;
          total += i * v;
          return total <= room;
        },
      );
      if (!alive) return null;
    }
    const m = room - total;
    if (m < 0) return null;
    if (block !== null) {
      // The sizes 1..j: accepted with probability p_j(m) x^m / max, then a uniform partition of m into parts <= j.
      if (!block.accepts(source.nextDouble(), m)) return null;
      block.fill(source, m, z);
    } else if (k === 1) {
      if (!(source.nextDouble() < Math.exp(t * m - this.logBound))) return null;
      z[1] = m;
    } else {
      const solutions = this.pair.count(m);
      if (!(source.nextDouble() < Math.exp(Math.log(solutions) + t * m - this.logBound))) return null;
      const j = this.pair.nth(m, solutions === 1 ? 0 : nextBelow(source, solutions));
      z[2] = j;
      z[1] = m - 2 * j;
    }
    // λ_j = lo + sum_(i >= j) Z_i (conjugate of (k^lo) ∪ ν), non-increasing in j.
    let parts = 0;
    for (let i = 1; i <= k; i++) parts += z[i];
    if (lo + parts > hi) return null;
    const sizes: number[] = [];
    const multiplicities: number[] = [];
    let value = lo + parts;
    for (let j = 1; j <= k; j++) {
      const last = sizes.length - 1;
      if (last >= 0 && sizes[last] === value) multiplicities[last]++;
      else {
        sizes.push(value);
        multiplicities.push(1);
      }
      value -= z[j];
    }
    return { sizes, multiplicities };
  }
}

/** Table additions the block of smallest sizes may take (~3-7 ns each, loaded 2-core machine). */
const BLOCK_TABLE_ADDS = 2e7;
/**
 * ... and per step of one sample without the block (~50 ns each): the table costs at most about
 * half a sample of the plain method (the block saves 40-70% of every sample).
 */
const BLOCK_ADDS_PER_STEP = 10;
/** ... but always this many (well under a millisecond). */
const BLOCK_MIN_ADDS = 1e5;
/** Doubles the block's table may hold. */
const BLOCK_TABLE_CELLS = 5e6;
const BLOCK_MAX = 64;

/**
 * The block of smallest sizes determined at the end: the largest j in [3, min(64, top / 2)] whose
 * table fits BLOCK_TABLE_ADDS, BLOCK_ADDS_PER_STEP times `plainWork` (at least BLOCK_MIN_ADDS) (the work of one sample
 * without the block, ~ sizes per proposal times sqrt(top) proposals) and BLOCK_TABLE_CELLS (0 when
 * none). The success rate of a proposal grows like sqrt(j) (the block absorbs j of the k sizes'
 * share of the variance), the table like j^2 / |t|.
 */
export function chooseBlock(top: number, t: number, plainWork: number): number {
  const adds = Math.min(BLOCK_TABLE_ADDS, Math.max(BLOCK_MIN_ADDS, BLOCK_ADDS_PER_STEP * plainWork));
  let best = 0;
  for (let j = 3; j <= Math.min(BLOCK_MAX, Math.floor(top / 2)); j++) {
    const limit = SmallPartsBlock.limitFor(j, t);
    if (j * limit > adds || limit > BLOCK_TABLE_CELLS) break;
    best = j;
  }
  return best;
}
