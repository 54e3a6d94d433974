import { LogMinPartCounts, defaultExactUpTo, minPartSaddle } from '../counting/log-min-part-count.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import { BoltzmannProposal } from './boltzmann-proposal.js';
import { MinPartSelfSimilarEngine, type MinPartSelfSimilarStats } from './min-part-self-similar-engine.js';
import { MIN_PART_BASE_THRESHOLD, MinPartSelfSimilarTables, defaultTables } from './min-part-self-similar-tables.js';

export { MinPartSelfSimilarEngine, type MinPartSelfSimilarOptions, type MinPartSelfSimilarStats } from './min-part-self-similar-engine.js';
export { MIN_PART_BASE_THRESHOLD, MinPartSelfSimilarTables, defaultTables } from './min-part-self-similar-tables.js';
export { boundedMaximiser } from './bounded-maximiser.js';

/**
 * Exact uniform partitions of n into parts >= a (a >= 2) by self-similarity, one family per
 * level (the minPart version of self-similar.ts).
 *
 * A partition into parts >= b is the pair (A, 2μ): A its odd parts (all >= b) and μ its even
 * parts halved, a partition into parts >= b' = ⌈b/2⌉, with |A| + 2|μ| = n. All pairs are equally
 * likely, so A must have P(A) ∝ c_{b'}((n − |A|)/2), c_b(m) the number of partitions of m into
 * parts >= b (log-min-part-count.ts), and μ is then uniform of its size: the same problem with
 * b' (level l + 1), until b' = 1, where the unrestricted self-similar engine takes over, or the
 * size is <= baseThreshold, where a table does (min-part-table.ts).
 *
 * One level at size n, smallest odd size s = b or b + 1 (whichever is odd), x = e^{−t}:
 *   1. Draw the odd multiplicities of sizes >= s + 2 at x (BoltzmannProposal): P(A') ∝ x^{|A'|}.
 *      Let j0 = (n − |A'|) mod 2.
 *   2. X_s = j0 + 2G, G ~ Geometric(x^{2s}): since s is odd, s·X_s has the parity of X_s, so only
 *      the parity that can complete the size is drawn. Jointly P(A', X_s) ∝ x^{|A| − s·j0}.
 *   3. T = |A|; reject if T > n; m = (n − T)/2. Accept with probability
 *        c_{b'}(m)·x^{2m}·x^{s·j0} / M,   M = max_{0<=m'<=n/2} c_{b'}(m')·x^{2m'}   (x < 1).
 *      Then P(A accepted) ∝ x^{T − s·j0}·c_{b'}(m)x^{2m}x^{s·j0} = x^n·c_{b'}(m) ∝ c_{b'}(m).
 *   4. Recurse on (m, b'); the parts of μ are doubled (level l holds odd multiples of 2^l).
 * Any x is exact; t is the saddle point of partitions into parts >= b at mean size n (Boltzmann
 * mean = n), where, as in the unrestricted case, the acceptance tends to a ratio of Gaussian
 * widths. With b ≪ √n the sizes shrink by about 4 and b by 2 per level, so b·t stays about
 * constant and after ⌈log₂ a⌉ levels the unrestricted engine finishes.
 *
 * The maximiser M: log c_{b'} is concave above its last log-concavity failure L (found exactly on
 * the count table; above the table the saddle-point values, checked concave on a grid in the
 * tests), so m' >= L is searched by bisection on the sign of the forward difference, and m' < L
 * is scanned directly unless the peak is above log c_{b'}(L), which bounds every weight there
 * (c_{b'} is non-decreasing for m >= 1 — add 1 to the largest part — and x < 1).
 */
/** The method as a planner sampler for one (n, a), a >= 2. */
export class MinPartSelfSimilarSampler implements PartitionSampler {
  /**
   * Largest a served: the counts it needs (b' <= 241) were checked against exact counts
   * (test/partitions/log-min-part-count.test.ts checks b up to 481); beyond, the table end
   * defaultExactUpTo(b) would be an extrapolation.
   */
  static readonly MAX_A = 482;
  readonly method = 'minpart-self-similar/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  /** Additions filling the count tables (time; ~1.4 ns each measured, 130 ms for a = 481). */
  readonly setupWork: number;
  /** Doubles the tables hold (memory). */
  readonly setupCells: number;
  private readonly engine: MinPartSelfSimilarEngine;

  constructor(
    readonly n: number,
    readonly a: number,
    tables: MinPartSelfSimilarTables = defaultTables(),
    baseThreshold = Math.min(MIN_PART_BASE_THRESHOLD, tables.table.maxN),
  ) {
    if (!Number.isInteger(n) || n < 0 || n > LogMinPartCounts.MAX_M) throw new RangeError(`n must be an integer in [0, ${LogMinPartCounts.MAX_M}], got ${n}`);
    if (!Number.isInteger(a) || a < 2 || a > MinPartSelfSimilarSampler.MAX_A) {
      throw new RangeError(`a must be an integer in [2, ${MinPartSelfSimilarSampler.MAX_A}], got ${a}`);
    }
    this.engine = new MinPartSelfSimilarEngine({ baseThreshold, tables });
    // Boltzmann means at the saddle point: parts Σ_{k>=a} x^k/(1 − x^k), distinct sizes Σ x^k.
    const t = minPartSaddle(a, Math.max(1, n));
    const e1 = Math.exp(-a * t);
    this.expectedDistinct = Math.max(1, e1 / -Math.expm1(-t));
    // Σ_{k>=1} x^k/(1 − x^k) ≈ (ln(1/t) + γ)/t + 1/4 (Lambert series at x = e^{−t}), minus sizes < a.
    this.expectedLength = Math.max(1, (Math.log(1 / t) + EULER_GAMMA) / t + 0.25 - partialLog(a, t));
    // Fitted to the measured time per sample (scripts/bench/plan-fit.ts and a sweep of a = 2, 7,
    // 30, 100 at n = 3e3..1e9, process CPU time after a warm-up, counts remembered): time ≈
    // 300-400 ns per Boltzmann distinct size (the proposals' visited sizes at every level and the
    // unrestricted engine below them) plus ~8-18 µs per level (proposals, the base table, the
    // merge; a count above the table where the squeeze or the remembered differences miss). In
    // steps of this method's row (60 ns): 5 per distinct size, a little more with more levels
    // (more proposals per level as a grows), 130 per level and 12 per half-bound b' (the count
    // terms). The maximiser's counts are remembered across samples (falling-differences.ts), so
    // they are not charged per sample; counts above a level's table (b' of a few hundred: a
    // saddle-point count costs ~b' terms, and more of them miss) add ~0.3·b'² per such level.
    // Measured/estimated 0.6-1.5 over that sweep for a <= 100; for a = 481, 0.3-1.9 (the
    // remembered counts still filling after 2.5 s of samples at n = 1e6-1e7).
    let levels = 0;
    let countWork = 0;
    let size = n;
    let b = a;
    while (b > 1 && size > baseThreshold) {
      b = Math.ceil(b / 2);
      countWork += 12 * b + (size / 2 > defaultExactUpTo(b) ? 0.3 * b * b : 0);
      levels++;
      size = Math.round(size / 4);
    }
    const work = 5 * this.expectedDistinct * (1 + levels / 20) + 130 * levels + countWork + 100;
    this.expectedWork = work;
    // Count tables for b' = ⌈a/2⌉, ⌈a/4⌉, ..., 2 and the base table.
    let setup = tables.table.size;
    let cells = tables.table.size;
    for (let bp = Math.ceil(a / 2); bp > 1; bp = Math.ceil(bp / 2)) {
      setup += LogMinPartCounts.setupWork(bp);
      cells += 2 * (defaultExactUpTo(bp) + 1);
    }
    this.setupWork = setup;
    this.setupCells = cells;
  }

  sample(source: RandomSource, stats?: MinPartSelfSimilarStats): Partition {
    return this.engine.sample(source, this.n, this.a, stats);
  }
}

const EULER_GAMMA = 0.5772156649015329;

/** Σ_{k<a} x^k/(1 − x^k): the Boltzmann mean number of parts of sizes below a. */
function partialLog(a: number, t: number): number {
  let s = 0;
  for (let k = 1; k < a; k++) s += Math.exp(-k * t) / -Math.expm1(-k * t);
  return s;
}
