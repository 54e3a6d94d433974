import type { CompositionFamily } from '../../core/family.js';
import { compositionRanker, compositionRankTableSize } from '../../core/ranks/composition-ranker.js';
import type { Ranker } from '../../core/ranks/ranker.js';
import type { AppContext } from '../endpoint.js';
import { defineEndpoint } from '../endpoint.js';
import { membersAsParts, rankOf, respondWithListing, unrankOf } from '../ranking.js';
import { respondWithJson } from '../respond.js';
import { compositionsListQuery, compositionsRankQuery, compositionsUnrankQuery } from '../../schemas/ranks.js';
import { compositionFamilyOf } from '../../library/compositions.js';
import { COMPOSITION_ORDER, LIST_RESPONSES, RANK_RESPONSES } from './docs.js';

const LIST_PATH = '/v1/compositions/list';
const RANK_PATH = '/v1/compositions/rank';
const UNRANK_PATH = '/v1/compositions/unrank';

/** The family's ranker, from the per-isolate cache. */
export function compositionRankerFor(context: AppContext, family: CompositionFamily): Ranker {
  return context.rankers.getOrCreate(JSON.stringify(family), () => ({ ranker: compositionRanker(family), bytes: compositionRankTableSize(family).bytes }));
}

/** The most parts one member can have: the length, or n over the smallest part. */
function numbersPerMember(family: CompositionFamily): number {
  if (family.length !== undefined) return Math.max(1, family.length);
  const smallest = Math.max(1, family.minPart ?? 1, family.allowed?.[0] ?? 1);
  return Math.max(1, Math.floor(family.n / smallest));
}

export const compositionsListEndpoint = defineEndpoint({
  path: LIST_PATH,
  summary: 'Every composition of n in a family, in order, each with its rank',
  description: `Lists the members from rank start on (count of them), each with its rank. ${COMPOSITION_ORDER} A listing is a pure function of the query: the same page always, on every runtime.`,
  query: compositionsListQuery,
  responses: LIST_RESPONSES,
  handle(request, query, context) {
    const family = compositionFamilyOf(query);
    return respondWithListing(
      request,
      LIST_PATH,
      query,
      {
        ranker: compositionRankerFor(context, family),
        familyJson: JSON.stringify(family),
        start: BigInt(query.start),
        count: query.count,
        format: query.format,
        encoder: membersAsParts,
        numbersPerMember: numbersPerMember(family),
      },
      context.limits,
    );
  },
});

export const compositionsRankEndpoint = defineEndpoint({
  path: RANK_PATH,
  summary: 'The rank of a composition in its family',
  description: `The position of the composition given by parts among the members of the family (n, which defaults to the sum of the parts, and the constraints), as a decimal string. ${COMPOSITION_ORDER} A list that is not a member — not summing to n, or breaking a constraint — is answered with 422 naming parts.`,
  query: compositionsRankQuery,
  responses: RANK_RESPONSES,
  handle(request, query, context) {
    const n = query.n ?? query.parts.reduce((a, b) => a + b, 0);
    const family = compositionFamilyOf({ ...query, n });
    const ranker = compositionRankerFor(context, family);
    return respondWithJson(request, RANK_PATH, query, { family, parts: query.parts, rank: String(rankOf(ranker, query.parts)), total: String(ranker.count) });
  },
});

export const compositionsUnrankEndpoint = defineEndpoint({
  path: UNRANK_PATH,
  summary: 'The composition at a rank of its family',
  description: `The member of the family at position rank (a decimal string from 0 to the number of members - 1; past the end: 422 naming rank). ${COMPOSITION_ORDER}`,
  query: compositionsUnrankQuery,
  responses: RANK_RESPONSES,
  handle(request, query, context) {
    const family = compositionFamilyOf(query);
    const ranker = compositionRankerFor(context, family);
    return respondWithJson(request, UNRANK_PATH, query, { family, rank: query.rank, total: String(ranker.count), parts: unrankOf(ranker, BigInt(query.rank)) });
  },
});
