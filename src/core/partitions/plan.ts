import type { PartitionFamily } from '../family.js';
import { LimitExceededError } from '../errors.js';
import type { PartitionSampler } from '../sampler.js';
import { RecursiveOracle } from './recursive-oracle.js';

/** Picks an exact uniform sampler for the family. (Interim: the exact oracle only.) */
export function planPartitionSampler(family: PartitionFamily): PartitionSampler {
  const constrained = family.distinct || family.minPart !== undefined || family.maxPart !== undefined || family.length !== undefined || family.maxLength !== undefined || family.allowed !== undefined;
  if (constrained) throw new LimitExceededError('constrained partitions are not available yet', 'unconstrained only');
  if (family.n > RecursiveOracle.MAX_N) throw new LimitExceededError(`n must be at most ${RecursiveOracle.MAX_N}`, `n <= ${RecursiveOracle.MAX_N}`);
  return new RecursiveOracle(family.n);
}
