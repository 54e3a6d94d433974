import { LogDistinctBoundedCounts, distinctBoundedSaddle } from '../counting/log-distinct-bounded-count.js';
import type { LogDistinctPartitionNumbers } from '../counting/log-distinct-partition-number.js';
import { concaveMaximiser, type LogConcaveCounts } from './concave-maximiser.js';
import { DistinctPartitionTable } from './distinct-table.js';

/** What a level of the bounded distinct engine needs of its counts. */
export type DistinctCounts = LogConcaveCounts;

/**
 * The count tables and base tables the distinct self-similar engine uses for a smallest part
 * a >= 2 (distinct-self-similar.ts): log Q_b for b = ⌈a/2⌉, ⌈a/4⌉, ..., and unranking tables for
 * distinct parts >= b. Filled lazily, owned by this object (pure caches).
 */
export class DistinctBoundedTables {
  private readonly counts = new Map<string, LogDistinctBoundedCounts>();
  private readonly tables = new Map<number, DistinctPartitionTable>();
  private readonly plain: DistinctCounts;

  constructor(
    readonly baseThreshold: number,
    logQ: LogDistinctPartitionNumbers,
  ) {
    // q(m)² > q(m − 1)q(m + 1) for all m >= 33 (distinct-self-similar.ts).
    this.plain = { logRatio: (x, y) => logQ.logRatio(x, y), log: (m) => logQ.log(m), logConcaveFrom: () => 33 };
  }

  /** log Q for distinct parts in [b, c] (b = 1, c = ∞: the plain q; c < b: only Q(0) = 1). */
  countsFor(b: number, c = Infinity): DistinctCounts {
    if (b === 1 && c === Infinity) return this.plain;
    if (c < b) return EMPTY_RANGE;
    const key = `${b},${c}`;
    let counts = this.counts.get(key);
    if (counts === undefined) {
      counts = new LogDistinctBoundedCounts(b, c, undefined, this.below(b, c));
      this.counts.set(key, counts);
    }
    return counts;
  }

  /** The counts already made for smallest part b with the largest upper bound below c (their table seeds c's). */
  private below(b: number, c: number): LogDistinctBoundedCounts | undefined {
    let best: LogDistinctBoundedCounts | undefined;
    for (const counts of this.counts.values()) {
      if (counts.a === b && counts.b < c && (best === undefined || counts.b > best.b)) best = counts;
    }
    return best;
  }

  /** The unranking table for distinct parts >= lo up to the base threshold. */
  tableFor(lo: number): DistinctPartitionTable {
    let t = this.tables.get(lo);
    if (t === undefined) {
      t = new DistinctPartitionTable(this.baseThreshold, lo);
      this.tables.set(lo, t);
    }
    return t;
  }

  /**
   * t with Boltzmann mean size ≈ n for distinct parts in [b, c] (any real t is exact for a finite
   * c, any t > 0 for c = ∞; this one is efficient): negative past the middle of a finite range
   * (n > S/2), 0 at it (log-distinct-bounded-count.ts, tilt).
   */
  saddle(b: number, n: number, c = Infinity): number {
    if (c !== Infinity && c >= b) {
      const t = (this.countsFor(b, c) as LogDistinctBoundedCounts).tilt(n);
      return Number.isFinite(t) ? t : 1 / c;
    }
    const t = distinctBoundedSaddle(b, c, n);
    return t > 0 && Number.isFinite(t) ? t : c === Infinity ? Math.PI / Math.sqrt(12 * n) : 1 / c;
  }

  /** argmax over integers 0 <= m <= n/2 of log Q(m) + 2m·logX (concave-maximiser.ts). */
  maximiser(counts: DistinctCounts, n: number, logX: number, guess?: number): number {
    return concaveMaximiser(counts, n, logX, guess);
  }
}

/**
 * A guess of the maximiser of Q(m)·x^{2m}, Q for distinct parts in [b, c]: where d log Q/dm ≈
 * (Q's saddle point at m) equals 2t, i.e. the Boltzmann mean size Σ_{b<=k<=c} k/(e^{2tk} + 1).
 */
export function maximiserGuess(b: number, c: number, t: number): number {
  // Past the middle (t < 0): the mean at −t taken from the sum of all sizes (symmetry).
  if (t < 0 && c !== Infinity) return ((b + c) * (c - b + 1)) / 2 - maximiserGuess(b, c, -t);
  if (t === 0 && c !== Infinity) return ((b + c) * (c - b + 1)) / 4;
  // A midpoint sum over at most ~GUESS_TERMS strides (only a guess: the search is exact anyway).
  const last = Math.min(c, b + 40 / (2 * t));
  const stride = Math.max(1, Math.floor((last - b + 1) / GUESS_TERMS));
  let mean = 0;
  for (let k = b; k <= last; k += stride) {
    const mid = k + (Math.min(stride, last - k + 1) - 1) / 2;
    mean += (Math.min(stride, last - k + 1) * mid) / (Math.exp(2 * t * mid) + 1);
  }
  return mean;
}

const GUESS_TERMS = 500;

/** Counts of an empty range of part sizes: only the empty partition. */
const EMPTY_RANGE: DistinctCounts = {
  log: (m) => (m === 0 ? 0 : -Infinity),
  logRatio: (m1, m2) => (m1 === 0 ? 0 : -Infinity) - (m2 === 0 ? 0 : -Infinity),
  logConcaveFrom: () => 0,
};
