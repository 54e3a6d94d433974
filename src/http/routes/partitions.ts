import { canonicalFamily, type PartitionFamily } from '../../core/family.js';
import { countPartitions } from '../../core/counting/partition-counts.js';
import { planPartitionSampler } from '../../core/partitions/plan.js';
import { SampleStreams } from '../../core/seeding.js';
import { partitionAsMultiplicities, partitionAsParts } from '../encode.js';
import { defineEndpoint } from '../endpoint.js';
import { respondWithJson, respondWithSamples } from '../respond.js';
import { partitionsCountQuery, partitionsQuery, type PartitionsCountQuery } from '../../schemas/partitions.js';
import { COUNT_RESPONSES, SAMPLE_RESPONSES } from './docs.js';

/** The family a query describes, normalised (the default minPart = 1 is dropped). */
export function partitionFamilyOf(query: PartitionsCountQuery): PartitionFamily {
  return canonicalFamily<PartitionFamily>({
    kind: 'partition',
    n: query.n,
    distinct: query.distinct,
    minPart: query.minPart === 1 ? undefined : query.minPart,
    maxPart: query.maxPart,
    length: query.length,
    maxLength: query.maxLength,
    allowed: query.allowed,
  });
}

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
    const { family, key } = memo.get('family', () => {
      const canonical = partitionFamilyOf(query);
      return { family: canonical, key: JSON.stringify(canonical) }; // = familyKey(family): partitionFamilyOf returns the canonical form
    });
    const { sampler, streams } = context.partitionSamplers.getOrCreate(key, () => ({ sampler: planPartitionSampler(family), streams: new SampleStreams(key) }));
    const multiplicities = query.as === 'multiplicities';
    return respondWithSamples(
      request,
      PARTITIONS_PATH,
      seeded ? query : { ...query, seed },
      {
        family,
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
    const family = partitionFamilyOf(query);
    const count = countPartitions(family);
    return respondWithJson(request, PARTITIONS_COUNT_PATH, query, { family, count: count.toString() });
  },
});
