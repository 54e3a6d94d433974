/**
 * partsmith/fast-check: arbitraries of partitions, compositions and set partitions for
 * fast-check (an optional peer dependency: install fast-check to use this entry).
 *
 * ```ts
 * import fc from 'fast-check';
 * import { partitionArb } from 'partsmith/fast-check';
 *
 * fc.assert(fc.property(partitionArb({ n: { min: 0, max: 60 }, maxPart: 20 }), (parts) => ...));
 * ```
 *
 * Values are members of the family, exactly uniform at each n (sample `index` of a seed, the
 * index drawn by fast-check); shrinking proposes only members, each strictly simpler
 * (simplicity.ts). See ArbitraryOptions for how n is drawn across a range and for edge cases.
 * A failure's report names the member's (seed, index) and its rank in its family.
 */
import { compositionFamily, type CompositionConstraints } from '../library/compositions.js';
import { partitionFamily, type PartitionConstraints } from '../library/partitions.js';
import type { SampledFamily } from '../library/sampled-family.js';
import { setPartitionFamily, type SetPartitionConstraints, type SetPartitions } from '../library/set-partitions.js';
import { invalidParam, parseParam } from '../library/validate.js';
import { countFields } from '../schemas/common.js';
import { setPartitionsCountQuery } from '../schemas/set-partitions.js';
import { compositionCorners, partitionCorners, setPartitionCorners } from './corners.js';
import { FamilyArbitrary, type ArbitraryOptions, type MemberShape } from './family-arbitrary.js';
import { compositionShrinks } from './shrink-compositions.js';
import { partitionShrinks } from './shrink-partitions.js';
import { setPartitionShrinks } from './shrink-set-partitions.js';
import { simpler, simplerSetPartition } from './simplicity.js';

export { FamilyArbitrary, MAX_WEIGHTED_SIZES, type ArbitraryOptions, type MemberShape, type NWeights } from './family-arbitrary.js';
export { compareSetPartitions, compareSimplicity, simpler, simplerSetPartition } from './simplicity.js';

/** n as a number, or a range of n (both ends included). */
export type SizeOrRange = number | { readonly min: number; readonly max: number };

export type PartitionArbConstraints = Omit<PartitionConstraints, 'n'> & { readonly n: SizeOrRange };
export type CompositionArbConstraints = Omit<CompositionConstraints, 'n'> & { readonly n: SizeOrRange };
export type SetPartitionArbConstraints = Omit<SetPartitionConstraints, 'n'> & { readonly n: SizeOrRange };

const sumOf = (member: readonly number[]) => member.reduce((a, b) => a + b, 0);

const PARTITION_SHAPE: MemberShape = {
  shrinks: partitionShrinks,
  simpler,
  sizeOf: sumOf,
  corners: (family) => partitionCorners((family as ReturnType<typeof partitionFamily>).description),
};

const COMPOSITION_SHAPE: MemberShape = {
  shrinks: compositionShrinks,
  simpler,
  sizeOf: sumOf,
  corners: (family) => compositionCorners((family as ReturnType<typeof compositionFamily>).description),
};

const SET_PARTITION_SHAPE: MemberShape<number[][]> = {
  shrinks: setPartitionShrinks,
  simpler: simplerSetPartition,
  sizeOf: (blocks) => blocks.reduce((items, block) => items + block.length, 0),
  corners: (family) => setPartitionCorners((family as SetPartitions).description),
};

/** Partitions (parts largest first) of n, or of every n in a range, with the API's constraints. */
export function partitionArb(constraints: PartitionArbConstraints, options?: ArbitraryOptions): FamilyArbitrary {
  const { n, ...rest } = constraints;
  const { min, max } = sizeRange(n, '/v1/partitions/count');
  return new FamilyArbitrary(partitionFamily({ ...rest, n: min } as PartitionConstraints), min, max, PARTITION_SHAPE, options);
}

/** Compositions (parts in order) of n, or of every n in a range, with the API's constraints. */
export function compositionArb(constraints: CompositionArbConstraints, options?: ArbitraryOptions): FamilyArbitrary {
  const { n, ...rest } = constraints;
  const { min, max } = sizeRange(n, '/v1/compositions/count');
  return new FamilyArbitrary(compositionFamily({ ...rest, n: min } as CompositionConstraints), min, max, COMPOSITION_SHAPE, options);
}

/**
 * Set partitions of the items 1..n (members as blocks: each block's items increasing, blocks
 * ordered by their smallest item), n a number or a range, with the API's constraints. Shrinking
 * goes to fewer items, then fewer blocks, then towards the first member of the order of
 * restricted growth strings (simplerSetPartition), every candidate a member.
 */
export function setPartitionArb(constraints: SetPartitionArbConstraints, options?: ArbitraryOptions): FamilyArbitrary<number[][]> {
  const { n, ...rest } = constraints;
  const { min, max } = sizeRange(n, '/v1/set-partitions/count', setPartitionsCountQuery.shape.n);
  return new FamilyArbitrary(setPartitionFamily({ ...rest, n: min } as SetPartitionConstraints), min, max, SET_PARTITION_SHAPE, options);
}

/** A family object of any kind as an arbitrary (for kinds added later), with its own shape. */
export function familyArb<M extends object>(family: SampledFamily<M>, range: { min: number; max: number }, shape: MemberShape<M>, options?: ArbitraryOptions): FamilyArbitrary<M> {
  const first = family.resize(range.min);
  const last = family.resize(range.max); // checks max like n
  if (first.n > last.n) throw invalidParam('n.max', `must be at least n.min (${first.n})`, 'partsmith/fast-check', range.max);
  return new FamilyArbitrary(first, first.n, last.n, shape, options);
}

/** n, or n.min and n.max, each checked by the count endpoint's n field (partitions and compositions share one; set partitions count items). */
function sizeRange(n: SizeOrRange, path: string, field: typeof countFields.n = countFields.n): { min: number; max: number } {
  if (typeof n === 'object' && n !== null) {
    const min = parseParam(field, n.min, 'n.min', path);
    const max = parseParam(field, n.max, 'n.max', path);
    if (min > max) throw invalidParam('n.max', `must be at least n.min (${min})`, path, n.max);
    return { min, max };
  }
  const size = parseParam(field, n, 'n', path);
  return { min: size, max: size };
}
