import { z } from 'zod';
import { COMPOSITION_CHECK_MAX_N } from '../core/pictures/composition-parts.js';
import { choiceParam, integerParam, seedParam, withThousands } from './params.js';
import { MAX_CHECK_SAMPLES } from './check.js';

/**
 * GET /v1/compositions/check. No constraints: the check compares with an exact law, and the
 * exact law of the number of parts is tabulated here only for unrestricted compositions
 * (1 + Binomial(n − 1, 1/2)). Constraints are refused as unknown parameters (400), not ignored.
 */
export const compositionCheckQuery = z.strictObject({
  n: integerParam(1, COMPOSITION_CHECK_MAX_N, `The size of the compositions checked (1 to ${withThousands(COMPOSITION_CHECK_MAX_N)}).`),
  samples: integerParam(1, MAX_CHECK_SAMPLES, `How many samples to draw (samples 0, 1, ... of the seed, the same as GET /v1/compositions returns). At most ${MAX_CHECK_SAMPLES}.`).default(1000),
  seed: seedParam('The seed of the samples checked. When absent the server draws one (body field `seed`, header `Partsmith-Seed`).'),
  format: choiceParam(['json', 'svg'], 'json: the statistics; svg: the plot (numbers of parts against their exact law).').default('json'),
});

export type CompositionCheckQuery = z.output<typeof compositionCheckQuery>;
