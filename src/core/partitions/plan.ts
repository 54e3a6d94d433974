import type { PartitionFamily } from '../family.js';
import type { PartitionSampler } from '../sampler.js';
import { constrainedPartitionSampler } from './constrained/plan.js';
import { unrestrictedPartitionSampler } from './unrestricted.js';

/** True when the family has no constraint beyond its size. */
export function isUnconstrained(family: PartitionFamily): boolean {
  return (
    !family.distinct &&
    (family.minPart === undefined || family.minPart <= 1) &&
    family.maxPart === undefined &&
    family.length === undefined &&
    family.maxLength === undefined &&
    family.allowed === undefined
  );
}

/**
 * Picks an exact uniform sampler for the family: the unrestricted sampler (a counting table for
 * small n, the self-similar Boltzmann method above) when there is no constraint, otherwise the
 * constrained planner, which chooses among its own exact methods by estimated cost. The choice
 * depends on the family only, never on the seed, so sample i stays a function of
 * (seed, i, family, ALGORITHM_VERSION).
 */
export function planPartitionSampler(family: PartitionFamily): PartitionSampler {
  return isUnconstrained(family) ? unrestrictedPartitionSampler(family.n) : constrainedPartitionSampler(family);
}
