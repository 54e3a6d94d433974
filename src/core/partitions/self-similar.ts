import { LogPartitionNumbers } from '../counting/log-partition-number.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import { BoltzmannProposal, boltzmannLogX } from './boltzmann-proposal.js';
import { RestrictedPartitionTable, sampleRestricted } from './table-recursive.js';

/**
 * Exact uniform partitions of n by self-similarity of the Boltzmann model.
 *
 * Under the Boltzmann law at x (independent X_k, P(X_k = j) = (1 − x^k) x^{jk}) the even sizes
 * satisfy P(X_{2k} = j) = (1 − (x²)^k) (x²)^{jk}: the even parts, halved, are a Boltzmann partition
 * at x², independent of the odd parts. A uniform partition λ of n is the pair (odd parts A, even
 * parts 2μ) with |A| + 2|μ| = n, all such pairs equally likely, so the odd part A must have
 * P(A) ∝ p((n − |A|)/2) (the number of ways to complete it) and μ is then uniform of size m = (n − |A|)/2.
 *
 *   1. Draw the odd multiplicities of sizes >= 3 at x (BoltzmannProposal, start 3, step 2):
 *      P(A') ∝ x^{|A'|}. Let j0 = (n − |A'|) mod 2.
 *   2. Draw X_1 = j0 + 2G with G ~ Geometric(x²), P(G = g) = (1 − x²)x^{2g}: only the parity that
 *      can complete the size. Jointly P(A', X_1) ∝ x^{|A|}·x^{−j0} with A = A' + X_1 ones.
 *   3. T = |A|; reject if T > n; m = (n − T)/2. Accept with probability
 *        p(m)·x^{2m}·x^{j0} / M,   M = max_{0<=m'<=n/2} p(m')·x^{2m'}  (>= the numerator, as x < 1).
 *      Then P(A accepted) ∝ x^{T − j0}·p(m)x^{2m}x^{j0} = x^n·p(m) ∝ p(m): the target.
 *   4. Draw μ uniform among the p(m) partitions of m (the same method, recursively), double its
 *      parts and merge with A.
 *
 * Step 2 replaces "draw X_1 freely and reject half of all proposals for parity": it doubles the
 * acceptance rate, to p(n)x^n(1 + x) / (Z_odd(x)·M) → 1/√2 (a Gaussian-width ratio) as n grows.
 * x = exp(−π/√(6n)) is the saddle point: the odd sizes carry mean size n/2 and p(m)x^{2m} peaks
 * at m ≈ n/4; other x lose acceptance fast. The recursion shrinks n by about 4 per level and an
 * odd-only proposal costs half a full one, so an exact sample costs ≈ (1/0.71)·(1/2)·2 ≈ 1.4
 * free-size proposals of sizes visited (measured ≈ 2.2·√(6n)/π sizes visited in all).
 *
 * The maximiser of log p(m') + 2m' log x is found by hill-climbing from the continuous maximiser of
 * the Rademacher leading term; log p is concave for m' > 25 (p(m)² > p(m−1)p(m+1), DeSalvo & Pak
 * 2015), so the local maximum on [26, n/2] is global, and m' <= 25 is checked directly when it
 * could matter. Acceptance uses log p(m) − log p(m*) as a stable log-ratio (log-partition-number.ts).
 * Sub-problems of size <= baseThreshold go to the table method (table-recursive.ts).
 */
export interface SelfSimilarOptions {
  /** Sub-problems of size <= this use the table method (must be <= RestrictedPartitionTable.MAX_N). */
  readonly baseThreshold: number;
  readonly table: RestrictedPartitionTable;
  readonly logP: LogPartitionNumbers;
}

/** Counters a caller may pass to see the work done (bench and tests). */
export interface SelfSimilarStats {
  /** Odd-size proposals drawn at the top level. */
  topProposals: number;
  /** Odd-size proposals drawn at all levels. */
  proposals: number;
  /** Part sizes visited by all proposals. */
  visited: number;
}

const DIRECT_SEARCH_BELOW = 64;
/** Above 25, p is log-concave (DeSalvo & Pak 2015, Thm 1.1). */
const LOG_CONCAVE_FROM = 26;

export class SelfSimilarEngine {
  /** One proposal buffer per recursion level (kept until the merge). */
  private readonly proposals: BoltzmannProposal[] = [];
  /** X_1 of each level's accepted proposal. */
  private readonly onesAt: number[] = [];
  /** X_1 of the last accepted proposal. */
  private ones = 0;

  constructor(private readonly options: SelfSimilarOptions) {
    if (options.baseThreshold < 0 || options.baseThreshold > RestrictedPartitionTable.MAX_N) {
      throw new RangeError(`base threshold must be in [0, ${RestrictedPartitionTable.MAX_N}], got ${options.baseThreshold}`);
    }
  }

  /** A uniform partition of n in multiplicity form (sizes descending). */
  sample(source: RandomSource, n: number, stats?: SelfSimilarStats): Partition {
    // Level l draws the odd parts of the current sub-problem; scaled by 2^l they are the parts
    // of the final partition that are odd multiples of 2^l. Each level keeps its own proposal
    // buffer until the final merge, so nothing is copied per level.
    let level = 0;
    let current = n;
    while (current > this.options.baseThreshold) {
      if (level === this.proposals.length) this.proposals.push(new BoltzmannProposal());
      current = this.reduce(source, current, this.proposals[level], level === 0 ? stats : undefined, stats);
      this.onesAt[level] = this.ones;
      level++;
    }
    // Base: the table method on the last sub-problem; its parts are multiples of 2^level.
    const sizes: number[] = [];
    const multiplicities: number[] = [];
    sampleRestricted(this.options.table, source, current, current, sizes, multiplicities);
    return this.mergeLevels(level, sizes, multiplicities, 2 ** level);
  }

  /**
   * Merges the levels into one partition, sizes descending. Sizes of different levels never
   * coincide (odd multiples of different powers of 2; the base holds multiples of 2^levels).
   * The output arrays are allocated once; the merged tail (base, then deeper levels) sits at
   * their end, and each shallower level is merged in front of it in place: the write position
   * never passes the read position of the tail, so no element is overwritten before it is read.
   * Total moves ≈ twice the output, since the levels shrink geometrically.
   */
  private mergeLevels(levels: number, baseSizes: number[], baseMults: number[], baseScale: number): Partition {
    let total = baseSizes.length;
    for (let l = 0; l < levels; l++) total += this.proposals[l].count + (this.onesAt[l] > 0 ? 1 : 0);
    const sizes: number[] = new Array(total);
    const mults: number[] = new Array(total);
    let tail = total - baseSizes.length;
    for (let i = 0; i < baseSizes.length; i++) {
      sizes[tail + i] = baseSizes[i] * baseScale;
      mults[tail + i] = baseMults[i];
    }
    for (let l = levels - 1; l >= 0; l--) {
      const p = this.proposals[l];
      const scale = 2 ** l;
      const ones = this.onesAt[l];
      const offset = ones > 0 ? 1 : 0;
      // Level list ascending: size 1 (if any ones), then p.sizes[0..count); read from its end.
      let j = p.count - 1 + offset;
      let write = tail - (p.count + offset);
      let read = tail;
      tail = write;
      while (j >= 0) {
        const levelSize = j >= offset ? p.sizes[j - offset] * scale : scale;
        if (read < total && sizes[read] > levelSize) {
          sizes[write] = sizes[read];
          mults[write] = mults[read];
          read++;
        } else {
          sizes[write] = levelSize;
          mults[write] = j >= offset ? p.multiplicities[j - offset] : ones;
          j--;
        }
        write++;
      }
      // The rest of the tail is already in place (write === read from here on).
    }
    return { sizes, multiplicities: mults };
  }

  /**
   * Runs steps 1–3 at size n until acceptance; leaves the accepted odd parts in `proposal`, X_1 in this.ones, and
   * returns m = (n − T)/2.
   */
  private reduce(
    source: RandomSource,
    n: number,
    proposal: BoltzmannProposal,
    top?: SelfSimilarStats,
    all?: SelfSimilarStats,
  ): number {
    const logX = boltzmannLogX(n);
    const best = this.maximiser(n, logX);
    for (;;) {
      // Step 1: odd sizes >= 3 at x.
      const rest = proposal.draw(source, logX, 3, 2, n);
      if (top) top.topProposals++;
      if (all) {
        all.proposals++;
        all.visited += proposal.visited;
      }
      if (rest === BoltzmannProposal.OVER) continue;
      // X_1 drawn with the parity that makes n − T even: X_1 = j0 + 2G, G ~ Geometric(x²),
      // j0 = (n − rest) mod 2. This proposal has density x^{X_1 − j0}(1 − x²) instead of
      // x^{X_1}(1 − x), so the acceptance gains the factor x^{j0} <= 1 (below) and no proposal
      // is lost to parity — twice the acceptance rate of drawing X_1 freely.
      const j0 = (n - rest) % 2;
      const u = 1 - source.nextDouble();
      let g = 0;
      if (u < Math.exp(2 * logX)) g = Math.max(1, Math.floor(Math.log(u) / (2 * logX)));
      const ones = j0 + 2 * g;
      const t = rest + ones;
      if (t > n) continue;
      const m = (n - t) / 2;
      // log of p(m)x^{2m}x^{j0} / p(best)x^{2·best}; the ratio form keeps it accurate at large n.
      const logAccept = this.weightRatio(m, best, logX) + j0 * logX;
      if (logAccept >= 0 || source.nextDouble() < Math.exp(logAccept)) {
        this.ones = ones;
        return m;
      }
    }
  }

  /** log of p(a)x^{2a} / p(b)x^{2b}, by the stable log-ratio of partition numbers. */
  private weightRatio(a: number, b: number, logX: number): number {
    return this.options.logP.logRatio(a, b) + 2 * (a - b) * logX;
  }

  /** argmax over integers 0 <= m <= n/2 of log p(m) + 2m·logX. */
  maximiser(n: number, logX: number): number {
    const logP = this.options.logP;
    const half = Math.floor(n / 2);
    if (half < DIRECT_SEARCH_BELOW) {
      let best = 0;
      for (let m = 1; m <= half; m++) if (this.weightRatio(m, best, logX) > 0) best = m;
      return best;
    }
    // Continuous maximiser of the Rademacher term: d/dm log p = (C + C/(Cλ − 1) − 3/λ)/(2λ)
    // with λ = √(m − 1/24); set it equal to −2 log x and iterate λ (converges in a few steps).
    const C = Math.PI * Math.sqrt(2 / 3);
    let lambda = C / (-4 * logX);
    for (let i = 0; i < 4; i++) lambda = Math.max(1, (C + C / (C * lambda - 1) - 3 / lambda) / (-4 * logX));
    let m = Math.min(half, Math.max(LOG_CONCAVE_FROM, Math.round(lambda * lambda + 1 / 24)));
    // Hill-climb on the concave range [26, half]: compare neighbours by stable log-ratios.
    while (m < half && this.weightRatio(m + 1, m, logX) > 0) m++;
    while (m > LOG_CONCAVE_FROM && this.weightRatio(m - 1, m, logX) > 0) m--;
    // Below 26 log-concavity may fail: compare directly. Skipped when the peak is above
    // log p(25), since there f(s) <= log p(s) <= log p(25) (x < 1, p increasing).
    if (logP.log(m) + 2 * m * logX < logP.log(LOG_CONCAVE_FROM - 1)) {
      for (let s = 0; s < LOG_CONCAVE_FROM && s <= half; s++) if (this.weightRatio(s, m, logX) > 0) m = s;
    }
    return m;
  }
}

/** The self-similar method as a sampler for one n (the planner wraps it with its estimates). */
export class SelfSimilarSampler {
  readonly method = 'self-similar/1';
  private readonly engine: SelfSimilarEngine;

  constructor(
    readonly n: number,
    options: SelfSimilarOptions,
  ) {
    if (!Number.isInteger(n) || n < 0 || n > LogPartitionNumbers.MAX_M) {
      throw new RangeError(`n must be an integer in [0, ${LogPartitionNumbers.MAX_M}], got ${n}`);
    }
    this.engine = new SelfSimilarEngine(options);
  }

  sample(source: RandomSource, stats?: SelfSimilarStats): Partition {
    return this.engine.sample(source, this.n, stats);
  }
}
