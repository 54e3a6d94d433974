import { z } from 'zod';
import { MAX_N } from './bounds.js';
import { choiceParam, integerParam, seedParam } from './params.js';
import { noLengthWithMaxLength, partitionConstraints } from './partitions.js';

/** Most samples one check may draw (the work limit may allow fewer for large n). */
export const MAX_CHECK_SAMPLES = 20_000;

/** GET /v1/partitions/check */
export const checkQuery = z
  .strictObject({
    n: integerParam(1, MAX_N, 'The size of the partitions checked.'),
    samples: integerParam(1, MAX_CHECK_SAMPLES, `How many samples to draw (samples 0, 1, ... of the seed, the same as GET /v1/partitions returns). At most ${MAX_CHECK_SAMPLES}.`).default(1000),
    seed: seedParam('The seed of the samples checked. When absent the server draws one (body field `seed`, header `Partsmith-Seed`).'),
    format: choiceParam(['json', 'svg'], 'json: the statistics; svg: the plots (largest part against its law, mean boundary against the limit curve).').default('json'),
    ...partitionConstraints,
  })
  .superRefine(noLengthWithMaxLength);

export type CheckQuery = z.output<typeof checkQuery>;
