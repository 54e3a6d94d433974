import { LogBoundedPartCounts, boundedPartSaddle } from '../counting/log-bounded-part-count.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import {
  MIN_PART_BASE_THRESHOLD,
  MinPartSelfSimilarEngine,
  defaultTables,
  type MinPartSelfSimilarStats,
  type MinPartSelfSimilarTables,
} from './min-part-self-similar.js';

/**
 * Exact uniform partitions of n into parts in [a, b] (1 <= a <= b < n) by self-similarity: the
 * minPart engine (min-part-self-similar.ts) with an upper bound. A partition with parts in [a, b]
 * is (A, 2μ): A its odd parts (all in [a, b]) and μ its even parts halved, a partition into parts
 * in [⌈a/2⌉, ⌊b/2⌋]; A is drawn by Boltzmann proposals over the odd sizes up to b and accepted
 * with probability ∝ c_{[⌈a/2⌉,⌊b/2⌋]}((n − |A|)/2) (log-bounded-part-count.ts), μ recursively.
 * Sizes shrink by ~4 and b by 2 per level, so b²/n stays about constant down the levels; sizes
 * <= MIN_PART_BASE_THRESHOLD go to the table (min-part-table.ts, with its upper bound).
 *
 * Served (planner): families where each level's counts are tables of at most TABLE_LIMIT
 * additions, or the main arc above them, so b not far below √n (for parts <= b the arc at q = −1
 * carries poles of order ⌊b/2⌋; see the counts' comment). "At most K parts" and "exactly k
 * parts" reach it through conjugation (plan-length.ts).
 */
export class BoundedSelfSimilarSampler implements PartitionSampler {
  readonly method = 'bounded-self-similar/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  /** Additions filling the count tables (time). */
  readonly setupWork: number;
  /** Doubles the tables hold (memory). */
  readonly setupCells: number;
  private readonly engine: MinPartSelfSimilarEngine;

  constructor(
    readonly n: number,
    readonly a: number,
    readonly b: number,
    private readonly tables: MinPartSelfSimilarTables = defaultTables(),
    baseThreshold = Math.min(MIN_PART_BASE_THRESHOLD, tables.table.maxN),
  ) {
    if (!Number.isInteger(n) || n < 1 || n > LogBoundedPartCounts.MAX_M) throw new RangeError(`n must be an integer in [1, ${LogBoundedPartCounts.MAX_M}], got ${n}`);
    if (!Number.isInteger(a) || a < 1) throw new RangeError(`a must be a positive integer, got ${a}`);
    if (!Number.isInteger(b) || b < a) throw new RangeError(`b must be an integer >= a, got ${b}`);
    this.engine = new MinPartSelfSimilarEngine({ baseThreshold, tables });
    const top = Math.min(b, n);
    const t = boundedPartSaddle(a, top, n);
    // Boltzmann means at the saddle: parts Σ x^k/(1 − x^k) (the first 5000 sizes summed, the rest
    // by its integral, (1/t)·log((1 − x^{k1+½})/(1 − x^{k0−½}))), distinct sizes Σ x^k (geometric).
    let parts = 0;
    const last = Math.min(top, a + Math.ceil(45 / t));
    const direct = Math.min(last, a + 5000);
    for (let k = a; k <= direct; k++) parts += Math.exp(-k * t) / -Math.expm1(-k * t);
    if (last > direct) parts += (Math.log(-Math.expm1(-(last + 0.5) * t)) - Math.log(-Math.expm1(-(direct + 0.5) * t))) / t;
    const distinct = (Math.exp(-a * t) * -Math.expm1(-(top - a + 1) * t)) / -Math.expm1(-t);
    this.expectedLength = Math.max(1, parts);
    this.expectedDistinct = Math.max(1, distinct);
    // Per level (typical size n/4^l): ~PROPOSALS proposals, each visiting the odd sizes that occur
    // (oddSizesVisited: each odd size while x^k > 0.3, then those that occur), and above the
    // level's table the counts that the remembered ones do not serve (SQRT_STEPS).
    let work = 2 * this.expectedDistinct + 1000;
    let setup = 0;
    let cells = 0;
    let size = n;
    let lo = a;
    let hi = top;
    let cap = n;
    // The levels the engine sets up tables for: sizes up to n/2^l at level l (reach). A table is
    // filled only when the level's sizes reach it (LogBoundedPartCounts fills it on first use):
    // counted when the typical size (a quarter of the level's) is within TABLE_REACH_SD standard
    // deviations of the half the odd parts leave (oddPartsSizeSd) above its end.
    while (size > baseThreshold && lo <= hi) {
      const tl = boundedPartSaddle(lo, hi, size);
      const odd = oddSizesVisited(lo, hi, tl);
      const nextLo = Math.ceil(lo / 2);
      const nextHi = Math.floor(hi / 2);
      cap = Math.floor(cap / 2);
      const end = nextHi < nextLo ? 0 : tables.boundedTableEnd(nextLo, nextHi, cap);
      work += VISITED_STEPS * PROPOSALS * (odd + 2) + (size / 2 <= end ? 2 * Math.log2(size) : SQRT_STEPS * Math.sqrt(size) + NARROW_LEVEL_STEPS * Math.min(64, (Math.sqrt(size) / hi) ** 2));
      if (nextHi >= nextLo && size / 4 - (TABLE_REACH_SD * oddPartsSizeSd(lo, hi, tl)) / 2 <= end) {
        setup += LogBoundedPartCounts.setupWork(nextLo, nextHi, end);
        cells += 2 * (end + 1);
      }
      size = Math.round(size / 4);
      lo = nextLo;
      hi = nextHi;
    }
    this.expectedWork = work;
    this.setupWork = setup + tables.table.size;
    this.setupCells = cells + tables.table.size;
  }

  /** Most count-table additions (setup time, ~1.4 ns each) and doubles a planner lets it use. */
  static readonly SETUP_LIMIT = 1e8;
  static readonly CELL_LIMIT = 5e6;

  /** Whether the setup fits the limits above. */
  fitsLimits(): boolean {
    return this.setupWork <= BoundedSelfSimilarSampler.SETUP_LIMIT && this.setupCells <= BoundedSelfSimilarSampler.CELL_LIMIT;
  }

  sample(source: RandomSource, stats?: MinPartSelfSimilarStats): Partition {
    return this.engine.sample(source, this.n, this.a, stats, Math.min(this.b, this.n));
  }
}

/**
 * Tables are counted in the setup while a level's typical half-size is within this many standard
 * deviations of their end (beyond, a level reaches them less than once in ~1e9 samples, and the
 * table, filled then, costs one such sample at most setupWork additions).
 */
const TABLE_REACH_SD = 6;

/** The Boltzmann proposal's threshold between its direct phase and thinning (boltzmann-proposal.ts). */
const DIRECT_PHASE_Q = 0.3;

/**
 * Sizes one proposal visits over the odd sizes in [lo, hi] at x = e^{−t}: each odd size while
 * x^k > DIRECT_PHASE_Q, then about one candidate per occurring size, Σ x^k over the rest
 * (boltzmann-proposal.ts).
 */
function oddSizesVisited(lo: number, hi: number, t: number): number {
  const switchAt = Math.log(1 / DIRECT_PHASE_Q) / t;
  const direct = Math.max(0, Math.min(hi, switchAt) - lo) / 2;
  const from = Math.max(lo, switchAt);
  if (from >= hi) return direct;
  // Σ_{odd k in [from, hi]} x^k ≈ x^from (1 − x^(hi − from + 2)) / (1 − x²).
  return direct + (Math.exp(-t * from) * -Math.expm1(-t * (hi - from + 2))) / -Math.expm1(-2 * t);
}

/**
 * Standard deviation of the size of the odd parts in [lo, hi] under the Boltzmann law at
 * x = e^{−t}: Σ_{odd k} k² x^k / (1 − x^k)², summed over the odd sizes with x^k > e^{−40}
 * (at most 4000 of them; beyond, the midpoint sum of 4000 evenly spaced ones, scaled).
 */
function oddPartsSizeSd(lo: number, hi: number, t: number): number {
  const first = lo % 2 === 1 ? lo : lo + 1;
  const last = Math.min(hi, first + 40 / t);
  const count = Math.max(0, Math.floor((last - first) / 2) + 1);
  const terms = Math.min(count, 4000);
  const stride = count / terms;
  let variance = 0;
  for (let i = 0; i < terms; i++) {
    const k = first + 2 * Math.floor((i + 0.5) * stride);
    const q = Math.exp(-t * k);
    const d = -Math.expm1(-t * k);
    variance += (k * k * q) / (d * d);
  }
  return Math.sqrt(variance * stride);
}

/** Proposals per level (1/acceptance, measured ~1.3-1.6). */
const PROPOSALS = 1.5;
/*
 * The per-sample terms below were fitted to process CPU time after a 2.5 s warm-up (counts
 * remembered), b = √n/4, √n, 2√n and a = 7 with b = √n at n = 1e4-1e9 (a sweep of
 * BoundedSelfSimilarSampler; the planner's view of it is scripts/bench/plan-fit.ts):
 * time ≈ 34 ns × PROPOSALS·(odd + 2) + 73 ns × √size per level above its table + ~30-130 µs per
 * such level, more where b is small against √size (b = √n/4: the deeper levels' bounds are
 * small and their counts miss more). With that level term linear in √size / b, measured /
 * estimated was 2-4 for b = √n/8 and √n/4 at n = 1e6-1e8 (`npm run bench -- plan-fit`
 * length=sqrt(n)/4 at 1e7: 5.05 ms against 1.27; a direct sweep, 150-300 ms warm-up, process
 * CPU, load < 0.3: b = √n/8 6.9 ms against 1.84 at 1e7, 11.8 against 3.17 at 1e8), so the planner
 * took it over bounded-boltzmann (3.0 ms measured) for length / maxLength = √n/4 at 1e7. It is
 * now quadratic in √size / b (cap 64): the same sweep measures 0.6-0.95 of the estimate for
 * b = √n/8 and √n/4 at n = 1e6-1e8 (0.16-1.1 at 1e5, where it is an over-estimate); b = √n/2
 * gains ~40% at 1e7 (r = 2), b = √n is unchanged and 2√n slightly lower (measured 0.6-3 there,
 * higher at n = 1e6-1e7 on short warm-ups).
 * In steps of this method's 30 ns row:
 */
/** Per estimated odd size of a proposal. */
const VISITED_STEPS = 1.1;
/** Per √size of a level above its count table (its counts the remembered ones miss). */
const SQRT_STEPS = 2.4;
/** Per level above its table, times (√size / b)² (at most 64). */
const NARROW_LEVEL_STEPS = 1100;
