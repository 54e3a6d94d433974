import { familyKey } from '../../core/family.js';
import { setPartitionFamilyOf, setPartitionsOf } from '../../library/set-partitions.js';
import { defineEndpoint } from '../endpoint.js';
import { respondWithJson, respondWithSamples } from '../respond.js';
import { setPartitionAsBlocks, setPartitionAsRgs } from '../set-partition-encode.js';
import { setPartitionsCountQuery, setPartitionsQuery } from '../../schemas/set-partitions.js';
import { COUNT_RESPONSES, SAMPLE_RESPONSES } from './docs.js';

const SET_PARTITIONS_PATH = '/v1/set-partitions';
const SET_PARTITIONS_COUNT_PATH = '/v1/set-partitions/count';

export const setPartitionsEndpoint = defineEndpoint({
  path: SET_PARTITIONS_PATH,
  summary: 'Uniformly random set partitions of n items',
  description:
    'Ways to split the items 1..n into non-empty blocks (groups), the order of blocks and of items in a block not mattering. Each sample is drawn exactly uniformly from the set partitions that satisfy the constraints; sample i of a seed is the same whatever start and count are.',
  query: setPartitionsQuery,
  responses: SAMPLE_RESPONSES,
  handle(request, query, context, memo) {
    const seeded = query.seed !== undefined;
    const seed = query.seed ?? context.drawSeed();
    // A contradiction (blocks > n, minBlockSize > maxBlockSize) is a 422 naming its parameter.
    const key = memo.get('family-key', () => familyKey(setPartitionFamilyOf(query)));
    const family = context.setPartitionFamilies.getOrCreate(key, () => setPartitionsOf(query));
    const { sampler, streams } = family;
    return respondWithSamples(
      request,
      SET_PARTITIONS_PATH,
      seeded ? query : { ...query, seed },
      {
        family: family.description,
        streams,
        sampler,
        encoder: query.as === 'rgs' ? setPartitionAsRgs : setPartitionAsBlocks,
        numbersPerSample: sampler.expectedLength,
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

export const setPartitionsCountEndpoint = defineEndpoint({
  path: SET_PARTITIONS_COUNT_PATH,
  summary: 'The exact number of set partitions of n items in a family',
  description: 'Bell numbers, Stirling numbers of the second kind and their block-size-bounded kin, exactly (a decimal string); 0 for an empty family.',
  query: setPartitionsCountQuery,
  responses: COUNT_RESPONSES,
  handle(request, query) {
    const family = setPartitionsOf(query);
    return respondWithJson(request, SET_PARTITIONS_COUNT_PATH, query, { family: family.description, count: family.count.toString() });
  },
});
