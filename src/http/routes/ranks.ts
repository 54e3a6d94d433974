import type { z } from 'zod';
import type { CompositionFamily, PartitionFamily, SetPartitionFamily } from '../../core/family.js';
import { compositionFamilyOf, compositionsOf } from '../../library/compositions.js';
import { partitionFamilyOf, partitionsOf } from '../../library/partitions.js';
import type { FamilyQuery } from '../../library/sampled-family.js';
import { blocksOfValidRgs } from '../../library/set-partition-forms.js';
import { setPartitionFamilyOf, setPartitionsOf } from '../../library/set-partitions.js';
import type { SampleEncoder } from '../encode.js';
import { defineEndpoint, type AppContext, type Endpoint } from '../endpoint.js';
import { membersAsBlocks, membersAsMultiplicities, membersAsParts, membersAsRgs, respondWithListing, runsOf, type RankedSource } from '../ranking.js';
import { respondWithJson } from '../respond.js';
import {
  compositionsListQuery,
  compositionsRankQuery,
  compositionsUnrankQuery,
  partitionsListQuery,
  partitionsRankQuery,
  partitionsUnrankQuery,
  setPartitionsListQuery,
  setPartitionsRankQuery,
  setPartitionsUnrankQuery,
} from '../../schemas/ranks.js';
import { COMPOSITION_ORDER, LIST_RESPONSES, PARTITION_ORDER, RANK_RESPONSES, SET_PARTITION_ORDER } from './docs.js';

/**
 * The rank endpoints of every kind of family — GET <base>/list, <base>/rank and <base>/unrank —
 * served from the library's family objects: the library checks the member, the rank and the
 * first rank of a listing (and answers what the library answers), its ranker lists and
 * unranks, and this layer writes the members in the form asked for.
 */

/** One form a member is written in (a value of the endpoints' `as`), from the ranker's form. */
interface MemberForm {
  readonly encoder: SampleEncoder<number[]>;
  /** The member as JSON value, for unrank's document (the same as the encoder's JSON text). */
  value(member: number[]): unknown;
}

/** What differs between the kinds' rank endpoints. */
interface RankedKind {
  readonly base: string;
  readonly schemas: { readonly list: z.ZodObject; readonly rank: z.ZodObject; readonly unrank: z.ZodObject };
  readonly docs: { readonly list: string; readonly rank: string; readonly unrank: string; readonly rankDetail: string; readonly order: string; readonly notAMember: string };
  /** The rank endpoint's member parameter, and the n it implies when n is left out. */
  readonly memberParam: string;
  sizeOf(member: readonly number[]): number;
  /** Member forms by `as` (the first is the default). */
  readonly forms: Readonly<Record<string, MemberForm>>;
  /** The canonical family of a query (its JSON is the cache key). */
  describe(query: FamilyQuery): object;
  /** The library's family object of a query. */
  familyOf(query: FamilyQuery): RankedSource;
  /** The most numbers one member can take in a response, in a form. */
  numbersPerMember(family: object, as: string): number;
}

const parts: MemberForm = { encoder: membersAsParts, value: (member) => member };
const sum = (member: readonly number[]) => member.reduce((a, b) => a + b, 0);

const PARTITIONS: RankedKind = {
  base: '/v1/partitions',
  schemas: { list: partitionsListQuery, rank: partitionsRankQuery, unrank: partitionsUnrankQuery },
  docs: {
    list: 'Every partition of n in a family, in order, each with its rank',
    rank: 'The rank of a partition in its family',
    unrank: 'The partition at a rank of its family',
    rankDetail: 'The position of the partition given by parts among the members of the family (n, which defaults to the sum of the parts, and the constraints), as a decimal string.',
    order: PARTITION_ORDER,
    notAMember: 'A list that is not a member — not listed largest first, not summing to n, or breaking a constraint — is answered with 422 naming parts.',
  },
  memberParam: 'parts',
  sizeOf: sum,
  forms: { parts, multiplicities: { encoder: membersAsMultiplicities, value: multiplicityPairs } },
  describe: (query) => partitionFamilyOf(query as never),
  familyOf: (query) => partitionsOf(query as never),
  numbersPerMember: (family, as) => partitionNumbers(family as PartitionFamily, as === 'multiplicities'),
};

const COMPOSITIONS: RankedKind = {
  base: '/v1/compositions',
  schemas: { list: compositionsListQuery, rank: compositionsRankQuery, unrank: compositionsUnrankQuery },
  docs: {
    list: 'Every composition of n in a family, in order, each with its rank',
    rank: 'The rank of a composition in its family',
    unrank: 'The composition at a rank of its family',
    rankDetail: 'The position of the composition given by parts among the members of the family (n, which defaults to the sum of the parts, and the constraints), as a decimal string.',
    order: COMPOSITION_ORDER,
    notAMember: 'A list that is not a member — not summing to n, or breaking a constraint — is answered with 422 naming parts.',
  },
  memberParam: 'parts',
  sizeOf: sum,
  forms: { parts },
  describe: (query) => compositionFamilyOf(query as never),
  familyOf: (query) => compositionsOf(query as never),
  numbersPerMember: (family) => compositionNumbers(family as CompositionFamily),
};

const SET_PARTITIONS: RankedKind = {
  base: '/v1/set-partitions',
  schemas: { list: setPartitionsListQuery, rank: setPartitionsRankQuery, unrank: setPartitionsUnrankQuery },
  docs: {
    list: 'Every set partition of n items in a family, in order, each with its rank',
    rank: 'The rank of a set partition in its family',
    unrank: 'The set partition at a rank of its family',
    rankDetail: 'The position of the set partition given by its restricted growth string rgs among the members of the family (n, which defaults to the length of rgs, and the constraints), as a decimal string.',
    order: SET_PARTITION_ORDER,
    notAMember: 'A string that is not a member — not a restricted growth string, of another length than n, or breaking a constraint — is answered with 422 naming rgs.',
  },
  memberParam: 'rgs',
  sizeOf: (rgs) => rgs.length,
  forms: { blocks: { encoder: membersAsBlocks, value: blocksOfValidRgs }, rgs: { encoder: membersAsRgs, value: (rgs) => rgs } },
  describe: (query) => setPartitionFamilyOf(query as never),
  familyOf: (query) => setPartitionsOf(query as never),
  // Every item once, in either form.
  numbersPerMember: (family) => Math.max(1, (family as SetPartitionFamily).n),
};

/** The library's family of a query, from the per-isolate cache of ranked families (bounded by their tables' bytes). */
function rankedFamily(kind: RankedKind, context: AppContext, query: FamilyQuery): RankedSource {
  return context.rankers.getOrCreate(JSON.stringify(kind.describe(query)), () => {
    const family = kind.familyOf(query);
    return { value: family, bytes: family.rankTableBytes };
  });
}

/** The ranker of a family of partitions, compositions or set partitions for a sampling query (the page's ranks). */
export function rankedFamilyOf(kind: 'partition' | 'composition' | 'set-partition', context: AppContext, query: FamilyQuery): RankedSource {
  return rankedFamily(kind === 'partition' ? PARTITIONS : kind === 'composition' ? COMPOSITIONS : SET_PARTITIONS, context, query);
}

function formOf(kind: RankedKind, as: unknown): MemberForm {
  return kind.forms[typeof as === 'string' ? as : Object.keys(kind.forms)[0]];
}

function rankEndpointsOf(kind: RankedKind): Endpoint[] {
  const listPath = `${kind.base}/list`;
  const rankPath = `${kind.base}/rank`;
  const unrankPath = `${kind.base}/unrank`;
  const list = defineEndpoint({
    path: listPath,
    summary: kind.docs.list,
    description: `Lists the members from rank start on (count of them), each with its rank. ${kind.docs.order} A listing is a pure function of the query: the same page always, on every runtime.`,
    query: kind.schemas.list,
    responses: LIST_RESPONSES,
    handle(request, query, context) {
      const family = rankedFamily(kind, context, query as FamilyQuery);
      const as = String(query.as);
      const job = { family, start: String(query.start), count: Number(query.count), format: query.format as 'json', encoder: formOf(kind, as).encoder, numbersPerMember: kind.numbersPerMember(family.description, as) };
      return respondWithListing(request, listPath, query, job, context.limits);
    },
  });
  const rank = defineEndpoint({
    path: rankPath,
    summary: kind.docs.rank,
    description: `${kind.docs.rankDetail} ${kind.docs.order} ${kind.docs.notAMember}`,
    query: kind.schemas.rank,
    responses: RANK_RESPONSES,
    handle(request, query, context) {
      const member = query[kind.memberParam] as number[];
      const family = rankedFamily(kind, context, { ...query, n: (query.n as number | undefined) ?? kind.sizeOf(member) });
      const rank = family.rank(member);
      return respondWithJson(request, rankPath, query, { family: family.description, [kind.memberParam]: member, rank: String(rank), total: String(family.ranker.count) });
    },
  });
  const unrank = defineEndpoint({
    path: unrankPath,
    summary: kind.docs.unrank,
    description: `The member of the family at position rank (a decimal string from 0 to the number of members - 1; past the end: 422 naming rank). ${kind.docs.order}`,
    query: kind.schemas.unrank,
    responses: RANK_RESPONSES,
    handle(request, query, context) {
      const family = rankedFamily(kind, context, query as FamilyQuery);
      const member = family.ranker.unrank(family.checkedRank(query.rank));
      const form = formOf(kind, query.as);
      return respondWithJson(request, unrankPath, query, { family: family.description, rank: query.rank, total: String(family.ranker.count), [form.encoder.field]: form.value(member) });
    },
  });
  return [list, rank, unrank] as unknown as Endpoint[];
}

/** Listing, rank and unrank of every kind of family. */
export const rankEndpoints: readonly Endpoint[] = [PARTITIONS, COMPOSITIONS, SET_PARTITIONS].flatMap(rankEndpointsOf);

/** [part, multiplicity] pairs of parts listed largest first. */
function multiplicityPairs(member: readonly number[]): number[][] {
  const { sizes, multiplicities } = runsOf(member);
  return sizes.map((size, i) => [size, multiplicities[i]]);
}

/** The most numbers one partition can take in a response: its parts, or two per distinct size. */
function partitionNumbers(family: PartitionFamily, multiplicities: boolean): number {
  const smallest = Math.max(1, family.minPart ?? 1, family.allowed?.[0] ?? 1);
  let count = Math.floor(family.n / smallest);
  if (family.length !== undefined) count = Math.min(count, family.length);
  if (family.maxLength !== undefined) count = Math.min(count, family.maxLength);
  if (family.distinct) count = Math.min(count, Math.floor(Math.sqrt(2 * family.n)));
  // Distinct sizes d of a partition of n satisfy d(d + 1)/2 <= n.
  return Math.max(1, multiplicities ? 2 * Math.min(count, Math.floor(Math.sqrt(2 * family.n))) : count);
}

/** The most parts one composition can have: the length, or n over the smallest part. */
function compositionNumbers(family: CompositionFamily): number {
  if (family.length !== undefined) return Math.max(1, family.length);
  const smallest = Math.max(1, family.minPart ?? 1, family.allowed?.[0] ?? 1);
  return Math.max(1, Math.floor(family.n / smallest));
}
