import type { Partition } from './partition.js';
import type { RandomSource } from './random.js';

/** An exact uniform sampler for one fixed family (its n and constraints are bound at creation). */
export interface PartitionSampler {
  /** Identifier and version of the method, reported in responses, e.g. "table-recursive/1". */
  readonly method: string;
  sample(source: RandomSource): Partition;
}

/** An exact uniform sampler of compositions (parts in order) for one fixed family. */
export interface CompositionSampler {
  readonly method: string;
  sample(source: RandomSource): number[];
}
