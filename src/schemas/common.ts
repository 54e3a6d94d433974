import { z } from 'zod';
import { DEFAULT_MAX_COUNT, MAX_COUNT, MAX_INDEX, MAX_N } from './bounds.js';
import { choiceParam, integerParam, seedParam, withThousands } from './params.js';

/** Fields shared by every endpoint that returns samples. Spread into each endpoint's own schema. */
export const samplingFields = {
  n: integerParam(0, MAX_N, 'The size: every sample sums to exactly n.'),
  // The schema admits any count a server may be configured for; the configured limit
  // (default 10,000) is checked with the other limits before sampling.
  count: integerParam(1, MAX_COUNT, `How many samples to return: at most ${withThousands(DEFAULT_MAX_COUNT)} unless the server is configured otherwise.`).default(1),
  seed: seedParam('Replays a previous answer. When absent the server draws a seed and returns it (body field `seed`, header `Partsmith-Seed`).'),
  start: integerParam(0, MAX_INDEX, 'Index of the first sample. Sample i of a seed is the same whatever start and count are.').default(0),
  format: choiceParam(['json', 'ndjson', 'text'], 'json: one document; ndjson: one line per sample, streamed; text: one sample per line, parts separated by spaces.').default('json'),
};

export const countFields = {
  n: integerParam(0, MAX_N, 'The size.'),
};

export type SampleFormat = z.output<typeof samplingFields.format>;
