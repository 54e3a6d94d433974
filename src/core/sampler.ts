import type { Partition } from './partition.js';
import type { RandomSource } from './random.js';

/** Figures a planner knows about a sampler before it runs; the HTTP layer enforces limits with them. */
export interface SamplerEstimate {
  /** Mean number of parts of a sample (for response-size limits). */
  readonly expectedLength: number;
  /**
   * Mean work per sample, in basic steps (random draws, table look-ups, loop iterations):
   * used to refuse requests over the work budget before starting.
   */
  readonly expectedWork: number;
}

/** An exact uniform sampler for one fixed family (its n and constraints are bound at creation). */
export interface PartitionSampler extends SamplerEstimate {
  /** Identifier and version of the method, reported in responses, e.g. "table-recursive/1". */
  readonly method: string;
  /** Mean number of distinct part sizes of a sample (size of the multiplicity form). */
  readonly expectedDistinct: number;
  sample(source: RandomSource): Partition;
}

/** An exact uniform sampler of compositions (parts in order) for one fixed family. */
export interface CompositionSampler extends SamplerEstimate {
  readonly method: string;
  sample(source: RandomSource): number[];
  /**
   * The same sample (the same draws and parts) as a typed array, for samplers whose output can be
   * large: callers that only write the parts out skip building a list.
   */
  readonly sampleParts?: (source: RandomSource) => Int32Array;
}
