import type { PartitionFamily } from '../../core/family.js';
import { partitionRanker, partitionRankTableSize } from '../../core/ranks/partition-ranker.js';
import type { Ranker } from '../../core/ranks/ranker.js';
import type { AppContext } from '../endpoint.js';
import { defineEndpoint } from '../endpoint.js';
import { membersAsMultiplicities, membersAsParts, rankOf, respondWithListing, runsOf, unrankOf } from '../ranking.js';
import { respondWithJson } from '../respond.js';
import { partitionsListQuery, partitionsRankQuery, partitionsUnrankQuery } from '../../schemas/ranks.js';
import { LIST_RESPONSES, PARTITION_ORDER, RANK_RESPONSES } from './docs.js';
import { partitionFamilyOf } from '../../library/partitions.js';

const LIST_PATH = '/v1/partitions/list';
const RANK_PATH = '/v1/partitions/rank';
const UNRANK_PATH = '/v1/partitions/unrank';

/** The family's ranker, from the per-isolate cache. */
export function partitionRankerFor(context: AppContext, family: PartitionFamily): Ranker {
  return context.rankers.getOrCreate(JSON.stringify(family), () => ({ ranker: partitionRanker(family), bytes: partitionRankTableSize(family).bytes }));
}

/** The most numbers one member can take in a response: its parts, or two per distinct size. */
function numbersPerMember(family: PartitionFamily, multiplicities: boolean): number {
  const smallest = Math.max(1, family.minPart ?? 1, family.allowed?.[0] ?? 1);
  let parts = Math.floor(family.n / smallest);
  if (family.length !== undefined) parts = Math.min(parts, family.length);
  if (family.maxLength !== undefined) parts = Math.min(parts, family.maxLength);
  if (family.distinct) parts = Math.min(parts, Math.floor(Math.sqrt(2 * family.n)));
  // Distinct sizes d of a partition of n satisfy d(d + 1)/2 <= n.
  return Math.max(1, multiplicities ? 2 * Math.min(parts, Math.floor(Math.sqrt(2 * family.n))) : parts);
}

export const partitionsListEndpoint = defineEndpoint({
  path: LIST_PATH,
  summary: 'Every partition of n in a family, in order, each with its rank',
  description: `Lists the members from rank start on (count of them), each with its rank. ${PARTITION_ORDER} A listing is a pure function of the query: the same page always, on every runtime.`,
  query: partitionsListQuery,
  responses: LIST_RESPONSES,
  handle(request, query, context) {
    const family = partitionFamilyOf(query);
    const multiplicities = query.as === 'multiplicities';
    return respondWithListing(
      request,
      LIST_PATH,
      query,
      {
        ranker: partitionRankerFor(context, family),
        familyJson: JSON.stringify(family),
        start: BigInt(query.start),
        count: query.count,
        format: query.format,
        encoder: multiplicities ? membersAsMultiplicities : membersAsParts,
        numbersPerMember: numbersPerMember(family, multiplicities),
      },
      context.limits,
    );
  },
});

export const partitionsRankEndpoint = defineEndpoint({
  path: RANK_PATH,
  summary: 'The rank of a partition in its family',
  description: `The position of the partition given by parts among the members of the family (n, which defaults to the sum of the parts, and the constraints), as a decimal string. ${PARTITION_ORDER} A list that is not a member — not listed largest first, not summing to n, or breaking a constraint — is answered with 422 naming parts.`,
  query: partitionsRankQuery,
  responses: RANK_RESPONSES,
  handle(request, query, context) {
    const n = query.n ?? query.parts.reduce((a, b) => a + b, 0);
    const family = partitionFamilyOf({ ...query, n });
    const ranker = partitionRankerFor(context, family);
    return respondWithJson(request, RANK_PATH, query, { family, parts: query.parts, rank: String(rankOf(ranker, query.parts)), total: String(ranker.count) });
  },
});

export const partitionsUnrankEndpoint = defineEndpoint({
  path: UNRANK_PATH,
  summary: 'The partition at a rank of its family',
  description: `The member of the family at position rank (a decimal string from 0 to the number of members - 1; past the end: 422 naming rank). ${PARTITION_ORDER}`,
  query: partitionsUnrankQuery,
  responses: RANK_RESPONSES,
  handle(request, query, context) {
    const family = partitionFamilyOf(query);
    const ranker = partitionRankerFor(context, family);
    const member = unrankOf(ranker, BigInt(query.rank));
    const form = query.as === 'multiplicities' ? { multiplicities: multiplicityPairs(member) } : { parts: member };
    return respondWithJson(request, UNRANK_PATH, query, { family, rank: query.rank, total: String(ranker.count), ...form });
  },
});

/** [part, multiplicity] pairs of parts listed largest first. */
function multiplicityPairs(parts: readonly number[]): number[][] {
  const { sizes, multiplicities } = runsOf(parts);
  return sizes.map((size, i) => [size, multiplicities[i]]);
}
