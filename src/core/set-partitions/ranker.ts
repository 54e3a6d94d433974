import { LimitExceededError } from '../errors.js';
import type { SetPartitionFamily } from '../family.js';
import { countBitsBound } from './counts.js';
import { resolveSetPartitions, type ResolvedSetPartitions } from './resolve.js';
import { rgsProblem } from './set-partition.js';

/**
 * The shared ranking interface (src/core/ranks/ranker.ts, being written in parallel; this is a
 * local copy of the agreed type, to be unified when the branches meet).
 */
export interface Ranker {
  readonly count: bigint;
  rank(member: readonly number[]): bigint;
  unrank(rank: bigint): number[];
  list(start: bigint): Iterator<number[]>;
}

/** A member that is not one of the family's (a RangeError; the message says why). */
export class NotAMemberError extends RangeError {
  override readonly name = 'NotAMemberError';
}

/** Counting states one ranker may remember (each a BigInt), and the bits they may hold together. */
export const MAX_RANK_STATES = 2 ** 18;
export const MAX_RANK_BITS = 2 ** 29;
/** Longest restricted growth string ranked (the counting recursion is as deep as n). */
export const MAX_RANK_N = 5000;

/**
 * Ranks of set partitions in the lexicographic order of their restricted growth strings
 * (0-based, rgs[0] = 0; Knuth TAOCP vol. 4A, §7.2.1.5, whose Algorithm H lists them in this
 * order), members given as restricted growth strings.
 *
 * Rank and unrank walk the string left to right, counting the completions of each smaller
 * prefix (the recursive method of Nijenhuis & Wilf, Combinatorial Algorithms 1978, ch. 13, on
 * this order). The completions of a prefix depend only on the items left and on how full its
 * blocks are — for a bound minBlockSize = a, a block's size up to a; for maxBlockSize = b its
 * exact size — so they are counted by a memoised recursion over (items left, number of blocks
 * of each such type): with no size bounds the classical table of D(r, u) = u·D(r−1, u) +
 * D(r−1, u+1) (blocks used so far u; Williamson, Combinatorics for Computer Science 1985 —
 * reference from memory). Past MAX_RANK_STATES states it throws LimitExceededError.
 */
export function setPartitionRanker(family: SetPartitionFamily): Ranker {
  return new SetPartitionRanker(resolveSetPartitions(family));
}

class SetPartitionRanker implements Ranker {
  readonly count: bigint;
  private readonly n: number;
  private readonly minSize: number;
  private readonly maxSize: number;
  private readonly bounded: boolean;
  /** Block types 1..types: a block's size, capped at minSize when sizes are unbounded. */
  private readonly types: number;
  private readonly kMin: number;
  private readonly kMax: number;
  private readonly memo = new Map<string, bigint>();
  private readonly stateLimit: number;

  constructor(resolved: ResolvedSetPartitions) {
    const { n, minSize, maxSize, kMin, kMax } = resolved;
    if (n > MAX_RANK_N) {
      throw new LimitExceededError(`ranking set partitions of ${n} items is over the limit of n <= ${MAX_RANK_N}`, `n <= ${MAX_RANK_N}`);
    }
    this.n = n;
    this.minSize = minSize;
    this.maxSize = maxSize;
    this.bounded = maxSize < n;
    this.types = this.bounded ? maxSize : minSize;
    this.kMin = kMin;
    this.kMax = kMax;
    this.stateLimit = Math.min(MAX_RANK_STATES, Math.floor(MAX_RANK_BITS / countBitsBound(resolved)));
    this.count = this.completions(n, new Array<number>(this.types + 1).fill(0));
  }

  /** The type a block of type t becomes when an item joins it (0: a new block), or -1 if it is full. */
  private next(t: number): number {
    if (this.bounded) return t < this.maxSize ? t + 1 : -1;
    return Math.min(t + 1, this.minSize);
  }

  /** Ways to place r more items given how many blocks of each type the prefix has (counts[0] unused). */
  private completions(r: number, counts: number[]): bigint {
    let blocks = 0;
    let deficit = 0;
    for (let t = 1; t <= this.types; t++) {
      blocks += counts[t];
      if (t < this.minSize) deficit += counts[t] * (this.minSize - t);
    }
    if (deficit + Math.max(0, this.kMin - blocks) * this.minSize > r || blocks > this.kMax) return 0n;
    if (r === 0) return 1n; // deficit 0 and blocks >= kMin, by the test above
    const key = `${r}|${counts.join(',')}`;
    const known = this.memo.get(key);
    if (known !== undefined) return known;
    let total = 0n;
    for (let t = 1; t <= this.types; t++) {
      const c = counts[t];
      if (c === 0) continue;
      const to = this.next(t);
      if (to < 0) continue;
      counts[t]--;
      counts[to]++;
      const ways = this.completions(r - 1, counts);
      counts[to]--;
      counts[t]++;
      total += BigInt(c) * ways;
    }
    if (blocks < this.kMax) {
      counts[this.next(0)]++;
      total += this.completions(r - 1, counts);
      counts[this.next(0)]--;
    }
    if (this.memo.size >= this.stateLimit) {
      throw new LimitExceededError(
        `ranking this family in restricted-growth-string order needs more than ${this.stateLimit.toLocaleString('en-US')} counting states, over the limit; fewer items, or no bound on block sizes (n·blocks states), fit`,
        `rank states <= ${this.stateLimit}`,
      );
    }
    this.memo.set(key, total);
    return total;
  }

  rank(member: readonly number[]): bigint {
    this.check(member);
    const counts = new Array<number>(this.types + 1).fill(0);
    const blockType: number[] = [];
    let rank = 0n;
    for (let i = 0; i < this.n; i++) {
      const v = member[i];
      const r = this.n - i - 1;
      // Every smaller choice for item i: join one of the blocks 0..v−1 (a new block is always the largest choice).
      const byType = new Array<number>(this.types + 1).fill(0);
      for (let b = 0; b < v; b++) byType[blockType[b]]++;
      for (let t = 1; t <= this.types; t++) {
        if (byType[t] === 0) continue;
        const to = this.next(t);
        if (to < 0) continue;
        counts[t]--;
        counts[to]++;
        rank += BigInt(byType[t]) * this.completions(r, counts);
        counts[to]--;
        counts[t]++;
      }
      this.place(v, counts, blockType);
    }
    return rank;
  }

  unrank(rank: bigint): number[] {
    if (rank < 0n || rank >= this.count) throw new RangeError(`rank must be from 0 to ${this.count - 1n} (the family has ${this.count} members), got ${rank}`);
    const counts = new Array<number>(this.types + 1).fill(0);
    const blockType: number[] = [];
    const out: number[] = [];
    let left = rank;
    for (let i = 0; i < this.n; i++) {
      const r = this.n - i - 1;
      let chosen = -1;
      for (let v = 0; v <= blockType.length && chosen < 0; v++) {
        const t = v < blockType.length ? blockType[v] : 0;
        const to = this.next(t);
        if (to < 0 || (t === 0 && blockType.length >= this.kMax)) continue;
        if (t > 0) counts[t]--;
        counts[to]++;
        const ways = this.completions(r, counts);
        counts[to]--;
        if (t > 0) counts[t]++;
        if (left < ways) chosen = v;
        else left -= ways;
      }
      if (chosen < 0) throw new Error('set-partition ranker counts inconsistent (bug)');
      out.push(chosen);
      this.place(chosen, counts, blockType);
    }
    return out;
  }

  *list(start: bigint): Iterator<number[]> {
    if (start < 0n) throw new RangeError(`start must be >= 0, got ${start}`);
    for (let r = start; r < this.count; r++) yield this.unrank(r);
  }

  /** Puts the next item in block v (v = number of blocks: a new one). */
  private place(v: number, counts: number[], blockType: number[]): void {
    if (v === blockType.length) {
      blockType.push(this.next(0));
      counts[this.next(0)]++;
    } else {
      const t = blockType[v];
      counts[t]--;
      blockType[v] = this.next(t);
      counts[blockType[v]]++;
    }
  }

  private check(member: readonly number[]): void {
    const fail = (why: string) => {
      throw new NotAMemberError(`not a member of this family: ${why}`);
    };
    if (!Array.isArray(member) || member.length !== this.n) fail(`a member is a restricted growth string of ${this.n} entries, got ${Array.isArray(member) ? member.length : typeof member}`);
    const problem = rgsProblem(member);
    if (problem) fail(problem);
    const sizes: number[] = [];
    for (const v of member) sizes[v] = (sizes[v] ?? 0) + 1;
    const k = sizes.length;
    if (k < this.kMin || k > this.kMax) fail(`it has ${k} blocks; the family has ${this.kMin === this.kMax ? `exactly ${this.kMin}` : `${this.kMin} to ${this.kMax}`}`);
    const bad = sizes.findIndex((s) => s < this.minSize || s > this.maxSize);
    if (bad >= 0) fail(`block ${bad} has ${sizes[bad]} items; every block has ${this.minSize} to ${this.maxSize}`);
  }
}
