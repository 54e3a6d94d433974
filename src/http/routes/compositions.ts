import { familyKey } from '../../core/family.js';
import { compositionFamilyOf, compositionsOf } from '../../library/compositions.js';
import { compositionAsParts } from '../encode.js';
import { defineEndpoint } from '../endpoint.js';
import { respondWithJson, respondWithSamples } from '../respond.js';
import { compositionsCountQuery, compositionsQuery } from '../../schemas/compositions.js';
import { COUNT_RESPONSES, SAMPLE_RESPONSES } from './docs.js';

const COMPOSITIONS_PATH = '/v1/compositions';
const COMPOSITIONS_COUNT_PATH = '/v1/compositions/count';

export const compositionsEndpoint = defineEndpoint({
  path: COMPOSITIONS_PATH,
  summary: 'Uniformly random compositions of n',
  description:
    'Compositions are ordered: 1+2 and 2+1 are different. Each sample is drawn exactly uniformly from the compositions of n that satisfy the constraints; sample i of a seed is the same whatever start and count are.',
  query: compositionsQuery,
  responses: SAMPLE_RESPONSES,
  handle(request, query, context, memo) {
    const seeded = query.seed !== undefined;
    const seed = query.seed ?? context.drawSeed();
    const key = memo.get('family-key', () => familyKey(compositionFamilyOf(query)));
    const family = context.compositionFamilies.getOrCreate(key, () => compositionsOf(query));
    const { sampler, streams } = family;
    // Where the sampler has it, the typed-array form: the parts are only written out here.
    const sampleParts = sampler.sampleParts;
    const job = sampleParts ? { method: sampler.method, expectedWork: sampler.expectedWork, sample: sampleParts } : sampler;
    return respondWithSamples(
      request,
      COMPOSITIONS_PATH,
      seeded ? query : { ...query, seed },
      { family: family.description, streams, sampler: job, encoder: compositionAsParts, numbersPerSample: sampler.expectedLength, seed, start: query.start, count: query.count, format: query.format },
      seeded,
      context.limits,
      memo,
    );
  },
});

export const compositionsCountEndpoint = defineEndpoint({
  path: COMPOSITIONS_COUNT_PATH,
  summary: 'The exact number of compositions of n in a family',
  description: 'The count is exact (a decimal string); 0 for an empty family.',
  query: compositionsCountQuery,
  responses: COUNT_RESPONSES,
  handle(request, query) {
    const family = compositionsOf(query);
    return respondWithJson(request, COMPOSITIONS_COUNT_PATH, query, { family: family.description, count: family.count.toString() });
  },
});
