import { NotAMemberError } from '../errors.js';

/**
 * Ranks: every member of a family at a fixed position of a documented total order, so that a
 * member has an address (its rank, 0 ... count - 1) that does not depend on a seed, and any slice
 * of the family can be listed.
 *
 * Orders (the usual orders of the trade):
 * - partitions: parts listed largest first, members in reverse lexicographic order of that list
 *   — n, (n-1)+1, (n-2)+2, (n-2)+1+1, ..., 1+...+1 (OEIS A080577 for unrestricted partitions);
 * - compositions: lexicographic order of the part sequence — 1+...+1 first, n last.
 *
 * Ranks are BigInts (families outgrow 2^53 quickly). `partitionRanker` and `compositionRanker`
 * build the family's exact counting table once, when the ranker is made; keep the ranker to
 * reuse it.
 */
export interface Ranker {
  /** Members of the family. */
  readonly count: bigint;
  /** The member's position in the order; throws NotAMemberError (a RangeError saying why) for anything else. */
  rank(member: readonly number[]): bigint;
  /** The member at `rank`; throws RangeError when rank >= count or rank < 0. */
  unrank(rank: bigint): number[];
  /** Members from rank `start` on, in the order (a fresh array each); RangeError when start > count. */
  list(start: bigint): Iterator<number[]>;
}

/** Throws the RangeError `unrank` promises for a rank outside 0 ... count - 1. */
export function checkRank(rank: bigint, count: bigint): void {
  if (typeof rank !== 'bigint') throw new RangeError(`a rank must be a BigInt, got ${typeof rank}`);
  if (rank < 0n || rank >= count) {
    throw new RangeError(
      count === 0n ? 'the family has no member, so no rank is valid' : `rank must be from 0 to ${count - 1n} (the family has ${count} members), got ${rank}`,
    );
  }
}

/** Throws the RangeError `list` promises for a start past the end (start = count lists nothing). */
export function checkStart(start: bigint, count: bigint): void {
  if (typeof start !== 'bigint') throw new RangeError(`start must be a BigInt, got ${typeof start}`);
  if (start < 0n || start > count) throw new RangeError(`start must be from 0 to ${count} (the number of members), got ${start}`);
}

/**
 * A walk through a family in its order: the current member and a step to the next one (the
 * successor function of the order, cheaper than unranking every member).
 */
export interface OrderWalk {
  /** The current member, as a fresh array. */
  current(): number[];
  /** Moves to the next member; false when the current one was the last. */
  advance(): boolean;
}

/** The members of a walk, from its current member on, as an iterator (also iterable). */
export function walkIterator(walk: OrderWalk | null): IterableIterator<number[]> {
  let pending = walk !== null;
  return {
    next(): IteratorResult<number[]> {
      if (!pending) return { done: true, value: undefined };
      const value = walk!.current();
      pending = walk!.advance();
      return { done: false, value };
    },
    [Symbol.iterator]() {
      return this;
    },
  };
}

/** The ranker of a family without members (count 0). */
export function emptyRanker(reason: string): Ranker {
  return {
    count: 0n,
    rank: () => {
      throw new NotAMemberError(`${reason}, so nothing is a member`, 'not-in-family');
    },
    unrank: (rank) => {
      checkRank(rank, 0n);
      return [];
    },
    list: (start) => {
      checkStart(start, 0n);
      return walkIterator(null);
    },
  };
}
