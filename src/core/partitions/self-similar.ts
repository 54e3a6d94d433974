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
 * parts 2μ) with |A| + 2|μ| = n, all pairs equally likely. So:
 *
 *   1. draw the odd multiplicities A at x (BoltzmannProposal, start 1, step 2): P(A) ∝ x^{|A|};
 *   2. T = |A|; reject unless T <= n and n − T is even; m = (n − T)/2;
 *   3. accept with probability p(m)·x^{2m} / M, M = max_{0<=m'<=n/2} p(m')·x^{2m'} — then
 *      P(A accepted) ∝ x^T·p(m)·x^{2m} = x^n·p(m), the number of ways to complete A, as required;
 *   4. draw μ uniform among the p(m) partitions of m (recursively, same method), double its parts
 *      and merge with A.
 *
 * The maximiser of log p(m') + 2m' log x is found by hill-climbing from the continuous maximiser of
 * the Rademacher leading term; log p is concave for m' > 25 (p(m)² > p(m−1)p(m+1), DeSalvo & Pak
 * 2015), so the local maximum on [26, n/2] is global, and m' <= 25 is checked directly.
 * With x = exp(−π/√(6n)) the odd sizes carry half the mean size (n/2) and the weight p(m)x^{2m}
 * peaks at m ≈ n/4, so the acceptance rate tends to a constant (≈ 1/(2√2) with the parity loss)
 * and the recursion shrinks n by about 4 per level: total work is a constant multiple of one
 * proposal. Below `baseThreshold` the table method (table-recursive.ts) takes over.
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
  private readonly proposal = new BoltzmannProposal();
  /** X_1 of the last accepted proposal. */
  private ones = 0;

  constructor(private readonly options: SelfSimilarOptions) {
    if (options.baseThreshold < 0 || options.baseThreshold > RestrictedPartitionTable.MAX_N) {
      throw new RangeError(`base threshold must be in [0, ${RestrictedPartitionTable.MAX_N}], got ${options.baseThreshold}`);
    }
  }

  /** A uniform partition of n in multiplicity form (sizes descending). */
  sample(source: RandomSource, n: number, stats?: SelfSimilarStats): Partition {
    // Collect levels top-down: each level's odd parts, scaled by 2^level.
    const ascSizes: number[][] = [];
    const ascMults: number[][] = [];
    let scale = 1;
    let level = 0;
    let current = n;
    while (current > this.options.baseThreshold) {
      const m = this.reduce(source, current, level === 0 ? stats : undefined, stats);
      const count = this.proposal.count;
      const s: number[] = [];
      const mu: number[] = [];
      if (this.ones > 0) {
        s.push(scale);
        mu.push(this.ones);
      }
      for (let i = 0; i < count; i++) {
        s.push(this.proposal.sizes[i] * scale);
        mu.push(this.proposal.multiplicities[i]);
      }
      ascSizes.push(s);
      ascMults.push(mu);
      current = m;
      scale *= 2;
      level++;
    }
    // Base: table method, sizes descending, all multiples of `scale` once scaled.
    const baseSizes: number[] = [];
    const baseMults: number[] = [];
    sampleRestricted(this.options.table, source, current, current, baseSizes, baseMults);
    return mergeLevels(ascSizes, ascMults, baseSizes, baseMults, scale);
  }

  /**
   * Runs steps 1–3 at size n until acceptance; leaves the accepted odd parts in this.proposal and
   * returns m = (n − T)/2.
   */
  private reduce(source: RandomSource, n: number, top?: SelfSimilarStats, all?: SelfSimilarStats): number {
    const logX = boltzmannLogX(n);
    const best = this.maximiser(n, logX);
    const logP = this.options.logP;
    for (;;) {
      // Odd sizes >= 3 at x (step 1 of the class comment, without size 1).
      const rest = this.proposal.draw(source, logX, 3, 2, n);
      if (top) top.topProposals++;
      if (all) {
        all.proposals++;
        all.visited += this.proposal.visited;
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
      const logAccept = logP.logRatio(m, best) + 2 * (m - best) * logX + j0 * logX;
      if (logAccept >= 0 || source.nextDouble() < Math.exp(logAccept)) {
        this.ones = ones;
        return m;
      }
    }
  }

  /** argmax over integers 0 <= m <= n/2 of log p(m) + 2m·logX. */
  maximiser(n: number, logX: number): number {
    const logP = this.options.logP;
    const half = Math.floor(n / 2);
    const f = (m: number): number => logP.log(m) + 2 * m * logX;
    if (half < DIRECT_SEARCH_BELOW) {
      let best = 0;
      for (let m = 1; m <= half; m++) if (f(m) > f(best)) best = m;
      return best;
    }
    // Continuous maximiser of the Rademacher term: d/dm log p = (C + C/(Cλ − 1) − 3/λ)/(2λ)
    // with λ = √(m − 1/24); set it equal to −2 log x and iterate λ (converges in a few steps).
    const C = Math.PI * Math.sqrt(2 / 3);
    let lambda = C / (-4 * logX);
    for (let i = 0; i < 4; i++) lambda = Math.max(1, (C + C / (C * lambda - 1) - 3 / lambda) / (-4 * logX));
    let m = Math.min(half, Math.max(LOG_CONCAVE_FROM, Math.round(lambda * lambda + 1 / 24)));
    // Hill-climb on the concave range [26, half]: compare neighbours by stable log-ratios.
    const step = (a: number, b: number): number => logP.logRatio(a, b) + 2 * (a - b) * logX;
    while (m < half && step(m + 1, m) > 0) m++;
    while (m > LOG_CONCAVE_FROM && step(m - 1, m) > 0) m--;
    // Below 26 log-concavity may fail: compare directly. Skipped when the peak is above
    // log p(25), since there f(s) <= log p(s) <= log p(25) (x < 1, p increasing).
    if (f(m) < logP.log(LOG_CONCAVE_FROM - 1)) {
      for (let s = 0; s < LOG_CONCAVE_FROM && s <= half; s++) if (step(s, m) > 0) m = s;
    }
    return m;
  }
}

/**
 * Merges the levels into one partition, sizes descending. Level i holds odd multiples of 2^i, so
 * sizes from different levels never coincide, and the base holds multiples of 2^levels.
 */
function mergeLevels(
  ascSizes: number[][],
  ascMults: number[][],
  baseSizes: number[],
  baseMults: number[],
  scale: number,
): Partition {
  let total = baseSizes.length;
  for (const s of ascSizes) total += s.length;
  const sizes: number[] = new Array(total);
  const multiplicities: number[] = new Array(total);
  // k-way merge by repeated largest-head selection (few levels: ~log4(n / threshold)).
  const heads = ascSizes.map((s) => s.length - 1);
  let baseHead = 0;
  for (let out = 0; out < total; out++) {
    let bestLevel = -1;
    let bestSize = baseHead < baseSizes.length ? baseSizes[baseHead] * scale : -1;
    for (let l = 0; l < heads.length; l++) {
      const h = heads[l];
      if (h >= 0 && ascSizes[l][h] > bestSize) {
        bestSize = ascSizes[l][h];
        bestLevel = l;
      }
    }
    sizes[out] = bestSize;
    if (bestLevel < 0) {
      multiplicities[out] = baseMults[baseHead];
      baseHead++;
    } else {
      multiplicities[out] = ascMults[bestLevel][heads[bestLevel]];
      heads[bestLevel]--;
    }
  }
  return { sizes, multiplicities };
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
