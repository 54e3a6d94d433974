import { countCompositions, planCompositionSampler } from '../core/compositions/plan.js';
import { canonicalFamily, type CompositionFamily } from '../core/family.js';
import type { CompositionSampler } from '../core/sampler.js';
import type { CompositionsCountParams } from '../client/params.js';
import { compositionsCountQuery, type CompositionsCountQuery } from '../schemas/compositions.js';
import { isCompositionMember } from './membership.js';
import { FamilyBase, pickParams, type SampledFamily } from './sampled-family.js';
import { parseParam, parseParams } from './validate.js';

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

const COMPOSITION_PARAMS = ['n', 'minPart', 'maxPart', 'length', 'allowed'] as const;

/** The compositions of n with the given constraints; members are their parts in order. */
export class Compositions extends FamilyBase<number[], number[], CompositionSampler> implements SampledFamily<number[]> {
  readonly kind = 'composition';
  declare readonly description: CompositionFamily;
  protected readonly samplesPath = '/v1/compositions';
  protected readonly countPath = '/v1/compositions/count';
  protected readonly familyParams = COMPOSITION_PARAMS;

  /** From a query the count endpoint's schema has accepted, or a sampling endpoint's (only its family fields are kept). The HTTP app's way in; users call compositionFamily. */
  constructor(query: CompositionsCountQuery) {
    super(compositionFamilyOf(query), pickParams(query, COMPOSITION_PARAMS));
  }

  protected plan(): CompositionSampler {
    return planCompositionSampler(this.description);
  }

  protected countMembers(): bigint {
    return countCompositions(this.description);
  }

  protected member(parts: number[]): number[] {
    return parts;
  }

  contains(value: unknown): value is number[] {
    return isCompositionMember(this.description, value);
  }

  resize(n: number): Compositions {
    const size = parseParam(compositionsCountQuery.shape.n, n, 'n', this.countPath);
    return new Compositions({ ...(this.query as CompositionsCountQuery), n: size });
  }
}

/**
 * The compositions of `constraints.n` with the given constraints, checked by the schema of GET
 * /v1/compositions/count (the same rules and messages; PartsmithError when refused).
 */
export function compositionFamily(constraints: CompositionConstraints): Compositions {
  return new Compositions(parseParams(compositionsCountQuery, constraints, '/v1/compositions/count'));
}
