import { solveTilt } from '../compositions/tilt.js';
import { fixedCountTable, freeCountTable } from '../compositions/count-table.js';
import { fixedCore, freeCore, type FixedCore, type FreeCore } from '../compositions/reduce.js';
import { partBounds, partCount, resolveCompositions } from '../compositions/resolve.js';
import { log2Binomial } from '../counting/binomial.js';
import { MAX_COUNT_BITS } from '../counting/composition-counts.js';
import { EmptyFamilyError, LimitExceededError } from '../errors.js';
import type { CompositionFamily } from '../family.js';
import { gapBitsRank, gapBitsUnrank } from './gap-bits.js';
import { bigintCellBytes, fitsRankLimit, largestFittingN, rankLimitError, type TableSize } from './limits.js';
import { compositionMembershipError } from './membership.js';
import { checkRank, checkStart, emptyRanker, walkIterator, type OrderWalk, type Ranker } from './ranker.js';

/**
 * The ranker of a composition family: members as their parts in order, in lexicographic order of
 * the part sequence (1 + ... + 1 first, n last).
 *
 * The family is first brought to its core (compositions/reduce.ts): parts shift + scale * v with
 * core parts v, an order-preserving map, so the core's lexicographic order is the family's. The
 * core is ranked with its exact count table (compositions/count-table.ts): c(m) compositions of
 * a remainder m (free length) or C(j, m) into j parts (exact length), and at each position the
 * members continuing with a smaller part come first — rank = sum over positions of the counts of
 * completions after every smaller allowed part (the recursive method of Nijenhuis & Wilf 1978,
 * read as an index). Compositions of n with no constraint need no table: see gap-bits.ts.
 *
 * Throws RangeError for a malformed family and LimitExceededError past RANK_TABLE_BYTES (naming
 * the largest n that fits); an empty family gets a ranker with count 0.
 */
export function compositionRanker(family: CompositionFamily): Ranker {
  const core = coreOf(family);
  if ('empty' in core) return emptyRanker(core.empty);
  if (core.kind === 'free' && isAllCompositions(core)) return new CompositionRanker(gapBitsCounts(core), family);
  const size = coreTableSize(core);
  if (!fitsRankLimit(size)) throw rankLimitError('compositions', family, size, largestRankableCompositionN(family));
  return new CompositionRanker(core.kind === 'free' ? freeCounts(core) : fixedCounts(core), family);
}

/**
 * The estimated table of a composition family (0 for an empty family; no table for all
 * compositions, which are over the limit only when their count has more than MAX_COUNT_BITS bits).
 */
export function compositionRankTableSize(family: CompositionFamily): TableSize {
  const core = coreOf(family);
  if ('empty' in core) return { cells: 0, bytes: 0 };
  if (isAllCompositions(core)) return { cells: 0, bytes: core.n - 1 > MAX_COUNT_BITS ? Infinity : 0 };
  return coreTableSize(core);
}

/** The largest n whose table fits the limit with the family's other constraints (-1 if none). */
export function largestRankableCompositionN(family: CompositionFamily): number {
  return largestFittingN(family.n, (n) => compositionRankTableSize({ ...family, n }));
}

function coreOf(family: CompositionFamily): FreeCore | FixedCore | { readonly empty: string } {
  try {
    const resolved = resolveCompositions(family);
    return resolved.length === undefined ? freeCore(resolved) : fixedCore(resolved);
  } catch (error) {
    if (error instanceof EmptyFamilyError) return { empty: error.message };
    throw error;
  }
}

/** Every composition of the core size (parts 1 ... n): 2^(n-1) members, ranked by their gaps. */
function isAllCompositions(core: FreeCore | FixedCore): boolean {
  return core.kind === 'free' && core.parts.kind === 'range' && core.parts.min === 1 && core.parts.max >= core.n;
}

/**
 * Counts per m in BigInt: the free table holds c(0..n), about g * m bits each (g = the growth in
 * bits per unit, from the tilt root; Flajolet & Sedgewick 2009, Thm V.1); the fixed table holds
 * (k + 1)(n + 1) counts, each at most the number of weak compositions C(n + k - 1, k - 1).
 */
function coreTableSize(core: FreeCore | FixedCore): TableSize {
  if (core.kind === 'free') {
    const { n } = core;
    const growthBits = partCount(core.parts) < 2 ? 0 : solveTilt(core.parts).t / Math.LN2;
    const cells = n + 1;
    // Sum of bigintCellBytes(g * m + 1) over m = 0..n, to within a word per cell.
    return { cells, bytes: cells * bigintCellBytes(1) + (8 * growthBits * n * (n + 1)) / 2 / 64 };
  }
  const cells = (core.k + 1) * (core.n + 1);
  const bits = Math.max(1, log2Binomial(core.n + core.k - 1, core.k - 1) + 1);
  return { cells, bytes: cells * bigintCellBytes(bits) };
}

/**
 * What the walk needs of the core: its size, number of parts (fixed) and allowed parts (a range
 * or an ascending list), the completion counts, and how core parts map to the family's parts.
 * `left` is the number of parts still to place (fixed length); free families ignore it.
 */
interface CoreCounts {
  /** Ranked by the gaps (all compositions, gap-bits.ts) or with a count table. */
  readonly by: 'gaps' | 'table';
  readonly n: number;
  readonly k: number | undefined;
  readonly values: readonly number[] | null;
  readonly min: number;
  readonly max: number;
  readonly shift: number;
  readonly scale: number;
  /** Completions of a remainder m with `left` parts to go. */
  count(left: number, m: number): bigint;
  /** Whether there is at least one such completion (m >= 0). */
  feasible(left: number, m: number): boolean;
}

function freeCounts(core: FreeCore): CoreCounts {
  const c = freeCountTable(core);
  const { min, max } = partBounds(core.parts);
  return {
    by: 'table',
    n: core.n,
    k: undefined,
    values: core.parts.kind === 'list' ? core.parts.values : null,
    min,
    max,
    shift: 0,
    scale: core.scale,
    count: (_left, m) => c[m],
    feasible: (_left, m) => c[m] !== 0n,
  };
}

function fixedCounts(core: FixedCore): CoreCounts {
  const rows = fixedCountTable(core);
  const { min, max } = partBounds(core.parts);
  return {
    by: 'table',
    n: core.n,
    k: core.k,
    values: core.parts.kind === 'list' ? core.parts.values : null,
    min,
    max: Math.min(max, core.n),
    shift: core.shift,
    scale: core.scale,
    count: (left, m) => rows[left][m],
    feasible: (left, m) => rows[left][m] !== 0n,
  };
}

function gapBitsCounts(core: FreeCore): CoreCounts {
  if (core.n - 1 > MAX_COUNT_BITS) {
    throw new LimitExceededError(
      `there are 2^${core.n - 1} compositions of ${core.n}; ranks are served up to 2^${MAX_COUNT_BITS} (about ${Math.floor(MAX_COUNT_BITS * Math.log10(2)).toLocaleString('en-US')} decimal digits), so n <= ${(MAX_COUNT_BITS + 1).toLocaleString('en-US')}`,
      `count bits <= ${MAX_COUNT_BITS}`,
    );
  }
  return {
    by: 'gaps',
    n: core.n,
    k: undefined,
    values: null,
    min: 1,
    max: core.n,
    shift: 0,
    scale: core.scale,
    // Every remainder is composed by 1 + ... + 1: the walk needs feasibility only (rank and unrank use the gaps).
    count: (_left, m) => (m === 0 ? 1n : 1n << BigInt(m - 1)),
    feasible: () => true,
  };
}

class CompositionRanker implements Ranker {
  readonly count: bigint;
  private readonly gapBits: boolean;

  constructor(
    private readonly core: CoreCounts,
    private readonly family: CompositionFamily,
  ) {
    this.gapBits = core.by === 'gaps';
    this.count = core.count(core.k ?? 0, core.n);
  }

  rank(member: readonly number[]): bigint {
    const problem = compositionMembershipError(member, this.family);
    if (problem) throw problem;
    const c = this.core;
    const parts = member.map((x) => (x - c.shift) / c.scale);
    if (this.gapBits) return gapBitsRank(parts);
    let rank = 0n;
    let m = c.n;
    let left = c.k ?? 0;
    for (const v of parts) {
      // Every member continuing with an allowed part u < v comes first.
      if (c.values) {
        for (const u of c.values) {
          if (u >= v) break;
          rank += c.count(left - 1, m - u);
        }
      } else {
        for (let u = c.min; u < v; u++) rank += c.count(left - 1, m - u);
      }
      m -= v;
      left--;
    }
    return rank;
  }

  unrank(rank: bigint): number[] {
    checkRank(rank, this.count);
    const c = this.core;
    const parts = this.gapBits ? gapBitsUnrank(rank, c.n) : this.unrankCore(rank);
    return c.shift === 0 && c.scale === 1 ? parts : parts.map((v) => c.shift + c.scale * v);
  }

  list(start: bigint): IterableIterator<number[]> {
    checkStart(start, this.count);
    if (start === this.count) return walkIterator(null);
    const c = this.core;
    const first = this.gapBits ? gapBitsUnrank(start, c.n) : this.unrankCore(start);
    return walkIterator(new CompositionWalk(c, first));
  }

  /** Core parts of the member of rank `rank`: at each position the smallest part whose completions reach past it. */
  private unrankCore(rank: bigint): number[] {
    const c = this.core;
    const parts: number[] = [];
    let m = c.n;
    let left = c.k ?? 0;
    while (c.k === undefined ? m > 0 : left > 0) {
      let chosen = -1;
      if (c.values) {
        for (const u of c.values) {
          if (u > m) break;
          const completions = c.count(left - 1, m - u);
          if (rank < completions) {
            chosen = u;
            break;
          }
          rank -= completions;
        }
      } else {
        for (let u = c.min; u <= Math.min(c.max, m); u++) {
          const completions = c.count(left - 1, m - u);
          if (rank < completions) {
            chosen = u;
            break;
          }
          rank -= completions;
        }
      }
      if (chosen < 0) throw new Error('composition count table inconsistent (bug)');
      parts.push(chosen);
      m -= chosen;
      left--;
    }
    return parts;
  }
}

/**
 * The successor in lexicographic order: the rightmost part that can be raised (to the next
 * allowed part with a completion of the rest) is raised, and the rest is filled with the
 * smallest completion, one smallest feasible part at a time.
 */
class CompositionWalk implements OrderWalk {
  constructor(
    private readonly c: CoreCounts,
    /** The current member's core parts. */
    private readonly parts: number[],
  ) {}

  current(): number[] {
    const { shift, scale } = this.c;
    return shift === 0 && scale === 1 ? this.parts.slice() : this.parts.map((v) => shift + scale * v);
  }

  advance(): boolean {
    const { c, parts } = this;
    const k = c.k ?? 0;
    let suffix = 0;
    for (let i = parts.length - 1; i >= 0; i--) {
      suffix += parts[i];
      const left = k - i;
      const raised = this.smallestPart(parts[i] + 1, left, suffix);
      if (raised >= 0) {
        parts.length = i;
        parts.push(raised);
        this.fill(left - 1, suffix - raised);
        return true;
      }
    }
    return false;
  }

  /** Appends the smallest completion of m with `left` parts to go. */
  private fill(left: number, m: number): void {
    const c = this.c;
    while (c.k === undefined ? m > 0 : left > 0) {
      const u = this.smallestPart(c.min, left, m);
      if (u < 0) throw new Error('composition count table inconsistent (bug)');
      this.parts.push(u);
      m -= u;
      left--;
    }
  }

  /** The smallest allowed part u >= from (u <= m) after which the remainder m - u can be completed, or -1. */
  private smallestPart(from: number, left: number, m: number): number {
    const c = this.c;
    if (c.values) {
      for (const u of c.values) {
        if (u > m) return -1;
        if (u >= from && c.feasible(left - 1, m - u)) return u;
      }
      return -1;
    }
    for (let u = Math.max(from, c.min); u <= Math.min(c.max, m); u++) if (c.feasible(left - 1, m - u)) return u;
    return -1;
  }
}
