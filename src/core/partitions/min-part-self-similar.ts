import { LogBoundedPartCounts, boundedPartSaddle, mainArcStart } from '../counting/log-bounded-part-count.js';
import { LogMinPartCounts, defaultExactUpTo, minPartSaddle } from '../counting/log-min-part-count.js';
import { LogPartitionNumbers } from '../counting/log-partition-number.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import { BoltzmannProposal } from './boltzmann-proposal.js';
import { concaveMaximiser, type LogConcaveCounts } from './concave-maximiser.js';
import { ConcaveSqueeze } from './concave-squeeze.js';
import { FallingDifferences, bracketedLastRise } from './falling-differences.js';
import { MinPartTable } from './min-part-table.js';
import { SelfSimilarEngine } from './self-similar.js';
import { RestrictedPartitionTable } from './table-recursive.js';

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
export interface MinPartSelfSimilarOptions {
  /** Sub-problems of size <= this use the table (<= table.maxN). */
  readonly baseThreshold: number;
  readonly tables: MinPartSelfSimilarTables;
}

export interface MinPartSelfSimilarStats {
  topProposals: number;
  proposals: number;
  visited: number;
}

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

/** Sub-problems up to this size use the min-part table (201 × 202 cells). */
export const MIN_PART_BASE_THRESHOLD = 200;
/** The unrestricted engine's own table threshold (as unrestricted.ts). */
const UNRESTRICTED_BASE = 1000;

interface Level {
  proposal: BoltzmannProposal;
  /** Smallest odd size and its multiplicity in the accepted proposal. */
  s: number;
  xs: number;
}

export class MinPartSelfSimilarEngine {
  private readonly levels: Level[] = [];

  constructor(private readonly options: MinPartSelfSimilarOptions) {
    if (!Number.isInteger(options.baseThreshold) || options.baseThreshold < 0 || options.baseThreshold > options.tables.table.maxN) {
      throw new RangeError(`base threshold must be an integer in [0, ${options.tables.table.maxN}], got ${options.baseThreshold}`);
    }
  }

  /**
   * A uniform partition of n into parts in [a, maxPart] (multiplicity form, sizes descending).
   * maxPart = Infinity is the parts >= a family, drawn exactly as before the bound existed; a
   * finite maxPart runs every level through reduceBounded (see there).
   */
  sample(source: RandomSource, n: number, a: number, stats?: MinPartSelfSimilarStats, maxPart = Infinity): Partition {
    let level = 0;
    let current = n;
    let b = a;
    let top = maxPart;
    const tables = this.options.tables;
    // Deepest part first collected ascending, then merged level by level.
    let sizes: number[] = [];
    let mults: number[] = [];
    for (;;) {
      if (top !== Infinity) {
        if (current <= this.options.baseThreshold) {
          const steps = tables.boundedTable(top).sample(source, current, b, 2 ** level, sizes, mults);
          if (stats) stats.visited += steps;
          break;
        }
        if (level === this.levels.length) this.levels.push({ proposal: new BoltzmannProposal(), s: 0, xs: 0 });
        // Sizes at the next level are at most n/2^{level+1}: one table length per level and n.
        const reach = Math.floor(n / 2 ** (level + 1));
        current = this.reduceBounded(source, current, b, top, reach, this.levels[level], level === 0 ? stats : undefined, stats);
        b = Math.ceil(b / 2);
        top = Math.floor(top / 2);
        level++;
        continue;
      }
      if (b === 1) {
        const mu = tables.unrestricted.sample(source, current);
        const scale = 2 ** level;
        for (let i = mu.sizes.length - 1; i >= 0; i--) {
          sizes.push(mu.sizes[i] * scale);
          mults.push(mu.multiplicities[i]);
        }
        break;
      }
      if (current <= this.options.baseThreshold) {
        const steps = tables.table.sample(source, current, b, 2 ** level, sizes, mults);
        if (stats) stats.visited += steps;
        break;
      }
      if (level === this.levels.length) this.levels.push({ proposal: new BoltzmannProposal(), s: 0, xs: 0 });
      current = this.reduce(source, current, b, this.levels[level], level === 0 ? stats : undefined, stats);
      b = Math.ceil(b / 2);
      level++;
    }
    // Merge shallower levels (odd multiples of 2^l, so no size repeats) into the ascending list.
    for (let l = level - 1; l >= 0; l--) [sizes, mults] = this.mergeLevel(l, sizes, mults);
    sizes.reverse();
    mults.reverse();
    return { sizes, multiplicities: mults };
  }

  /** Merges level l's parts (times 2^l) into the ascending lists. */
  private mergeLevel(l: number, sizes: number[], mults: number[]): [number[], number[]] {
    const { proposal: p, s, xs } = this.levels[l];
    const scale = 2 ** l;
    const outSizes: number[] = [];
    const outMults: number[] = [];
    let read = 0;
    const push = (size: number, mult: number) => {
      while (read < sizes.length && sizes[read] < size) {
        outSizes.push(sizes[read]);
        outMults.push(mults[read]);
        read++;
      }
      outSizes.push(size);
      outMults.push(mult);
    };
    if (xs > 0) push(s * scale, xs);
    for (let i = 0; i < p.count; i++) push(p.sizes[i] * scale, p.multiplicities[i]);
    while (read < sizes.length) {
      outSizes.push(sizes[read]);
      outMults.push(mults[read]);
      read++;
    }
    return [outSizes, outMults];
  }

  /** Steps 1–3 at (n, b) until acceptance; leaves A in `level`, returns m. */
  private reduce(
    source: RandomSource,
    n: number,
    b: number,
    level: Level,
    top?: MinPartSelfSimilarStats,
    all?: MinPartSelfSimilarStats,
  ): number {
    const counts = this.options.tables.countsFor(Math.ceil(b / 2));
    const logX = -minPartSaddle(b, n);
    const best = this.maximiser(counts, n, logX);
    const s = b % 2 === 1 ? b : b + 1;
    const squeeze = this.squeeze(counts, best);
    for (;;) {
      const t = this.propose(source, n, s, Infinity, logX, level, top, all);
      if (t < 0) continue;
      const j0 = level.xs % 2;
      const m = (n - t) / 2;
      const base = 2 * (m - best) * logX + s * j0 * logX;
      // Accept iff logAccept >= 0 or u < e^{logAccept}, u drawn only in the second case; the
      // squeeze decides most proposals above the table without the count at m (same decision).
      const [lower, upper] = squeeze === null || m <= squeeze.from ? [NaN, NaN] : squeeze.bounds(m, base);
      let accept: boolean;
      if (lower >= 0) accept = true;
      else if (upper < 0) {
        const u = source.nextDouble();
        accept = u < Math.exp(lower) ? true : u >= Math.exp(upper) ? false : u < Math.exp(this.exactLogAccept(counts, squeeze, m, best, base));
      } else {
        const logAccept = this.exactLogAccept(counts, squeeze, m, best, base);
        accept = logAccept >= 0 || source.nextDouble() < Math.exp(logAccept);
      }
      if (accept) {
        level.s = s;
        return m;
      }
    }
  }

  /**
   * The squeeze of a level's counts with the peak `best` remembered, and the size from which it
   * serves (above the table's end); null where counts are cheap.
   */
  private squeeze(counts: LogConcaveCounts | LogBoundedPartCounts, best: number): LevelSqueeze | null {
    const q = this.options.tables.squeezeFor(counts);
    if (q === null) return null;
    const from = (counts as { exactUpTo: number }).exactUpTo;
    const logBest = counts.log(best);
    if (best > from) q.add(best, logBest);
    return {
      from,
      bounds: (m, base) => {
        const [lo, hi] = q.bounds(m);
        return [lo - logBest + base - SQUEEZE_MARGIN, hi - logBest + base + SQUEEZE_MARGIN];
      },
      add: (m) => q.add(m, counts.log(m)),
    };
  }

  /** log of the acceptance from the counts (stable log-ratio); remembers the count at m. */
  private exactLogAccept(counts: LogConcaveCounts | LogBoundedPartCounts, squeeze: LevelSqueeze | null, m: number, best: number, base: number): number {
    const logAccept = counts.logRatio(m, best) + base;
    if (squeeze !== null && m > squeeze.from) squeeze.add(m);
    return logAccept;
  }

  /**
   * Steps 1–2 of one proposal at size n: the odd sizes s + 2, s + 4, ... up to maxPart at x, then
   * X_s = j0 + 2G, the parity j0 that can complete the size. Leaves X_s in level.xs (A' in
   * level.proposal) and returns |A|, or −1 when the proposal is over n (rejected).
   */
  private propose(
    source: RandomSource,
    n: number,
    s: number,
    maxPart: number,
    logX: number,
    level: Level,
    top?: MinPartSelfSimilarStats,
    all?: MinPartSelfSimilarStats,
  ): number {
    const rest = level.proposal.draw(source, logX, s + 2, 2, n, maxPart);
    if (top) top.topProposals++;
    if (all) {
      all.proposals++;
      all.visited += level.proposal.visited;
    }
    if (rest === BoltzmannProposal.OVER) return -1;
    const j0 = (n - rest) % 2;
    // G ~ Geometric(x^{2s}): P(G >= g) = x^{2sg}.
    const logXs2 = 2 * s * logX;
    const u = 1 - source.nextDouble();
    let g = 0;
    if (u < Math.exp(logXs2)) g = Math.max(1, Math.floor(Math.log(u) / logXs2));
    level.xs = j0 + 2 * g;
    const t = rest + s * level.xs;
    return t > n ? -1 : t;
  }

  /**
   * One level of parts in [a, b], b finite: as reduce, with the odd sizes stopping at b and the
   * even half-sizes in [⌈a/2⌉, ⌊b/2⌋] counted by LogBoundedPartCounts (table, or the main arc where
   * it is accurate). x is the saddle point of [a, b] at size n. With no odd size in [a, b] the level
   * has no choice: m = n/2 (n is even, the family being non-empty).
   */
  private reduceBounded(
    source: RandomSource,
    n: number,
    a: number,
    b: number,
    reach: number,
    level: Level,
    top?: MinPartSelfSimilarStats,
    all?: MinPartSelfSimilarStats,
  ): number {
    const s = a % 2 === 1 ? a : a + 1;
    if (s > b) {
      level.s = s;
      level.xs = 0;
      level.proposal.count = 0;
      return n / 2;
    }
    const counts = this.options.tables.boundedCountsFor(Math.ceil(a / 2), Math.floor(b / 2), reach);
    const logX = -boundedPartSaddle(a, b, n);
    const best = this.options.tables.boundedBest(counts, n, logX);
    const squeeze = this.squeeze(counts, best);
    // M is taken MAX_MARGIN above the maximum found: a margin for the rounding of the log-counts.
    for (;;) {
      const t = this.propose(source, n, s, b, logX, level, top, all);
      if (t < 0) continue;
      const j0 = level.xs % 2;
      const m = (n - t) / 2;
      const base = 2 * (m - best) * logX + s * j0 * logX - MAX_MARGIN;
      const u = source.nextDouble();
      // The squeeze decides most proposals above the table without the count at m (same decision).
      const [lower, upper] = squeeze === null || m <= squeeze.from ? [-Infinity, Infinity] : squeeze.bounds(m, base);
      const accept = u < Math.exp(lower) ? true : u >= Math.exp(upper) ? false : u < Math.exp(this.exactLogAccept(counts, squeeze, m, best, base));
      if (accept) {
        level.s = s;
        return m;
      }
    }
  }

  /**
   * argmax over integers 0 <= m <= n/2 of log c(m) + 2m·logX (see the class comment;
   * concave-maximiser.ts). For the tabled-and-saddle counts (b' >= 2) the differences on the
   * concave range are remembered across sizes (falling-differences.ts): a bracket from earlier
   * sizes is bisected directly; otherwise concaveMaximiser runs on counts whose neighbour
   * ratios are remembered. The same maximiser either way.
   */
  maximiser(counts: LogConcaveCounts, n: number, logX: number): number {
    if (!('exactUpTo' in counts)) return concaveMaximiser(counts, n, logX);
    const differences = this.options.tables.differencesFor(counts);
    const half = Math.floor(n / 2);
    const from = counts.logConcaveFrom();
    if (half > from) {
      let m = bracketedLastRise(differences, (d) => d + 2 * logX > 0, from, half);
      if (m !== null) {
        // concaveMaximiser's end: the sizes below from.
        if (counts.log(m) + 2 * m * logX < counts.log(from)) {
          for (let k = 0; k < from; k++) if (counts.logRatio(k, m) + 2 * (k - m) * logX > 0) m = k;
        }
        return m;
      }
    }
    const remembered: LogConcaveCounts = {
      logRatio: (a, b) => (a === b + 1 && b >= from ? differences.at(a) : counts.logRatio(a, b)),
      log: (m) => counts.log(m),
      logConcaveFrom: () => from,
    };
    return concaveMaximiser(remembered, n, logX);
  }
}

/** What a level's acceptance test asks of the squeeze: bounds on logAccept at m given its other terms. */
interface LevelSqueeze {
  readonly from: number;
  bounds(m: number, base: number): [number, number];
  add(m: number): void;
}

/**
 * Margin on the squeeze's bounds (in log): the remembered log-counts and the stable log-ratio
 * the exact test uses agree within ~1e-11 (doubles of size <= ~3e4), so a decision outside the
 * widened bounds is the exact test's decision.
 */
const SQUEEZE_MARGIN = 1e-8;

/**
 * Margin on log M for the bounded levels: the acceptance is at most e^{−1e-9} < 1 wherever the
 * log-counts are within 1e-9 of the truth (measured within ~1e-13), so no weight is clipped.
 */
const MAX_MARGIN = 1e-9;

/**
 * argmax over integers 0 <= m <= n/2 of log c(m) + 2m·logX for parts in [a, b]. Above from (the
 * last log-concavity failure of the table; above the table the main-arc values, concave: checked
 * on a grid in the tests) the forward difference D(m) = w(m) − w(m − 1) falls, so the maximiser
 * is the last m with D(m) > 0. A guess comes from bisection on a cheap proxy of D above the table
 * (LogBoundedPartCounts.slopeProxy: the saddle-point approximation's slope, no integrals); from
 * it a galloping search with exact differences finds the last m with D(m) > 0 (exact whatever
 * the proxy's error; it only sets the number of exact steps, ~2·log₂ of the guess's distance).
 * Below from, the sizes m' < from are scanned unless the peak's weight is at least
 * max_{m' <= from} log c(m'), which bounds every weight there (x < 1). c may vanish (parts in
 * [a, b] miss some sizes); such m lie below from and are never the maximiser. While the table is
 * not filled (large smallest parts: the sizes a level reaches lie far above it), the search runs
 * above the table only and the weights below are bounded in closed form (logWeightBound), so the
 * table is filled only if a proposal lands there.
 */
export function boundedMaximiser(counts: LogBoundedPartCounts, n: number, logX: number, differences?: FallingDifferences): number {
  const half = Math.floor(n / 2);
  const weight = (k: number) => counts.log(k) + 2 * k * logX;
  // D(m) > 0, exactly (remembered in `differences` when given).
  const rises = differences === undefined ? (m: number) => counts.logRatio(m, m - 1) + 2 * logX > 0 : (m: number) => differences.at(m) + 2 * logX > 0;
  // Table not filled yet: search the main-arc sizes above it, and keep the result when the
  // bound on every weight below it (logWeightBound) is under it. Where the weight is unimodal
  // this is the maximiser the search with the table finds (the same values), so the choice
  // does not depend on whether an earlier sample filled the table.
  // When the bound does not decide, a maximiser found strictly above `above` (D(m) > 0 there) is
  // also the last rise on the table's concave range, so only the scan below it remains.
  const above = counts.exactUpTo + 1;
  let interior: number | null = null;
  if (!counts.tableFilled && above < half) {
    const m = concaveArgmax(counts, above, half, logX, rises, differences);
    if (weight(m) > counts.logWeightBound(counts.exactUpTo, 2 * logX)) return m;
    if (m > above) interior = m;
  }
  const from = Math.min(counts.logConcaveFrom(), half);
  let m = interior ?? concaveArgmax(counts, from, half, logX, rises, differences);
  if (from > 0 && weight(m) < counts.logMaxUpTo(Math.min(from, counts.exactUpTo))) {
    let best = weight(m);
    for (let k = 0; k < from; k++) {
      const w = weight(k);
      if (w > best) {
        best = w;
        m = k;
      }
    }
  }
  return m;
}

/**
 * The last m in [from, half] whose forward difference D(m) = w(m) − w(m − 1) is positive (from
 * when none), w(m) = log c(m) + 2m·logX concave on [from, half]: bracketed by the remembered
 * differences when they are narrow (falling-differences.ts), else a guess by bisection on the
 * slope proxy, then galloping and bisection on exact differences. Counts below `from` are not read.
 */
function concaveArgmax(
  counts: LogBoundedPartCounts,
  from: number,
  half: number,
  logX: number,
  rises: (m: number) => boolean,
  differences?: FallingDifferences,
): number {
  if (differences !== undefined) {
    const m = bracketedLastRise(differences, (d) => d + 2 * logX > 0, from, half);
    if (m !== null) return m;
  }
  let guessT: number | undefined;
  const proxyRises = (m: number) => {
    if (m - 1 <= counts.exactUpTo) return rises(m);
    const [slope, tm] = counts.slopeProxy(m, guessT);
    guessT = tm;
    return slope + 2 * logX > 0;
  };
  // Guess: the last m in [from, half] whose proxy rises.
  let good = from;
  let bad = half + 1;
  while (bad - good > 1) {
    const mid = Math.floor((good + bad) / 2);
    if (proxyRises(mid)) good = mid;
    else bad = mid;
  }
  // Exact: the last m in [from, half] with D(m) > 0 (from itself when none), by galloping from the guess.
  const g = good;
  if (g > from && !rises(g)) {
    bad = g;
    let step = 1;
    while (bad - step > from && !rises(bad - step)) {
      bad -= step;
      step *= 2;
    }
    good = Math.max(from, bad - step);
  } else {
    good = g;
    let step = 1;
    while (good + step <= half && rises(good + step)) {
      good += step;
      step *= 2;
    }
    bad = Math.min(half + 1, good + step);
  }
  while (bad - good > 1) {
    const mid = Math.floor((good + bad) / 2);
    if (rises(mid)) good = mid;
    else bad = mid;
  }
  return good;
}

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

let shared: MinPartSelfSimilarTables | null = null;
/** The process-wide tables (shared by the minPart and bounded samplers). */
export function defaultTables(): MinPartSelfSimilarTables {
  shared ??= new MinPartSelfSimilarTables();
  return shared;
}
