import { LogBoundedPartCounts, boundedPartSaddle } from '../counting/log-bounded-part-count.js';
import { minPartSaddle } from '../counting/log-min-part-count.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import { BoltzmannProposal } from './boltzmann-proposal.js';
import { concaveMaximiser, type LogConcaveCounts } from './concave-maximiser.js';
import { bracketedLastRise } from './falling-differences.js';
import { type MinPartSelfSimilarTables } from './min-part-self-similar-tables.js';

/**
 * The level-by-level engine of min-part-self-similar.ts (and bounded-self-similar.ts, with an upper
 * bound): proposals per level, their exact acceptance, the squeeze, and the recursion to the table.
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
