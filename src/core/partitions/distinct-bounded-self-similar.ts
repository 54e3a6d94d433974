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
 * Exact uniform partitions of n into distinct parts in [a, c] (1 <= a <= MAX_A, c >= a or
 * c = ∞, not both a = 1 and c = ∞): the distinct self-similar engine with the bounds going down
 * the levels (a → ⌈a/2⌉, c → ⌊c/2⌋; derivation in distinct-self-similar.ts), its counts from
 * log-distinct-bounded-count.ts.
 *
 * `servable` is false when some count the levels could ask for is out of the counts' reach
 * (an upper bound near the middle of its polynomial at large n, where neither the integral's
 * tail series nor an exact table of bounded size serves it): the planner then keeps the other
 * methods. The check is worst-case: level l's size is at most n/2^l.
 */
export class DistinctBoundedSelfSimilarSampler implements PartitionSampler {
  /**
   * Largest a served: the counts it needs (b' = ⌈a/2⌉ <= 2500) were checked against exact BigInt
   * counts above their tables (test/partitions/log-distinct-bounded-count.test.ts, b' up to 200;
   * test/partitions/log-distinct-large-min-count.test.ts, b' = 201, 268, 400;
   * test/verify/distinct-large-min-counts.verify.ts, b' = 1000, 2500).
   */
  static readonly MAX_A = 5000;
  /**
   * Above a = 200 the method is planned only where n >= a²/4 (~a/4 parts or more): with fewer
   * parts the lower levels' counts are lumpy and their proposals many (measured: 15–20 per sample
   * at n >= a², 50–220 at n = 0.25a²–0.05a², a = 300, 2000; the estimate assumes ~1.5 per level);
   * such families keep the table and Boltzmann methods (few parts fit).
   */
  static serves(n: number, a: number): boolean {
    return a <= 200 || (a <= DistinctBoundedSelfSimilarSampler.MAX_A && 4 * n >= a * a);
  }
  readonly method = 'distinct-bounded-self-similar/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  /**
   * Filling the count tables (once per process), in sample steps: additions ×
   * STEPS_PER_ADDITION (~3 ns per addition measured against this method's ~40 ns step).
   */
  readonly setupWork: number;
  /** Doubles the tables hold (memory). */
  readonly setupCells: number;
  /** Whether every count the levels may need is served exactly (see the class comment). */
  readonly servable: boolean;
  private readonly engine: DistinctSelfSimilarEngine;

  constructor(
    readonly n: number,
    readonly a: number,
    tables: DistinctSelfSimilarTables = defaultTables,
    baseThreshold = Math.min(DISTINCT_BASE_THRESHOLD, tables.table.maxN),
    readonly c = Infinity,
  ) {
    if (!Number.isInteger(n) || n < 0 || n > LogDistinctBoundedCounts.MAX_M) {
      throw new RangeError(`n must be an integer in [0, ${LogDistinctBoundedCounts.MAX_M}], got ${n}`);
    }
    if (!Number.isInteger(a) || a < 1 || a > DistinctBoundedSelfSimilarSampler.MAX_A || (a === 1 && c === Infinity)) {
      throw new RangeError(`a must be an integer in [${c === Infinity ? 2 : 1}, ${DistinctBoundedSelfSimilarSampler.MAX_A}], got ${a}`);
    }
    if (c !== Infinity && (!Number.isInteger(c) || c < a)) throw new RangeError(`c must be an integer >= a or Infinity, got ${c}`);
    this.engine = new DistinctSelfSimilarEngine({ baseThreshold, table: tables.table, logQ: tables.logQ, bounded: tables.bounded });
    // Boltzmann means at the saddle point: Σ_{a<=k<=c} 1/(e^{kt} + 1) parts.
    const t = tables.bounded.saddle(a, Math.max(1, n), c);
    // The first 5000 sizes summed, the rest by the midpoint rule's integral,
    // (1/t)·[log(1 + e^{−x0 t}) − log(1 + e^{−x1 t})] over [x0, x1] = [k + ½, min(c, 40/t) + ½]
    // (~1e6 sizes at n = 1e9: the plain sum took ~20 ms of planning).
    let parts = 0;
    const last = Math.min(c, Math.ceil(40 / t));
    const direct = Math.min(last, a + 5000);
    for (let k = a; k <= direct; k++) parts += 1 / (Math.exp(k * t) + 1);
    if (last > direct) parts += (Math.log1p(Math.exp(-(direct + 0.5) * t)) - Math.log1p(Math.exp(-(last + 0.5) * t))) / t;
    this.expectedLength = Math.max(1, parts);
    this.expectedDistinct = this.expectedLength;
    // Per level: 1/P proposals (P ≈ PROPOSALS⁻¹ measured, as for plain distinct parts), each
    // visiting its odd sizes and evaluating one count, plus the maximiser's search (≈ log₂ n
    // counts; memoised at the top level). A count's cost depends on how it is served (table,
    // middle power series, tail series above the table; log-distinct-bounded-count.ts).
    const levels: Array<{ size: number; worst: number; b: number; cap: number }> = [];
    {
      let b = a;
      let cap = c;
      for (let size = n, worst = n; size > baseThreshold; size = Math.round(size / 4), worst = Math.floor(worst / 2)) {
        levels.push({ size, worst, b, cap });
        if (!(b === 1 && cap === Infinity)) {
          b = Math.ceil(b / 2);
          cap = Math.floor(cap / 2);
        }
      }
    }
    // The count tables smallest range first, so that each seeds the next one's (distinct-bounded-tables.ts).
    for (let i = levels.length - 1; i >= 0; i--) {
      const { b, cap } = levels[i];
      if (!(b === 1 && cap === Infinity) && Math.floor(cap / 2) >= Math.ceil(b / 2)) tables.bounded.countsFor(Math.ceil(b / 2), Math.floor(cap / 2));
    }
    let work = 2 * this.expectedLength + baseThreshold;
    let setup = 0;
    let cells = 0;
    let servable = true;
    const seeded = new Map<number, number>();
    for (const { size, worst, b, cap } of levels) {
      if (b === 1 && cap === Infinity) {
        work += visitsPerProposal(size) * PROPOSALS;
        continue;
      }
      const bp = Math.ceil(b / 2);
      const cp = Math.floor(cap / 2);
      const tLevel = tables.bounded.saddle(b, Math.max(1, size), cap);
      const visits = boundedVisits(tLevel, b % 2 === 1 ? b + 2 : b + 3, cap);
      let count = 1;
      if (bp === 1 && cp === Infinity) {
        count = COUNT_NODES * 2;
        setup += EXACT_COUNT_WORK;
      } else if (cp >= bp) {
        const counts = tables.bounded.countsFor(bp, cp) as LogDistinctBoundedCounts;
        // The sub-problem's typical size: (size − mean odd part sum at the level's tilt)/2.
        const oddMean = oddMeanSize(b % 2 === 1 ? b : b + 1, cap, tLevel);
        const typical = Math.max(1, Math.round((size - oddMean) / 2));
        const regime = counts.regime(typical);
        if (regime === 'middle') {
          count = MIDDLE_NODES * counts.middleTermsAt(typical) * SERIES_TERM_STEPS;
          setup += counts.seriesWork();
        } else if (regime === 'tail') {
          const tailTerms = cp === Infinity ? 0 : Math.min(400, 40 / Math.max(1e-9, (cp + 1) * Math.abs(tables.bounded.saddle(bp, typical, cp))));
          count = COUNT_NODES * (headSteps(bp) + TAIL_TERM_STEPS * tailTerms);
        }
        // The exact table to exactUpTo, from the previous (smaller) range with the same bp.
        const from = seeded.get(bp);
        setup += LogDistinctBoundedCounts.setupWork(bp, cp, counts.exactUpTo, from === undefined || from > cp ? bp - 1 : from);
        if (from === undefined || from > cp) seeded.set(bp, cp);
        cells += 2 * (counts.exactUpTo + 1);
        if (cp !== Infinity) {
          const top = Math.min(Math.floor(worst / 2), Math.floor(counts.total / 2));
          if (!counts.servable(top)) servable = false;
          else if (regime === 'grown') {
            // The sizes this level meets need an exact table grown past exactUpTo: built, so timed.
            const reach = Math.min(Math.floor(counts.total / 2), 2 * typical);
            setup += LogDistinctBoundedCounts.slowTableWork(bp, cp, reach);
            cells += reach + 1;
          } else if (top > counts.exactUpTo && counts.regime(top) === 'grown') {
            // An exact table grown on demand: its memory is counted, not its time, since it is
            // built only if a level's size lands far above its typical n/4^l (probability ~0).
            cells += top + 1;
          }
        }
      }
      work += PROPOSALS * (visits + count) + Math.log2(size) * count;
    }
    // Few parts (n < a², a > 200; every level has the same n_l/b_l²): the counts sit just above
    // their tables, where each takes many more nodes, and proposals are more (class comment).
    // Measured time over this estimate without the factor: ~3-18x at n = a²/4, ~1.5-3x at a²/2,
    // ~1x at a² (a = 700, 2000, 4918, after a warm-up, fresh seeds); the factor (a²/n)^1.7.
    if (a > 200 && n < a * a) work *= (a * a / Math.max(1, n)) ** FEW_PARTS_EXPONENT;
    this.expectedWork = work;
    this.setupWork = setup * STEPS_PER_ADDITION;
    this.setupCells = cells;
    this.servable = servable;
  }

  sample(source: RandomSource, stats?: DistinctSelfSimilarStats): Partition {
    return this.engine.sample(source, this.n, stats, this.a, this.c);
  }
}

/** Proposals per accepted level (measured ≈ 1.2–1.6 at n = 1e4..1e9 for a = 7, 50). */
const PROPOSALS = 1.5;
/** Nodes of a middle-regime count (the trapezoid's ±10/σ at step 0.5/σ) and steps per series term. */
const MIDDLE_NODES = 22;
const SERIES_TERM_STEPS = 0.25;

/**
 * Odd sizes s, s + 2, ... <= cap a proposal at tilt t visits: one by one while p_k > 1/4 (all of
 * them for t <= 0), then about VISITS_PER_TAIL_PART per part of the thinned tail
 * (Σ_{odd k > K} p_k ≈ (1/2t)·log((1 + e^{−Kt})/(1 + e^{−cap·t})), distinct-odd-proposal.ts).
 */
function boundedVisits(t: number, s: number, cap: number): number {
  if (!(t > 0)) return Math.max(0, (cap - s) / 2 + 1);
  const K = Math.min(cap, Math.log(3) / t);
  const direct = Math.max(0, (K - s) / 2 + 1);
  const tail = cap <= K ? 0 : (Math.log1p(Math.exp(-K * t)) - (cap === Infinity ? 0 : Math.log1p(Math.exp(-cap * t)))) / (2 * t);
  return direct + 1.5 * tail + 2;
}
/** Steps per count above the table: ~30 trapezoid nodes plus Newton, each over the parts below b' (headSteps). */
const COUNT_NODES = 30;
/**
 * Steps per node for the parts below b': one per part, or for b' > 32 their log-cosh power
 * series (log-distinct-bounded-count.ts), ~10-20 terms at the saddle points met here. Before, b'
 * per node was counted for every b': at a >= 700 the estimate was 10-50x the measured time
 * (n = 7e5-1.3e8, a = 700-4918), so box-mixture was built, and chosen, where it was slower.
 */
function headSteps(bp: number): number {
  return bp > 32 ? Math.min(bp, 20) : bp;
}
const FEW_PARTS_EXPONENT = 1.7;
const STEPS_PER_ADDITION = 0.05;
/** A tail-series term at a node (complex exp, log, atan2) against one head factor. */
const TAIL_TERM_STEPS = 3;

/**
 * Σ k/(e^{kt} + 1) over odd k from `first` (odd) to min(cap, 40/t) (to cap for t <= 0): the first ODD_MEAN_DIRECT
 * terms one by one, the rest by the midpoint rule over blocks of odd sizes (~ODD_MEAN_BLOCKS of
 * them, each spanning t·width <= ~0.04: relative error ~1e-4, for an estimate). The plain sum
 * took ~1e6 exponentials at n = 1e9 (~20 ms of planning).
 */
export function oddMeanSize(first: number, cap: number, t: number): number {
  // t <= 0 (past the middle of a finite range): every size up to cap.
  const last = t > 0 ? Math.min(cap, Math.floor(40 / t)) : cap;
  let sum = 0;
  let k = first;
  for (let i = 0; i < ODD_MEAN_DIRECT && k <= last; i++, k += 2) sum += k / (Math.exp(k * t) + 1);
  if (k > last) return sum;
  const terms = Math.floor((last - k) / 2) + 1;
  const stride = Math.max(1, Math.ceil(terms / ODD_MEAN_BLOCKS));
  for (let done = 0; done < terms; done += stride) {
    const count = Math.min(stride, terms - done);
    const mid = k + 2 * done + (count - 1);
    sum += (count * mid) / (Math.exp(mid * t) + 1);
  }
  return sum;
}
const ODD_MEAN_DIRECT = 2000;
const ODD_MEAN_BLOCKS = 1000;
