import { canonicalFamily, type SetPartitionFamily } from '../core/family.js';
import { countSetPartitions } from '../core/set-partitions/counts.js';
import { planSetPartitionSampler } from '../core/set-partitions/plan.js';
import { setPartitionRanker } from '../core/set-partitions/ranker.js';
import { contradiction } from '../core/set-partitions/resolve.js';
import type { SetPartitionSampler } from '../core/set-partitions/sampler.js';
import { blocksOf, type SetPartition } from '../core/set-partitions/set-partition.js';
import type { SetPartitionsCountParams } from '../client/params.js';
import { setPartitionsCountQuery, type SetPartitionsCountQuery } from '../schemas/set-partitions.js';
import { isSetPartitionMember } from './membership.js';
import { LibraryFamily, type FamilyKind } from './sampled-family.js';
import { blocksOfValidRgs, rgsOfMember } from './set-partition-forms.js';
import { parseParams } from './validate.js';

/** The constraints of a set-partition family: n (items) and the parameters of GET /v1/set-partitions/count, typed from its schema. */
export type SetPartitionConstraints = SetPartitionsCountParams;

/**
 * The family a query describes, normalised (the default minBlockSize = 1 dropped). A
 * contradiction (blocks > n, minBlockSize > maxBlockSize) is thrown as the core's
 * ContradictoryConstraintError, a RangeError naming its parameter (a 422 naming it, in the API
 * and the library alike).
 */
export function setPartitionFamilyOf(query: SetPartitionsCountQuery): SetPartitionFamily {
  const family = canonicalFamily<SetPartitionFamily>({
    kind: 'set-partition',
    n: query.n,
    blocks: query.blocks,
    maxBlocks: query.maxBlocks,
    minBlockSize: query.minBlockSize === 1 ? undefined : query.minBlockSize,
    maxBlockSize: query.maxBlockSize,
  });
  const problem = contradiction(family);
  if (problem) throw problem;
  return family;
}

/**
 * The set partitions of the items 1..n with given constraints; members are their blocks (each
 * a list of items in increasing order, blocks ordered by their smallest item: the API's
 * as=blocks). Ranks are in the order of the restricted growth strings (the API's as=rgs), and
 * `rank` takes a member in either form.
 */
export type SetPartitions = LibraryFamily<SetPartitionFamily, SetPartition, SetPartitionSampler, number[][]>;

const SET_PARTITIONS: FamilyKind<SetPartitionFamily, SetPartition, SetPartitionSampler, number[][]> = {
  kind: 'set-partition',
  samplesPath: '/v1/set-partitions',
  countPath: '/v1/set-partitions/count',
  params: ['n', 'blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize'],
  nField: setPartitionsCountQuery.shape.n,
  describe: (query) => setPartitionFamilyOf(query as SetPartitionsCountQuery),
  plan: planSetPartitionSampler,
  count: countSetPartitions,
  member: blocksOf,
  contains: isSetPartitionMember,
  memberParam: 'rgs',
  rankTable: (family) => {
    const ranker = setPartitionRanker(family);
    return { ranker, bytes: ranker.tableBytes };
  },
  // A restricted growth string is ranked as it is (the ranker says what is wrong with it); blocks are turned into one.
  toRanked: (value) => (Array.isArray(value) && value.every((v) => typeof v === 'number') ? (value as number[]) : rgsOfMember(value)),
  fromRanked: blocksOfValidRgs,
};

/** The family of a query its schema has accepted (the HTTP app's way in; users call setPartitionFamily). */
export function setPartitionsOf(query: SetPartitionsCountQuery): SetPartitions {
  return new LibraryFamily(SET_PARTITIONS, query);
}

/**
 * The set partitions of the items 1..`constraints.n` with the given constraints, checked by the
 * schema of GET /v1/set-partitions/count (the same rules and messages; PartsmithError when
 * refused).
 *
 * ```ts
 * const shards = setPartitionFamily({ n: 12, blocks: 3 });
 * shards.count;              // S(12, 3) = 86526n, a Stirling number of the second kind
 * shards.sample('tenants');  // e.g. [[1, 4, 5, 9], [2, 3, 7, 11, 12], [6, 8, 10]]: sample 0 of seed "tenants"
 * shards.rank([[1, 2, 3, 4, 5, 6, 7, 8, 9, 10], [11], [12]]);  // 0n: the first in the order of restricted growth strings
 * ```
 */
export function setPartitionFamily(constraints: SetPartitionConstraints): SetPartitions {
  return setPartitionsOf(parseParams(setPartitionsCountQuery, constraints, SET_PARTITIONS.countPath));
}
