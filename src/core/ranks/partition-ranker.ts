import type { PartitionFamily } from '../family.js';
import { largestFittingN, rankLimitError, fitsRankLimit, type TableSize } from './limits.js';
import { partitionMembershipError } from './membership.js';
import { partitionShape, partitionTableSize } from './partition-shape.js';
import { PartitionRankTable } from './partition-table.js';
import { checkRank, checkStart, emptyRanker, walkIterator, type OrderWalk, type Ranker } from './ranker.js';

/**
 * The ranker of a partition family: members as their parts, largest first, in reverse
 * lexicographic order (n first, 1 + ... + 1 last; OEIS A080577 for unrestricted partitions).
 * Builds the family's counting table (PartitionRankTable) at once; throws RangeError for a
 * malformed family and LimitExceededError when the table would be over RANK_TABLE_BYTES, naming
 * the largest n that fits. An empty family gets a ranker with count 0.
 *
 * Costs, with r allowed sizes and L parts: unrank and rank take O(r + L) table look-ups; `list`
 * unranks its start once, then steps to each next member in O(parts changed) look-ups.
 */
export function partitionRanker(family: PartitionFamily): Ranker {
  const shape = partitionShape(family);
  if ('empty' in shape) return emptyRanker(shape.empty);
  const size = partitionTableSize(shape);
  if (!fitsRankLimit(size)) throw rankLimitError('partitions', family, size, largestRankablePartitionN(family));
  return new PartitionRanker(new PartitionRankTable(shape), family);
}

/** The estimated table of a partition family (0 for an empty family), as the limit sees it. */
export function partitionRankTableSize(family: PartitionFamily): TableSize {
  const shape = partitionShape(family);
  return 'empty' in shape ? { cells: 0, bytes: 0 } : partitionTableSize(shape);
}

/** The largest n whose table fits the limit with the family's other constraints (-1 if none). */
export function largestRankablePartitionN(family: PartitionFamily): number {
  return largestFittingN(family.n, (n) => partitionRankTableSize({ ...family, n }));
}

class PartitionRanker implements Ranker {
  readonly count: bigint;

  constructor(
    private readonly table: PartitionRankTable,
    private readonly family: PartitionFamily,
  ) {
    this.count = table.count;
  }

  rank(member: readonly number[]): bigint {
    const problem = partitionMembershipError(member, this.family);
    if (problem) throw problem;
    const t = this.table;
    let rank = 0n;
    let j = t.r;
    let l = t.firstState;
    let m = t.n;
    for (const part of member) {
      const index = t.below(part); // part is an allowed size: its index
      // Members whose next part is larger than `part` come first (the recurrence telescopes).
      if (j > index) rank += t.at(j, l, m) - t.at(index, l, m);
      m -= part;
      l -= t.step;
      j = t.distinct ? index - 1 : index;
    }
    return rank;
  }

  unrank(rank: bigint): number[] {
    checkRank(rank, this.count);
    const parts: number[] = [];
    descend(this.table, this.table.r, this.table.firstState, this.table.n, rank, parts);
    return parts;
  }

  list(start: bigint): IterableIterator<number[]> {
    checkStart(start, this.count);
    return walkIterator(start === this.count ? null : new PartitionWalk(this.table, this.unrank(start)));
  }
}

/**
 * Appends the member of rank `rank` among the completions of (sizes b_1..b_j, length state l,
 * remainder m): at each size, largest first, the completions taking it come first.
 */
function descend(t: PartitionRankTable, j: number, l: number, m: number, rank: bigint, parts: number[]): void {
  while (m > 0) {
    if (j > 0 && t.size(j) > m) j = t.below(m);
    if (j === 0) throw new Error('rank table inconsistent (bug)');
    if (j === 1 && !t.distinct) {
      // Only the smallest size is left: the one completion is m / b_1 copies of it (no look-ups).
      const b = t.size(1);
      for (let k = m / b; k > 0; k--) parts.push(b);
      return;
    }
    const b = t.size(j);
    const taking = t.at(t.distinct ? j - 1 : j, l - t.step, m - b);
    if (rank < taking) {
      parts.push(b);
      m -= b;
      l -= t.step;
      if (t.distinct) j--;
    } else {
      rank -= taking;
      j--;
    }
  }
}

/**
 * The successor in reverse lexicographic order: the rightmost part that can be made smaller
 * (some completion of what follows exists with a smaller part there) is lowered to the largest
 * such size, and the rest is filled with the largest completion — the member of rank 0 among
 * those completions.
 */
class PartitionWalk implements OrderWalk {
  constructor(
    private readonly t: PartitionRankTable,
    private readonly parts: number[],
  ) {}

  current(): number[] {
    return this.parts.slice();
  }

  advance(): boolean {
    const { t, parts } = this;
    const smallest = t.size(1);
    let suffix = 0;
    for (let i = parts.length - 1; i >= 0; i--) {
      suffix += parts[i];
      if (parts[i] === smallest) continue; // nothing is smaller
      const index = t.below(parts[i]);
      const l = t.firstState - i * t.step;
      if (index > 1 && t.at(index - 1, l, suffix) !== 0n) {
        parts.length = i;
        descend(t, index - 1, l, suffix, 0n, parts);
        return true;
      }
    }
    return false;
  }
}
