import { z } from 'zod';
import { MAX_INDEX, MAX_N } from './bounds.js';
import { booleanParam, choiceParam, integerParam, seedParam } from './params.js';
import { noLengthWithMaxLength, partitionConstraints } from './partitions.js';

/** At most this many numbers in `parts` (the query-string limit bounds it too). */
export const MAX_PARTS_LISTED = 1000;

/** A comma-separated list of parts in any order, repeats kept (unlike `allowed`, a set). */
function partsListParam(description: string) {
  const message = `must be a comma-separated list of whole numbers from 1 to ${MAX_N} (at most ${MAX_PARTS_LISTED} of them)`;
  return z
    .preprocess(
      (raw) => (typeof raw === 'string' && /^[0-9]{1,16}(,[0-9]{1,16})*$/.test(raw) ? raw.split(',').map(Number) : raw),
      z.array(z.number().int().min(1, { error: message }).max(MAX_N, { error: message }), { error: message }).min(1, { error: message }).max(MAX_PARTS_LISTED, { error: message }),
    )
    .describe(description);
}

/** GET /v1/partitions/diagram */
export const diagramQuery = z
  .strictObject({
    parts: partsListParam('The partition to draw, e.g. 5,4,1,1 (any order). Give either parts or n.').optional(),
    n: integerParam(0, MAX_N, 'Draw a random partition of n: sample `index` of `seed`, exactly as GET /v1/partitions returns it. Give either parts or n.').optional(),
    seed: seedParam('With n: the seed of the sample to draw. When absent the server draws one (header `Partsmith-Seed`).'),
    index: integerParam(0, MAX_INDEX, 'With n: which sample of the seed to draw (the same as start=index&count=1 on GET /v1/partitions).').default(0),
    style: choiceParam(['svg', 'text'], 'svg: an SVG picture, one square per unit; text: one line of # per part.').default('svg'),
    conjugate: booleanParam('Draw the conjugate partition (the diagram reflected in its diagonal: rows become columns).').default(false),
    ...partitionConstraints,
  })
  .superRefine((query, ctx) => {
    if ((query.parts === undefined) === (query.n === undefined)) {
      ctx.addIssue({ code: 'custom', path: [query.parts === undefined ? 'n' : 'parts'], message: 'give exactly one of parts (a partition to draw) or n (draw a random one)' });
    }
    if (query.parts !== undefined) {
      for (const key of ['seed', 'distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed'] as const) {
        if (query[key] !== undefined) ctx.addIssue({ code: 'custom', path: [key], message: 'applies only with n (a random partition), not with parts' });
      }
    }
    noLengthWithMaxLength(query, ctx);
  });

export type DiagramQuery = z.output<typeof diagramQuery>;
