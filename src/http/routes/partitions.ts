import { familyKey } from '../../core/family.js';
import { partitionFamilyOf, partitionsOf } from '../../library/partitions.js';
import { partitionAsMultiplicities, partitionAsParts } from '../encode.js';
import { defineEndpoint } from '../endpoint.js';
import { respondWithJson, respondWithSamples } from '../respond.js';
import { partitionsCountQuery, partitionsQuery } from '../../schemas/partitions.js';
import { COUNT_RESPONSES, SAMPLE_RESPONSES } from './docs.js';

const PARTITIONS_PATH = '/v1/partitions';
const PARTITIONS_COUNT_PATH = '/v1/partitions/count';

export const partitionsEndpoint = defineEndpoint({
  path: PARTITIONS_PATH,
  summary: 'Uniformly random partitions of n',
  description:
    'Each sample is drawn exactly uniformly from the partitions of n that satisfy the constraints. Sample i of a seed is the same whatever start and count are, on every runtime.',
  query: partitionsQuery,
  responses: SAMPLE_RESPONSES,
  handle(request, query, context, memo) {
    const seeded = query.seed !== undefined;
    const seed = query.seed ?? context.drawSeed();
    const key = memo.get('family-key', () => familyKey(partitionFamilyOf(query)));
    const family = context.partitionFamilies.getOrCreate(key, () => partitionsOf(query));
    const { sampler, streams } = family;
    const multiplicities = query.as === 'multiplicities';
    return respondWithSamples(
      request,
      PARTITIONS_PATH,
      seeded ? query : { ...query, seed },
      {
        family: family.description,
        streams,
        sampler,
        encoder: multiplicities ? partitionAsMultiplicities : partitionAsParts,
        numbersPerSample: multiplicities ? 2 * sampler.expectedDistinct : sampler.expectedLength,
        seed,
        start: query.start,
        count: query.count,
        format: query.format,
      },
      seeded,
      context.limits,
      memo,
    );
  },
});

export const partitionsCountEndpoint = defineEndpoint({
  path: PARTITIONS_COUNT_PATH,
  summary: 'The exact number of partitions of n in a family',
  description: 'The count is exact (a decimal string, since it may exceed 2^53).',
  query: partitionsCountQuery,
  responses: COUNT_RESPONSES,
  handle(request, query) {
    const family = partitionsOf(query);
    return respondWithJson(request, PARTITIONS_COUNT_PATH, query, { family: family.description, count: family.count.toString() });
  },
});
