/**
 * partsmith/fast-check: arbitraries of partitions and compositions for fast-check (an optional
 * peer dependency: install fast-check to use this entry).
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
 */
import { compositionFamily, type CompositionConstraints } from '../library/compositions.js';
import { partitionFamily, type PartitionConstraints } from '../library/partitions.js';
import type { SampledFamily } from '../library/sampled-family.js';
import { invalidParam, parseParam } from '../library/validate.js';
import { countFields } from '../schemas/common.js';
import { compositionCorners, partitionCorners } from './corners.js';
import { FamilyArbitrary, type ArbitraryOptions, type MemberShape } from './family-arbitrary.js';
import { compositionShrinks } from './shrink-compositions.js';
import { partitionShrinks } from './shrink-partitions.js';
import { simpler } from './simplicity.js';

export { FamilyArbitrary, MAX_WEIGHTED_SIZES, type ArbitraryOptions, type MemberShape, type NWeights } from './family-arbitrary.js';
export { compareSimplicity, simpler } from './simplicity.js';

/** n as a number, or a range of n (both ends included). */
export type SizeOrRange = number | { readonly min: number; readonly max: number };

export type PartitionArbConstraints = Omit<PartitionConstraints, 'n'> & { readonly n: SizeOrRange };
export type CompositionArbConstraints = Omit<CompositionConstraints, 'n'> & { readonly n: SizeOrRange };

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

/** A family object of any kind as an arbitrary (for kinds added later), with its own shape. */
export function familyArb(family: SampledFamily<number[]>, range: { min: number; max: number }, shape: MemberShape, options?: ArbitraryOptions): FamilyArbitrary {
  const first = family.resize(range.min);
  const last = family.resize(range.max); // checks max like n
  if (first.n > last.n) throw invalidParam('n.max', `must be at least n.min (${first.n})`, 'partsmith/fast-check', range.max);
  return new FamilyArbitrary(first, first.n, last.n, shape, options);
}

/** n, or n.min and n.max, each checked by the count endpoints' n field (the same field for both kinds). */
function sizeRange(n: SizeOrRange, path: string): { min: number; max: number } {
  if (typeof n === 'object' && n !== null) {
    const min = parseParam(countFields.n, n.min, 'n.min', path);
    const max = parseParam(countFields.n, n.max, 'n.max', path);
    if (min > max) throw invalidParam('n.max', `must be at least n.min (${min})`, path, n.max);
    return { min, max };
  }
  const size = parseParam(countFields.n, n, 'n', path);
  return { min: size, max: size };
}
