import { LogBoundedPartCounts, mainArcStart } from '../counting/log-bounded-part-count.js';
import { LogMinPartCounts } from '../counting/log-min-part-count.js';
import { LogPartitionNumbers } from '../counting/log-partition-number.js';
import { type LogConcaveCounts } from './concave-maximiser.js';
import { ConcaveSqueeze } from './concave-squeeze.js';
import { FallingDifferences } from './falling-differences.js';
import { MinPartTable } from './min-part-table.js';
import { SelfSimilarEngine } from './self-similar.js';
import { RestrictedPartitionTable } from './table-recursive.js';
import { boundedMaximiser } from './bounded-maximiser.js';

/** Sub-problems up to this size use the min-part table (201 × 202 cells). */
export const MIN_PART_BASE_THRESHOLD = 200;
/** The unrestricted engine's own table threshold (as unrestricted.ts). */
export const UNRESTRICTED_BASE = 1000;

/** The count tables and engines shared by the samplers: filled lazily, owned by this object. */
export class MinPartSelfSimilarTables {
  private readonly counts = new Map<number, LogMinPartCounts>();
  readonly table: MinPartTable;
  readonly unrestricted: SelfSimilarEngine;
  readonly logP: LogPartitionNumbers;

  constructor(baseThreshold = MIN_PART_BASE_THRESHOLD) {
    this.table = new MinPartTable(baseThreshold);
    this.logP = new LogPartitionNumbers();
    this.unrestricted = new SelfSimilarEngine({
      baseThreshold: UNRESTRICTED_BASE,
      table: new RestrictedPartitionTable(),
      logP: this.logP,
    });
  }

  private readonly bounded = new Map<string, LogBoundedPartCounts>();
  private readonly arcStarts = new Map<string, number>();
  private readonly boundedTables = new Map<number, MinPartTable>();

  /**
   * log c_{[a,b]} (parts in [a, b], b finite) with a table reaching every size up to maxM that the
   * main arc does not cover; a table too short for a new maxM is rebuilt longer.
   */
  boundedCountsFor(a: number, b: number, maxM: number): LogBoundedPartCounts {
    const key = `${a},${b}`;
    const end = this.boundedTableEnd(a, b, maxM);
    let c = this.bounded.get(key);
    if (c === undefined || c.exactUpTo < end) {
      c = new LogBoundedPartCounts(a, b, end);
      this.bounded.set(key, c);
    }
    return c;
  }

  /** The table end boundedCountsFor uses for sizes up to maxM. */
  boundedTableEnd(a: number, b: number, maxM: number): number {
    const key = `${a},${b}`;
    let start = this.arcStarts.get(key);
    if (start === undefined) {
      start = b < a ? 0 : mainArcStart(a, b);
      this.arcStarts.set(key, start);
    }
    return Math.min(maxM, start);
  }

  private readonly bests = new Map<string, number>();
  /** The forward differences of each bounded count family computed by its maximisers (falling-differences.ts). */
  private readonly differences = new WeakMap<object, FallingDifferences>();
  /** The remembered forward differences log c(m) − log c(m − 1) of a count family. */
  differencesFor(counts: LogConcaveCounts | LogBoundedPartCounts): FallingDifferences {
    let differences = this.differences.get(counts);
    if (differences === undefined) {
      differences = new FallingDifferences((m) => counts.logRatio(m, m - 1));
      this.differences.set(counts, differences);
    }
    return differences;
  }
  /** boundedMaximiser, remembered per (counts, n) (the top level repeats it for every sample). */
  boundedBest(counts: LogBoundedPartCounts, n: number, logX: number): number {
    const key = `${counts.a},${counts.b},${n}`;
    let best = this.bests.get(key);
    if (best === undefined) {
      best = boundedMaximiser(counts, n, logX, this.differencesFor(counts));
      if (this.bests.size >= 4096) this.bests.clear();
      this.bests.set(key, best);
    }
    return best;
  }

  /** The base table for parts in [k, maxPart] (maxPart clamped to the table size). */
  boundedTable(maxPart: number): MinPartTable {
    const top = Math.min(maxPart, this.table.maxN);
    if (top === this.table.maxN) return this.table;
    let t = this.boundedTables.get(top);
    if (t === undefined) {
      t = new MinPartTable(this.table.maxN, top);
      this.boundedTables.set(top, t);
    }
    return t;
  }

  private readonly squeezes = new WeakMap<object, ConcaveSqueeze>();
  /**
   * The squeeze (concave-squeeze.ts) on the log-counts above a table's end, where they are the
   * saddle-point values (concave: see the counts' files) and dear; null for counts without a
   * table end (the partition numbers: a closed form, cheap).
   */
  squeezeFor(counts: LogConcaveCounts | LogBoundedPartCounts): ConcaveSqueeze | null {
    if (!('exactUpTo' in counts)) return null;
    let q = this.squeezes.get(counts);
    if (q === undefined) {
      q = new ConcaveSqueeze();
      this.squeezes.set(counts, q);
    }
    return q;
  }

  /** log c_b for b >= 1 (b = 1: the partition numbers). */
  countsFor(b: number): LogConcaveCounts {
    if (b === 1) return { logRatio: (x, y) => this.logP.logRatio(x, y), log: (m) => this.logP.log(m), logConcaveFrom: () => 26 };
    let c = this.counts.get(b);
    if (c === undefined) {
      c = new LogMinPartCounts(b);
      this.counts.set(b, c);
    }
    return c;
  }
}

let shared: MinPartSelfSimilarTables | null = null;
/** The process-wide tables (shared by the minPart and bounded samplers). */
export function defaultTables(): MinPartSelfSimilarTables {
  shared ??= new MinPartSelfSimilarTables();
  return shared;
}
