import { countCompositions, planCompositionSampler } from '../core/compositions/plan.js';
import { canonicalFamily, type CompositionFamily } from '../core/family.js';
import { compositionRanker, compositionRankTableSize } from '../core/ranks/composition-ranker.js';
import type { CompositionSampler } from '../core/sampler.js';
import type { CompositionsCountParams } from '../client/params.js';
import { compositionsCountQuery, type CompositionsCountQuery } from '../schemas/compositions.js';
import { isCompositionMember } from './membership.js';
import { LibraryFamily, type FamilyKind } from './sampled-family.js';
import { parseParams } from './validate.js';

/** The constraints of a composition family: n and the parameters of GET /v1/compositions/count, typed from its schema. */
export type CompositionConstraints = CompositionsCountParams;

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

/** The compositions of n with given constraints; members are their parts in order. */
export type Compositions = LibraryFamily<CompositionFamily, number[], CompositionSampler>;

const COMPOSITIONS: FamilyKind<CompositionFamily, number[], CompositionSampler> = {
  kind: 'composition',
  samplesPath: '/v1/compositions',
  countPath: '/v1/compositions/count',
  params: ['n', 'minPart', 'maxPart', 'length', 'allowed'],
  nField: compositionsCountQuery.shape.n,
  describe: (query) => compositionFamilyOf(query as CompositionsCountQuery),
  plan: planCompositionSampler,
  count: countCompositions,
  member: (parts) => parts,
  contains: isCompositionMember,
  memberParam: 'parts',
  rankTable: (family) => ({ ranker: compositionRanker(family), bytes: compositionRankTableSize(family).bytes }),
  toRanked: (parts) => parts as readonly number[],
  fromRanked: (parts) => parts,
};

/** The family of a query its schema has accepted (the HTTP app's way in; users call compositionFamily). */
export function compositionsOf(query: CompositionsCountQuery): Compositions {
  return new LibraryFamily(COMPOSITIONS, query);
}

/**
 * The compositions of `constraints.n` with the given constraints, checked by the schema of GET
 * /v1/compositions/count (the same rules and messages; PartsmithError when refused).
 */
export function compositionFamily(constraints: CompositionConstraints): Compositions {
  return compositionsOf(parseParams(compositionsCountQuery, constraints, COMPOSITIONS.countPath));
}
