import type { PartitionNumbers } from '../../core/counting/partition-numbers.js';
import { LimitExceededError } from '../../core/errors.js';
import type { PartitionFamily } from '../../core/family.js';

/** Largest n whose unrestricted count is served (the BigInt table costs O(n^1.5) additions). */
export const MAX_COUNT_N = 50_000;

/** Interim: unrestricted families only. */
export function countPartitionFamily(family: PartitionFamily, numbers: PartitionNumbers): bigint {
  const keys = Object.keys(family).filter((k) => k !== 'kind' && k !== 'n');
  if (keys.length > 0) throw new LimitExceededError('counting constrained partitions is not available yet', 'unconstrained only');
  if (family.n > MAX_COUNT_N) throw new LimitExceededError(`exact counts are served for n up to ${MAX_COUNT_N}`, `n <= ${MAX_COUNT_N}`);
  return numbers.get(family.n);
}
