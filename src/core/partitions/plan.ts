import type { PartitionFamily } from '../family.js';
import { LimitExceededError } from '../errors.js';
import type { PartitionSampler } from '../sampler.js';
import { constrainedPartitionSampler } from './constrained/plan.js';
import { RecursiveOracle } from './recursive-oracle.js';

/** True when the family has no constraint beyond its size. */
export function isUnconstrained(family: PartitionFamily): boolean {
  return !family.distinct && (family.minPart === undefined || family.minPart <= 1) && family.maxPart === undefined && family.length === undefined && family.maxLength === undefined && family.allowed === undefined;
}

/**
 * Picks an exact uniform sampler for the family: the unrestricted sampler when there is no
 * constraint, otherwise the constrained planner (which chooses among its own exact methods by
 * estimated cost). The choice depends on the family only, never on the seed.
 */
export function planPartitionSampler(family: PartitionFamily): PartitionSampler {
  if (!isUnconstrained(family)) return constrainedPartitionSampler(family);
  if (family.n > RecursiveOracle.MAX_N) throw new LimitExceededError(`n must be at most ${RecursiveOracle.MAX_N}`, `n <= ${RecursiveOracle.MAX_N}`);
  return new RecursiveOracle(family.n);
}
