import { LogDistinctBoundedCounts, defaultDistinctExactUpTo } from '../counting/log-distinct-bounded-count.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import {
  DISTINCT_BASE_THRESHOLD,
  DistinctSelfSimilarEngine,
  EXACT_COUNT_WORK,
  defaultTables,
  visitsPerProposal,
  type DistinctSelfSimilarStats,
  type DistinctSelfSimilarTables,
} from './distinct-self-similar.js';

/**
 * Exact uniform partitions of n into distinct parts >= a (2 <= a <= MAX_A): the distinct
 * self-similar engine with a smallest part going down the levels (b → ⌈b/2⌉; derivation in
 * distinct-self-similar.ts), its counts from log-distinct-bounded-count.ts.
 */
export class DistinctBoundedSelfSimilarSampler implements PartitionSampler {
  /**
   * Largest a served: the counts it needs (b' = ⌈a/2⌉ <= 100) were checked against exact BigInt
   * counts (test/partitions/log-distinct-bounded-count.test.ts, b' up to 100).
   */
  static readonly MAX_A = 200;
  readonly method = 'distinct-bounded-self-similar/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  /**
   * Filling the count tables (once per process), in sample steps: additions ×
   * STEPS_PER_ADDITION (~3 ns per addition measured against this method's ~60 ns step).
   */
  readonly setupWork: number;
  /** Doubles the tables hold (memory). */
  readonly setupCells: number;
  private readonly engine: DistinctSelfSimilarEngine;

  constructor(
    readonly n: number,
    readonly a: number,
    tables: DistinctSelfSimilarTables = defaultTables,
    baseThreshold = Math.min(DISTINCT_BASE_THRESHOLD, tables.table.maxN),
  ) {
    if (!Number.isInteger(n) || n < 0 || n > LogDistinctBoundedCounts.MAX_M) {
      throw new RangeError(`n must be an integer in [0, ${LogDistinctBoundedCounts.MAX_M}], got ${n}`);
    }
    if (!Number.isInteger(a) || a < 2 || a > DistinctBoundedSelfSimilarSampler.MAX_A) {
      throw new RangeError(`a must be an integer in [2, ${DistinctBoundedSelfSimilarSampler.MAX_A}], got ${a}`);
    }
    this.engine = new DistinctSelfSimilarEngine({ baseThreshold, table: tables.table, logQ: tables.logQ, bounded: tables.bounded });
    // Boltzmann means at the saddle point: Σ_{k>=a} 1/(e^{kt} + 1) parts.
    const t = tables.bounded.saddle(a, Math.max(1, n));
    let parts = Math.LN2 / t - 0.25; // all k >= 1 (Euler–Maclaurin), minus k < a:
    for (let k = 1; k < a; k++) parts -= 1 / (Math.exp(k * t) + 1);
    this.expectedLength = Math.max(1, parts);
    this.expectedDistinct = this.expectedLength;
    // Per level: 1/P proposals (P ≈ PROPOSALS⁻¹ measured, as for plain distinct parts), each
    // visiting the odd sizes and evaluating one count (≈ COUNT_NODES·b' steps above the table),
    // plus the maximiser's bisection (≈ log₂ n counts; memoised at the top level).
    let work = 2 * this.expectedLength + baseThreshold;
    let setup = 0;
    let cells = 0;
    let size = n;
    let b = a;
    for (; size > baseThreshold; size = Math.round(size / 4)) {
      if (b === 1) {
        work += visitsPerProposal(size) * PROPOSALS;
        continue;
      }
      const bp = Math.ceil(b / 2);
      work += PROPOSALS * (visitsPerProposal(size) + COUNT_NODES * bp) + Math.log2(size) * COUNT_NODES * bp;
      if (bp > 1) {
        setup += LogDistinctBoundedCounts.setupWork(bp);
        cells += 2 * (defaultDistinctExactUpTo(bp) + 1);
      } else {
        setup += EXACT_COUNT_WORK;
      }
      b = bp;
    }
    // The base table for the last smallest part (cells, ~1 step each).
    setup += (baseThreshold + 1) ** 2 / STEPS_PER_ADDITION;
    cells += (baseThreshold + 1) ** 2;
    this.expectedWork = work;
    this.setupWork = setup * STEPS_PER_ADDITION;
    this.setupCells = cells;
  }

  sample(source: RandomSource, stats?: DistinctSelfSimilarStats): Partition {
    return this.engine.sample(source, this.n, stats, this.a);
  }
}

/** Proposals per accepted level (measured ≈ 1.3–1.5 at n = 1e4..1e9 for a = 7, 50). */
const PROPOSALS = 1.5;
/** Steps per count above the table: ~30 trapezoid nodes plus Newton, each over b' factors. */
const COUNT_NODES = 30;
const STEPS_PER_ADDITION = 0.05;
