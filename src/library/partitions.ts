import { countPartitions } from '../core/counting/partition-counts.js';
import { canonicalFamily, type PartitionFamily } from '../core/family.js';
import { partsOf, type Partition } from '../core/partition.js';
import { planPartitionSampler } from '../core/partitions/plan.js';
import type { PartitionSampler } from '../core/sampler.js';
import type { PartitionsCountParams } from '../client/params.js';
import { partitionsCountQuery, type PartitionsCountQuery } from '../schemas/partitions.js';
import { isPartitionMember } from './membership.js';
import { FamilyBase, pickParams, type SampledFamily } from './sampled-family.js';
import { parseParam, parseParams } from './validate.js';

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

const PARTITION_PARAMS = ['n', 'distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed'] as const;

/**
 * The partitions of n with the given constraints. Members are written as their parts, largest
 * first (the API's `as=parts`).
 */
export class Partitions extends FamilyBase<number[], Partition, PartitionSampler> implements SampledFamily<number[]> {
  readonly kind = 'partition';
  declare readonly description: PartitionFamily;
  protected readonly samplesPath = '/v1/partitions';
  protected readonly countPath = '/v1/partitions/count';
  protected readonly familyParams = PARTITION_PARAMS;

  /** From a query the count endpoint's schema has accepted, or a sampling endpoint's (only its family fields are kept). The HTTP app's way in; users call partitionFamily. */
  constructor(query: PartitionsCountQuery) {
    super(partitionFamilyOf(query), pickParams(query, PARTITION_PARAMS));
  }

  protected plan(): PartitionSampler {
    return planPartitionSampler(this.description);
  }

  protected countMembers(): bigint {
    return countPartitions(this.description);
  }

  protected member(partition: Partition): number[] {
    return partsOf(partition);
  }

  contains(value: unknown): value is number[] {
    return isPartitionMember(this.description, value);
  }

  resize(n: number): Partitions {
    const size = parseParam(partitionsCountQuery.shape.n, n, 'n', this.countPath);
    return new Partitions({ ...(this.query as PartitionsCountQuery), n: size });
  }
}

/**
 * The partitions of `constraints.n` with the given constraints, checked by the schema of GET
 * /v1/partitions/count (the same rules and messages; PartsmithError when refused).
 *
 * ```ts
 * const family = partitionFamily({ n: 60, maxPart: 20 });
 * family.count;                  // the exact number of members, a BigInt
 * family.sample('fixtures', 3);  // sample 3 of seed "fixtures", as GET /v1/partitions returns it
 * ```
 */
export function partitionFamily(constraints: PartitionConstraints): Partitions {
  return new Partitions(parseParams(partitionsCountQuery, constraints, '/v1/partitions/count'));
}
