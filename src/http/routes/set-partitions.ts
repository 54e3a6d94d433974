import { canonicalFamily, type SetPartitionFamily } from '../../core/family.js';
import { countSetPartitions } from '../../core/set-partitions/counts.js';
import { planSetPartitionSampler } from '../../core/set-partitions/plan.js';
import { contradiction } from '../../core/set-partitions/resolve.js';
import { SampleStreams } from '../../core/seeding.js';
import { defineEndpoint } from '../endpoint.js';
import { ProblemError } from '../problem.js';
import { respondWithJson, respondWithSamples } from '../respond.js';
import { setPartitionAsBlocks, setPartitionAsRgs } from '../set-partition-encode.js';
import { setPartitionsCountQuery, setPartitionsQuery, type SetPartitionsCountQuery } from '../../schemas/set-partitions.js';
import { COUNT_RESPONSES, SAMPLE_RESPONSES } from './docs.js';

const SET_PARTITIONS_PATH = '/v1/set-partitions';
const SET_PARTITIONS_COUNT_PATH = '/v1/set-partitions/count';

/**
 * The family a query describes, normalised (the default minBlockSize = 1 dropped). A
 * contradiction (blocks > n, minBlockSize > maxBlockSize) is a 422 naming its parameter.
 */
export function setPartitionFamilyOf(query: SetPartitionsCountQuery): SetPartitionFamily {
  const family = canonicalFamily<SetPartitionFamily>({
    kind: 'set-partition',
    n: query.n,
    blocks: query.blocks,
    maxBlocks: query.maxBlocks,
    minBlockSize: query.minBlockSize === 1 ? undefined : query.minBlockSize,
    maxBlockSize: query.maxBlockSize,
  });
  const problem = contradiction(family);
  if (problem) throw new ProblemError(422, `${problem.message}.`, [{ param: problem.param, message: problem.message }]);
  return family;
}

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
    const { family, key } = memo.get('family', () => {
      const canonical = setPartitionFamilyOf(query);
      return { family: canonical, key: JSON.stringify(canonical) }; // = familyKey(family): the canonical form
    });
    const { sampler, streams } = context.setPartitionSamplers.getOrCreate(key, () => ({ sampler: planSetPartitionSampler(family), streams: new SampleStreams(key) }));
    return respondWithSamples(
      request,
      SET_PARTITIONS_PATH,
      seeded ? query : { ...query, seed },
      {
        family,
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
    const family = setPartitionFamilyOf(query);
    return respondWithJson(request, SET_PARTITIONS_COUNT_PATH, query, { family, count: countSetPartitions(family).toString() });
  },
});
