import { countPartitions } from '../core/counting/partition-counts.js';
import { canonicalFamily, type PartitionFamily } from '../core/family.js';
import { partsOf, type Partition } from '../core/partition.js';
import { planPartitionSampler } from '../core/partitions/plan.js';
import { partitionRanker, partitionRankTableSize } from '../core/ranks/partition-ranker.js';
import type { PartitionSampler } from '../core/sampler.js';
import type { PartitionsCountParams } from '../client/params.js';
import { partitionsCountQuery, type PartitionsCountQuery } from '../schemas/partitions.js';
import { isPartitionMember } from './membership.js';
import { LibraryFamily, type FamilyKind } from './sampled-family.js';
import { parseParams } from './validate.js';

/** The constraints of a partition family: n and the parameters of GET /v1/partitions/count, typed from its schema. */
export type PartitionConstraints = PartitionsCountParams;

/** The family a query describes, normalised (the default minPart = 1 is dropped). */
export function partitionFamilyOf(query: PartitionsCountQuery): PartitionFamily {
  return canonicalFamily<PartitionFamily>({
    kind: 'partition',
    n: query.n,
    distinct: query.distinct,
    minPart: query.minPart === 1 ? undefined : query.minPart,
    maxPart: query.maxPart,
    length: query.length,
    maxLength: query.maxLength,
    allowed: query.allowed,
  });
}

/** The partitions of n with given constraints; members are their parts, largest first (the API's `as=parts`). */
export type Partitions = LibraryFamily<PartitionFamily, Partition, PartitionSampler>;

const PARTITIONS: FamilyKind<PartitionFamily, Partition, PartitionSampler> = {
  kind: 'partition',
  samplesPath: '/v1/partitions',
  countPath: '/v1/partitions/count',
  params: ['n', 'distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed'],
  nField: partitionsCountQuery.shape.n,
  describe: (query) => partitionFamilyOf(query as PartitionsCountQuery),
  plan: planPartitionSampler,
  count: (family) => countPartitions(family),
  member: partsOf,
  contains: isPartitionMember,
  memberParam: 'parts',
  rankTable: (family) => ({ ranker: partitionRanker(family), bytes: partitionRankTableSize(family).bytes }),
  toRanked: (parts) => parts as readonly number[],
  fromRanked: (parts) => parts,
};

/** The family of a query its schema has accepted (the HTTP app's way in; users call partitionFamily). */
export function partitionsOf(query: PartitionsCountQuery): Partitions {
  return new LibraryFamily(PARTITIONS, query);
}

/**
 * The partitions of `constraints.n` with the given constraints, checked by the schema of GET
 * /v1/partitions/count (the same rules and messages; PartsmithError when refused).
 *
 * ```ts
 * const family = partitionFamily({ n: 60, maxPart: 20 });
 * family.count;                  // the exact number of members, a BigInt
 * family.sample('fixtures', 3);  // sample 3 of seed "fixtures", as GET /v1/partitions returns it
 * family.rank([20, 20, 20]);     // its position in the family's order (GET /v1/partitions/rank), a BigInt
 * family.unrank(0n);             // [20, 20, 20]: the first member (GET /v1/partitions/unrank)
 * [...family.list(0n, 10)];      // the first ten members, in order (GET /v1/partitions/list)
 * ```
 */
export function partitionFamily(constraints: PartitionConstraints): Partitions {
  return partitionsOf(parseParams(partitionsCountQuery, constraints, PARTITIONS.countPath));
}
