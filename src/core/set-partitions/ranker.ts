import { LimitExceededError, NotAMemberError } from '../errors.js';
import type { SetPartitionFamily } from '../family.js';
import { bigintCellBytes, constraintsText } from '../ranks/limits.js';
import { checkRank, checkStart, walkIterator, type Ranker } from '../ranks/ranker.js';
import { countBitsBound } from './counts.js';
import { resolveSetPartitions, type ResolvedSetPartitions } from './resolve.js';
import { rgsProblem } from './set-partition.js';
import { Prefix, RgsWalk, type CompletionCounts } from './rgs-walk.js';

/** Counting states one ranker may remember (each a BigInt), and the bits they may hold together. */
export const MAX_RANK_STATES = 2 ** 18;
export const MAX_RANK_BITS = 2 ** 29;
/** Longest restricted growth string ranked (the counting recursion is as deep as n). */
export const MAX_RANK_N = 5000;
/**
 * Steps of building the counting states: each look-up writes a key of (number of block types
 * + 1) numbers, so a family with many block types (maxBlockSize = 50, say) costs far more per
 * state than a free one. Bounded so that a build takes about a second at most, and a refusal
 * about half that (measured on a shared 2-core machine: 1.0-1.3 s for families at the bound,
 * whose forward pass alone, all a refusal runs, takes 0.4-0.55 s).
 */
export const MAX_RANK_WORK = 4e6;

/** A set-partition ranker, with the memory its counting states take (an estimate, for caches). */
export interface SetPartitionRanker extends Ranker {
  readonly tableBytes: number;
}

/**
 * Ranks of set partitions in the lexicographic order of their restricted growth strings
 * (0-based, rgs[0] = 0; Knuth TAOCP vol. 4A, §7.2.1.5, whose Algorithm H lists them in this
 * order), members given as restricted growth strings: 0…0 (one block) first, 0 1 2 … (all
 * singletons) last when the family has both. The shared Ranker of src/core/ranks/ranker.ts.
 *
 * Rank and unrank walk the string left to right, counting the completions of each smaller
 * prefix (the recursive method of Nijenhuis & Wilf, Combinatorial Algorithms 1978, ch. 13, on
 * this order). The completions of a prefix depend only on the items left and on how full its
 * blocks are — for a bound minBlockSize = a, a block's size up to a; for maxBlockSize = b its
 * exact size — so they are counted by a memoised recursion over (items left, number of blocks
 * of each such type): with no size bounds the classical table of D(r, u) = u·D(r−1, u) +
 * D(r−1, u+1) (blocks used so far u; Williamson, Combinatorics for Computer Science 1985 —
 * reference from memory). Every state a member's prefix can reach is counted when the ranker
 * is made (iteratively, level by level: countAll); past MAX_RANK_STATES states (or
 * n > MAX_RANK_N) it throws LimitExceededError.
 * `list` steps with the order's successor (the rightmost entry that can grow, then the
 * smallest completion), reading only whether counts are zero.
 */
export function setPartitionRanker(family: SetPartitionFamily): SetPartitionRanker {
  return new RgsRanker(resolveSetPartitions(family));
}

class RgsRanker implements SetPartitionRanker, CompletionCounts {
  readonly count: bigint;
  readonly tableBytes: number;
  readonly n: number;
  readonly kMax: number;
  /** Block types 1..types: a block's size, capped at minSize when sizes are unbounded. */
  readonly types: number;
  private readonly minSize: number;
  private readonly maxSize: number;
  private readonly bounded: boolean;
  private readonly kMin: number;
  private readonly memo = new Map<string, bigint>();
  private readonly stateLimit: number;
  /** Steps spent counting while the ranker is made (afterwards every state it looks up is known). */
  private work = 0;
  /**
   * Without block-size bounds a state is (items left r, blocks used u), and its completions are
   * read from this dense table D(r, u) at r·(kMax + 1) + u, copied from the counted states once
   * (null when sizes are bounded).
   */
  private readonly byBlocks: bigint[] | null = null;

  constructor(resolved: ResolvedSetPartitions) {
    const { n, minSize, maxSize, kMin, kMax, family } = resolved;
    const constraints = constraintsText(family);
    const what = `set partitions of ${n} items${constraints ? ` with ${constraints}` : ''}`;
    if (n > MAX_RANK_N) throw new LimitExceededError(`ranking ${what} is over the limit of n <= ${MAX_RANK_N} items`, `n <= ${MAX_RANK_N}`);
    this.n = n;
    this.minSize = minSize;
    this.maxSize = maxSize;
    this.bounded = maxSize < n;
    this.types = this.bounded ? maxSize : minSize;
    this.kMin = kMin;
    this.kMax = kMax;
    const bits = countBitsBound(resolved);
    this.stateLimit = Math.min(MAX_RANK_STATES, Math.floor(MAX_RANK_BITS / bits));
    try {
      this.count = this.countAll();
    } catch (error) {
      if (error instanceof LimitExceededError) {
        throw new LimitExceededError(
          `ranking ${what} in restricted-growth-string order needs more counting states than the limit allows (${this.stateLimit.toLocaleString('en-US')} states, ${MAX_RANK_WORK.toExponential(0)} steps); fewer items fit, or fewer block sizes to tell apart (without block-size bounds about n·blocks states)`,
          error.limit,
        );
      }
      throw error;
    }
    // A key of about (types + 1) numbers, its Map entry and its BigInt count (see ranks/limits.ts).
    this.tableBytes = this.memo.size * (bigintCellBytes(bits) + 64 + 4 * (this.types + 2));
    if (!this.bounded && minSize === 1) {
      this.byBlocks = this.blocksTable();
      this.tableBytes += 8 * this.byBlocks.length;
    }
  }

  /** The type of a block of `size` items (sizes past minSize are alike when sizes are unbounded). */
  typeOf(size: number): number {
    return this.bounded ? size : Math.min(size, this.minSize);
  }

  /** The type of a block of `size` items once one more joins it, or -1 if it is full. */
  typeAfter(size: number): number {
    return this.bounded && size >= this.maxSize ? -1 : this.typeOf(size + 1);
  }

  /**
   * Whether a prefix can still be completed in r more items as far as block counts and the
   * blocks' missing items say (a necessary condition; states failing it have no completion and
   * are never stored).
   */
  private viable(r: number, counts: readonly number[]): boolean {
    let blocks = 0;
    let deficit = 0;
    for (let t = 1; t <= this.types; t++) {
      blocks += counts[t];
      if (t < this.minSize) deficit += counts[t] * (this.minSize - t);
    }
    return deficit + Math.max(0, this.kMin - blocks) * this.minSize <= r && blocks <= this.kMax;
  }

  /**
   * The moves from a prefix with these block counts: an item joins a block of type t (each of
   * the counts[t] such blocks, so `times` = counts[t]) or opens a new block (times 1). Calls
   * `visit(times)` with `counts` changed to the state after the move (and restored afterwards).
   */
  private forEachMove(counts: number[], visit: (times: number) => void): void {
    let blocks = 0;
    for (let t = 1; t <= this.types; t++) {
      const c = counts[t];
      blocks += c;
      if (c === 0) continue;
      const to = this.bounded ? (t < this.maxSize ? t + 1 : -1) : Math.min(t + 1, this.minSize);
      if (to < 0) continue;
      counts[t]--;
      counts[to]++;
      visit(c);
      counts[to]--;
      counts[t]++;
    }
    if (blocks < this.kMax) {
      const first = this.typeOf(1);
      counts[first]++;
      visit(1);
      counts[first]--;
    }
  }

  /**
   * Counts the completions of every viable state reachable from the empty prefix, without
   * recursion (n may be 5000, deeper than a worker's stack): a forward pass collects the states
   * level by level (items placed), a backward pass counts each from the level after it.
   * LimitExceededError past the state or step limits.
   */
  private countAll(): bigint {
    const n = this.n;
    const root = new Array<number>(this.types + 1).fill(0);
    if (!this.viable(n, root)) return 0n;
    if (n === 0) return 1n;
    // levels[i]: the keys of the viable states with n - i items left (i = 0 .. n - 1).
    const levels: string[][] = [[stateKey(n, root)]];
    let states = 1;
    for (let r = n; r > 1; r--) {
      const next = new Set<string>();
      for (const key of levels[levels.length - 1]) {
        const counts = countsOf(key);
        this.forEachMove(counts, () => {
          this.work += this.types + 10; // the key (types + 1 numbers) and the step itself (a Set look-up), about as costly as ten numbers of a key
          if (this.viable(r - 1, counts)) next.add(stateKey(r - 1, counts));
        });
        if (states + next.size > this.stateLimit || this.work > MAX_RANK_WORK) throw new LimitExceededError('too many counting states', `rank states <= ${this.stateLimit}`);
      }
      states += next.size;
      levels.push([...next]);
    }
    for (let i = levels.length - 1; i >= 0; i--) {
      const r = n - i;
      for (const key of levels[i]) {
        const counts = countsOf(key);
        let total = 0n;
        this.forEachMove(counts, (times) => {
          const ways = this.completions(r - 1, counts);
          if (ways !== 0n) total += BigInt(times) * ways;
        });
        this.memo.set(key, total);
      }
    }
    return this.memo.get(levels[0][0])!;
  }

  /** D(r, u) for r = 0..n − 1 and the 1 <= u <= min(kMax, n − r) blocks a prefix of n − r items can have. */
  private blocksTable(): bigint[] {
    const width = this.kMax + 1;
    const table = new Array<bigint>(this.n * width).fill(0n);
    const counts = [0, 0];
    for (let r = 0; r < this.n; r++) {
      for (let u = 1; u <= Math.min(this.kMax, this.n - r); u++) {
        counts[1] = u;
        table[r * width + u] = this.completions(r, counts);
      }
    }
    return table;
  }

  /** Ways to place r more items given how many blocks of each type the prefix has (counts[0] unused): a look-up once the ranker is made. */
  completions(r: number, counts: number[]): bigint {
    if (!this.viable(r, counts)) return 0n;
    if (r === 0) return 1n; // deficit 0 and blocks >= kMin, by viable
    const known = this.memo.get(stateKey(r, counts));
    if (known === undefined) throw new Error('set-partition ranker: a state was not counted (bug)');
    return known;
  }

  /*
   * Rank and unrank: the completions after joining block v depend only on v's type, so they are
   * looked up once per type and item (Prefix.waysByType), and runs of neighbouring blocks of one
   * type are skipped or entered with one BigInt product or division (a free family's blocks
   * all have one type: two look-ups and one division per item).
   */

  rank(member: readonly number[]): bigint {
    this.check(member);
    if (this.byBlocks !== null) return this.rankByBlocks(member, this.byBlocks);
    const prefix = new Prefix(this);
    let rank = 0n;
    for (let i = 0; i < this.n; i++) {
      // Every smaller choice for item i comes first: joining one of the blocks 0..v−1.
      const ways = prefix.waysByType(this.n - i - 1);
      const below = new Array<number>(this.types + 1).fill(0);
      for (let b = 0; b < member[i]; b++) if (prefix.canJoin(b)) below[this.typeOf(prefix.sizes[b])]++;
      for (let t = 1; t <= this.types; t++) if (below[t] > 0) rank += BigInt(below[t]) * ways(t);
      prefix.join(member[i]);
    }
    return rank;
  }

  unrank(rank: bigint): number[] {
    checkRank(rank, this.count);
    if (this.byBlocks !== null) return this.unrankByBlocks(rank, this.byBlocks);
    const prefix = new Prefix(this);
    const out: number[] = [];
    let left = rank;
    for (let i = 0; i < this.n; i++) {
      const r = this.n - i - 1;
      const ways = prefix.waysByType(r);
      const k = prefix.sizes.length;
      let chosen = -1;
      for (let v = 0; v < k && chosen < 0; ) {
        // The run of blocks v..end−1 of one type (full blocks form runs too, with no way in).
        const type = prefix.canJoin(v) ? this.typeOf(prefix.sizes[v]) : 0;
        let end = v + 1;
        while (end < k && (prefix.canJoin(end) ? this.typeOf(prefix.sizes[end]) : 0) === type) end++;
        const each = type === 0 ? 0n : ways(type);
        const run = BigInt(end - v) * each;
        if (left < run) {
          chosen = v + Number(left / each);
          left %= each;
        } else {
          left -= run;
          v = end;
        }
      }
      if (chosen < 0 && prefix.canJoin(k)) {
        const fresh = prefix.waysWith(k, r);
        if (left < fresh) chosen = k;
        else left -= fresh;
      }
      if (chosen < 0) throw new Error('set-partition ranker counts inconsistent (bug)');
      out.push(chosen);
      prefix.join(chosen);
    }
    return out;
  }

  /*
   * Without size bounds every block has one type: with u blocks used and r items after item i,
   * joining any of the u blocks leaves D(r, u) completions and a new block D(r, u + 1). The
   * members before a choice v <= u are v·D(r, u): one table read and one BigInt product per item
   * (and a division to unrank).
   */

  private rankByBlocks(member: readonly number[], table: readonly bigint[]): bigint {
    const width = this.kMax + 1;
    let rank = 0n;
    let u = 0;
    for (let i = 0; i < this.n; i++) {
      const v = member[i];
      if (v > 0) rank += BigInt(v) * table[(this.n - i - 1) * width + u];
      if (v === u) u++;
    }
    return rank;
  }

  private unrankByBlocks(rank: bigint, table: readonly bigint[]): number[] {
    const width = this.kMax + 1;
    const out = new Array<number>(this.n);
    let left = rank;
    let u = 0;
    for (let i = 0; i < this.n; i++) {
      const each = u > 0 ? table[(this.n - i - 1) * width + u] : 0n;
      if (each > 0n) {
        if (left < each) {
          out[i] = 0; // the first block: no division
          continue;
        }
        const v = left / each;
        if (v < BigInt(u)) {
          out[i] = Number(v);
          left -= v * each;
          continue;
        }
        left -= BigInt(u) * each;
      }
      if (u >= this.kMax) throw new Error('set-partition ranker counts inconsistent (bug)');
      out[i] = u++;
    }
    return out;
  }

  list(start: bigint): IterableIterator<number[]> {
    checkStart(start, this.count);
    return walkIterator(start === this.count ? null : new RgsWalk(this, this.unrank(start)));
  }

  private check(member: readonly number[]): void {
    const fail = (why: string, reason: 'malformed' | 'out-of-order' | 'wrong-sum' | 'not-in-family'): never => {
      throw new NotAMemberError(`not a member of the family: ${why}`, reason);
    };
    if (!Array.isArray(member)) fail('a member is a restricted growth string (a list of block numbers)', 'malformed');
    const bad = member.findIndex((v) => typeof v !== 'number' || !Number.isSafeInteger(v) || v < 0);
    if (bad >= 0) fail(`entry ${bad} (${String(member[bad])}) is not a whole number >= 0`, 'malformed');
    const problem = rgsProblem(member);
    if (problem) fail(problem, 'out-of-order');
    if (member.length !== this.n) fail(`it places ${member.length} items, not n = ${this.n}`, 'wrong-sum');
    const sizes: number[] = [];
    for (const v of member) sizes[v] = (sizes[v] ?? 0) + 1;
    const k = sizes.length;
    const problems: string[] = [];
    if (k < this.kMin || k > this.kMax) problems.push(`it has ${k} blocks, but the family has ${this.kMin === this.kMax ? `exactly ${this.kMin}` : `at most ${this.kMax}`}`);
    const small = sizes.findIndex((s) => s < this.minSize);
    const items = (s: number) => `${s} item${s === 1 ? '' : 's'}`;
    if (small >= 0) problems.push(`block ${small} has ${items(sizes[small])}, below minBlockSize = ${this.minSize}`);
    const large = sizes.findIndex((s) => s > this.maxSize);
    if (large >= 0) problems.push(`block ${large} has ${items(sizes[large])}, above maxBlockSize = ${this.maxSize}`);
    if (problems.length > 0) fail(problems.join('; '), 'not-in-family');
  }
}

/** The key of a counting state: items left, then the number of blocks of each type. */
function stateKey(r: number, counts: readonly number[]): string {
  return `${r}|${counts.join(',')}`;
}

/** The block counts of a state's key. */
function countsOf(key: string): number[] {
  return key.slice(key.indexOf('|') + 1).split(',').map(Number);
}
