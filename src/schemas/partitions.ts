import { z } from 'zod';
import { MAX_N } from './bounds.js';
import { booleanParam, choiceParam, integerParam, sizeListParam } from './params.js';
import { countFields, samplingFields } from './common.js';

/** Constraints on a partition; all optional and combinable (except length with maxLength). */
export const partitionConstraints = {
  distinct: booleanParam('All parts different.').optional(),
  minPart: integerParam(1, MAX_N, 'Every part is at least this.').optional(),
  maxPart: integerParam(1, MAX_N, 'Every part is at most this.').optional(),
  length: integerParam(0, MAX_N, 'Exactly this many parts.').optional(),
  maxLength: integerParam(0, MAX_N, 'At most this many parts.').optional(),
  allowed: sizeListParam(1, MAX_N, 1000, 'Comma-separated allowed part sizes, e.g. 1,2,5,10.').optional(),
};

export function noLengthWithMaxLength(query: { length?: number; maxLength?: number }, ctx: z.RefinementCtx): void {
  if (query.length !== undefined && query.maxLength !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['maxLength'], message: 'cannot be combined with length: give one of them' });
  }
}

/** GET /v1/partitions */
export const partitionsQuery = z
  .strictObject({
    ...samplingFields,
    as: choiceParam(['parts', 'multiplicities'], 'parts: each sample a list of parts, largest first; multiplicities: a list of [part, multiplicity] pairs, largest part first.').default('parts'),
    ...partitionConstraints,
  })
  .superRefine(noLengthWithMaxLength);

/** GET /v1/partitions/count */
export const partitionsCountQuery = z.strictObject({ ...countFields, ...partitionConstraints }).superRefine(noLengthWithMaxLength);

export type PartitionsQuery = z.output<typeof partitionsQuery>;
export type PartitionsCountQuery = z.output<typeof partitionsCountQuery>;
