import type { Partition } from '../../partition.js';
import type { PartitionSampler } from '../../sampler.js';
import type { PlanCandidate } from './plan.js';
import { about } from './refusal.js';
import type { ConstrainedSpec } from './spec.js';

/**
 * What the length branch's candidate lists (plan-length.ts and the files it calls) share: the
 * planner's input, the work ceiling, a sampler turned into a candidate, the refusal hints in the
 * family's terms, and the wrapper of a sampler of the conjugate family.
 */

/** What the length branch needs from the planner. */
export interface LengthPlanInput {
  readonly spec: ConstrainedSpec;
  readonly shape: { readonly expectedLength: number; readonly expectedDistinct: number; readonly tilt?: number };
  /** isFeasible's answer: methods that cannot detect an empty family need true. */
  readonly feasible: boolean | undefined;
  /** The cheapest fitting candidate for the same family without its length constraint. */
  readonly withoutLength: () => PlanCandidate | null;
  /** Whether a sampler's figures are within the planner's limits. */
  readonly fits: (setupWork: number, sampleWork: number) => boolean;
}

/** No box design is solved whose work per sample would certainly exceed this (the planner's limit). */
export const SAMPLE_WORK_CEILING = 1e7;

export function samplerCandidate(input: LengthPlanInput, sampler: PartitionSampler, setupWork = 0, hint?: (work: number) => string): PlanCandidate {
  const fits = input.fits(setupWork, sampler.expectedWork);
  return {
    method: sampler.method,
    setupWork,
    sampleWork: sampler.expectedWork,
    fits,
    build: () => sampler,
    ...(fits || hint === undefined ? {} : { hint: hint(sampler.expectedWork) }),
  };
}

/** "at this n the family fits with at most about 24000 parts". */
export function partsHint(parts: number): string {
  return `at this n the family fits with at most about ${about(parts)} parts`;
}

/** "... when maxPart is at most about 24000". */
export function maxPartHint(maxPart: number): string {
  return `at this n the family fits with maxPart at most about ${about(maxPart)}`;
}

/** Wraps a sampler of the conjugate family. */
export function conjugated(
  inner: PartitionSampler,
  map: (p: Partition) => Partition,
  length: number,
  shape: { expectedDistinct: number },
): PartitionSampler {
  return {
    method: `${inner.method}+conjugate`,
    expectedLength: length,
    // Conjugation keeps the number of distinct sizes (corners of the Ferrers diagram).
    expectedDistinct: Math.min(length, Math.max(inner.expectedDistinct, shape.expectedDistinct)),
    expectedWork: inner.expectedWork + 2 * inner.expectedDistinct,
    sample: (source) => map(inner.sample(source)),
  };
}
