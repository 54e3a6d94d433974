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
    // (all odd sizes in [a, b] with x^k > e^{-40}), and above the level's table the counts that
    // the remembered ones do not serve (SQRT_STEPS).
    let work = 2 * this.expectedDistinct + 1000;
    let setup = 0;
    let cells = 0;
    let size = n;
    let lo = a;
    let hi = top;
    let cap = n;
    // The levels the engine sets up tables for: sizes up to n/2^l at level l (reach).
    while (size > baseThreshold && lo <= hi) {
      const tl = boundedPartSaddle(lo, hi, size);
      const odd = Math.max(0, Math.min(hi, lo + 40 / tl) - lo) / 2;
      const nextLo = Math.ceil(lo / 2);
      const nextHi = Math.floor(hi / 2);
      cap = Math.floor(cap / 2);
      const end = nextHi < nextLo ? 0 : tables.boundedTableEnd(nextLo, nextHi, cap);
      work += VISITED_STEPS * PROPOSALS * (odd + 2) + (size / 2 <= end ? 2 * Math.log2(size) : SQRT_STEPS * Math.sqrt(size) + NARROW_LEVEL_STEPS * Math.min(8, Math.sqrt(size) / hi));
      if (nextHi >= nextLo) {
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

/** Proposals per level (1/acceptance, measured ~1.3-1.6). */
const PROPOSALS = 1.5;
/*
 * The per-sample terms below were fitted to process CPU time after a 2.5 s warm-up (counts
 * remembered), b = √n/4, √n, 2√n and a = 7 with b = √n at n = 1e4-1e9 (a sweep of
 * BoundedSelfSimilarSampler; the planner's view of it is scripts/bench/plan-fit.ts):
 * time ≈ 34 ns × PROPOSALS·(odd + 2) + 73 ns × √size per level above its table + ~30-130 µs per
 * such level, more where b is small against √size (b = √n/4: the deeper levels' bounds are
 * small and their counts miss more). Measured / estimated 0.6-1.6, 2-3 for b = √n/4 at
 * n = 1e7-1e8. In steps of this method's 30 ns row:
 */
/** Per estimated odd size of a proposal. */
const VISITED_STEPS = 1.1;
/** Per √size of a level above its count table (its counts the remembered ones miss). */
const SQRT_STEPS = 2.4;
/** Per level above its table, times √size / b (at most 8). */
const NARROW_LEVEL_STEPS = 1100;
