import type { RandomSource } from '../random.js';
import type { SamplerEstimate } from '../sampler.js';
import type { SetPartition } from './set-partition.js';

/** An exact uniform sampler for one fixed set-partition family (bound at creation). */
export interface SetPartitionSampler extends SamplerEstimate {
  /** Identifier and version of the method, reported in responses, e.g. "stam/1". */
  readonly method: string;
  /** Mean number of blocks of a sample. */
  readonly expectedBlocks: number;
  sample(source: RandomSource): SetPartition;
}
