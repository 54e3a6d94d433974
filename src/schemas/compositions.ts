import { z } from 'zod';
import { MAX_N } from './bounds.js';
import { choiceParam, integerParam, sizeListParam } from './params.js';
import { countFields, samplingFields } from './common.js';

/** Constraints on a composition; all optional and combinable. */
export const compositionConstraints = {
  length: integerParam(0, MAX_N, 'Exactly this many parts.').optional(),
  minPart: integerParam(0, MAX_N, 'Every part is at least this (default 1). 0 allows empty parts (weak compositions) and needs length.').optional(),
  maxPart: integerParam(1, MAX_N, 'Every part is at most this.').optional(),
  allowed: sizeListParam(1, MAX_N, 1000, 'Comma-separated allowed part sizes, e.g. 1,3,4.').optional(),
};

export function weakNeedsLength(query: { length?: number; minPart?: number }, ctx: z.RefinementCtx): void {
  if (query.minPart === 0 && query.length === undefined) {
    ctx.addIssue({ code: 'custom', path: ['minPart'], message: 'can be 0 only together with length (otherwise there are infinitely many compositions)' });
  }
}

/** GET /v1/compositions */
export const compositionsQuery = z
  .strictObject({
    ...samplingFields,
    as: choiceParam(['parts'], 'parts: each sample a list of parts in order. (Compositions are ordered, so there is no multiplicity form.)').default('parts'),
    ...compositionConstraints,
  })
  .superRefine(weakNeedsLength);

/** GET /v1/compositions/count */
export const compositionsCountQuery = z.strictObject({ ...countFields, ...compositionConstraints }).superRefine(weakNeedsLength);

export type CompositionsQuery = z.output<typeof compositionsQuery>;
export type CompositionsCountQuery = z.output<typeof compositionsCountQuery>;
