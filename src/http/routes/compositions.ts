import { planCompositionSampler, countCompositions } from '../../core/compositions/plan.js';
import { canonicalFamily, type CompositionFamily } from '../../core/family.js';
import { SampleStreams } from '../../core/seeding.js';
import { compositionAsParts } from '../encode.js';
import { defineEndpoint } from '../endpoint.js';
import { respondWithJson, respondWithSamples } from '../respond.js';
import { compositionsCountQuery, compositionsQuery, type CompositionsCountQuery } from '../../schemas/compositions.js';
import { COUNT_RESPONSES, SAMPLE_RESPONSES } from './docs.js';

const COMPOSITIONS_PATH = '/v1/compositions';
const COMPOSITIONS_COUNT_PATH = '/v1/compositions/count';

/** The family a query describes, normalised (the default minPart = 1 is dropped). */
export function compositionFamilyOf(query: CompositionsCountQuery): CompositionFamily {
  return canonicalFamily<CompositionFamily>({
    kind: 'composition',
    n: query.n,
    length: query.length,
    minPart: query.minPart === 1 ? undefined : query.minPart,
    maxPart: query.maxPart,
    allowed: query.allowed,
  });
}

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
    const { family, key } = memo.get('family', () => {
      const canonical = compositionFamilyOf(query);
      return { family: canonical, key: JSON.stringify(canonical) }; // = familyKey(family): compositionFamilyOf returns the canonical form
    });
    const { sampler, streams } = context.compositionSamplers.getOrCreate(key, () => ({ sampler: planCompositionSampler(family), streams: new SampleStreams(key) }));
    return respondWithSamples(
      request,
      COMPOSITIONS_PATH,
      seeded ? query : { ...query, seed },
      { family, streams, sampler, encoder: compositionAsParts, numbersPerSample: sampler.expectedLength, seed, start: query.start, count: query.count, format: query.format },
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
    const family = compositionFamilyOf(query);
    return respondWithJson(request, COMPOSITIONS_COUNT_PATH, query, { family, count: countCompositions(family).toString() });
  },
});
