import { differenceGcd, emptyFamily, gcd, normalisedSet, type PartSet, type ResolvedCompositions } from './resolve.js';

/**
 * A composition family brought to a canonical core problem by two bijections:
 *  - scaling: if every part is a multiple of d, compositions of n are d times compositions of n/d;
 *  - shifting (exact length k only): subtracting s from each of the k parts maps compositions
 *    of n with parts in S onto compositions of n - k*s with parts in S - s (stars and bars when
 *    S - s = [0, L]).
 * A member of the original family is `shift + scale * v` for each core part v.
 */
export interface FreeCore {
  readonly kind: 'free';
  /** Core size: compositions of n with parts in `parts`, any number of parts. */
  readonly n: number;
  /** Core parts: >= 1, gcd 1 (or exactly {1}). */
  readonly parts: PartSet;
  readonly scale: number;
}

export interface FixedCore {
  readonly kind: 'fixed';
  /** Core size: compositions of n into exactly k parts from `parts`. */
  readonly n: number;
  readonly k: number;
  /** Core parts: smallest member 0; gcd of members 1 (or exactly {0}). */
  readonly parts: PartSet;
  readonly shift: number;
  readonly scale: number;
}

function scaled(set: PartSet, shift: number, scale: number): PartSet {
  if (set.kind === 'range') {
    return set.min === set.max ? { kind: 'range', min: 0, max: 0 } : { kind: 'range', min: set.min - shift, max: set.max - shift };
  }
  return normalisedSet(set.values.map((v) => (v - shift) / scale));
}

/** The core problem of a family without a length; throws EmptyFamilyError when n is out of reach of the gcd. */
export function freeCore(family: ResolvedCompositions): FreeCore {
  const set = family.parts;
  const d = set.kind === 'range' ? (set.min === set.max ? set.min : 1) : set.values.reduce((g, v) => gcd(g, v), 0);
  if (family.n % d !== 0) throw emptyFamily(family, `every such composition sums to a multiple of ${d}`);
  if (set.kind === 'range' && set.min === set.max) return { kind: 'free', n: family.n / d, parts: { kind: 'range', min: 1, max: 1 }, scale: d };
  return { kind: 'free', n: family.n / d, parts: d === 1 ? set : scaled(set, 0, d), scale: d };
}

/** The core problem of a family with a length k >= 1. */
export function fixedCore(family: ResolvedCompositions): FixedCore {
  const k = family.length!;
  const set = family.parts;
  const shift = set.kind === 'range' ? set.min : set.values[0];
  const rest = family.n - k * shift;
  const d = differenceGcd(set);
  if (d === 0) {
    if (rest !== 0) throw emptyFamily(family);
    return { kind: 'fixed', n: 0, k, parts: { kind: 'range', min: 0, max: 0 }, shift, scale: 1 };
  }
  if (rest % d !== 0) {
    throw emptyFamily(family, `every such composition of ${k} parts sums to ${k * shift} plus a multiple of ${d}`);
  }
  return { kind: 'fixed', n: rest / d, k, parts: scaled(set, shift, d), shift, scale: d };
}
