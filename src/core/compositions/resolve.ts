import { EmptyFamilyError } from '../errors.js';
import { MAX_N, type CompositionFamily } from '../family.js';
import { gcd } from '../gcd.js';

/** Largest n (and length) partsmith accepts for compositions. */
export const MAX_COMPOSITION_N = MAX_N;

/**
 * The set a part may take: a contiguous range [min, max] or an explicit ascending list.
 * A contiguous list is stored as a range (cheaper to count and sample).
 */
export type PartSet =
  | { readonly kind: 'range'; readonly min: number; readonly max: number }
  | { readonly kind: 'list'; readonly values: readonly number[] };

/**
 * A validated composition family: n, optional exact length, and the allowed part sizes with
 * every bound made explicit and capped at the largest part a member could have.
 * `describe` is the family in words, for error messages.
 */
export interface ResolvedCompositions {
  readonly n: number;
  readonly length: number | undefined;
  readonly parts: PartSet;
  readonly describe: string;
}

function checkInteger(name: string, value: unknown, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw new RangeError(`${name} must be an integer from ${min} to ${max}, got ${String(value)}`);
  }
  return value;
}

export { gcd };

/** Smallest and largest member of a part set. */
export function partBounds(set: PartSet): { min: number; max: number } {
  return set.kind === 'range'
    ? { min: set.min, max: set.max }
    : { min: set.values[0], max: set.values[set.values.length - 1] };
}

/** The members of a part set (only for small sets: lists, or short ranges). */
export function partValues(set: PartSet): number[] {
  if (set.kind === 'list') return [...set.values];
  const out: number[] = [];
  for (let v = set.min; v <= set.max; v++) out.push(v);
  return out;
}

/** Number of members of a part set. */
export function partCount(set: PartSet): number {
  return set.kind === 'range' ? set.max - set.min + 1 : set.values.length;
}

/** A list as a range when it is contiguous, otherwise the list itself. */
export function normalisedSet(values: readonly number[]): PartSet {
  const first = values[0];
  const last = values[values.length - 1];
  if (last - first + 1 === values.length) return { kind: 'range', min: first, max: last };
  return { kind: 'list', values: [...values] };
}

/** gcd of the differences between members (0 for a single value). */
export function differenceGcd(set: PartSet): number {
  if (set.kind === 'range') return set.max > set.min ? 1 : 0;
  let g = 0;
  for (const v of set.values) g = gcd(g, v - set.values[0]);
  return g;
}

function describeParts(family: CompositionFamily): string {
  const bits: string[] = [];
  if (family.allowed !== undefined) bits.push(`all parts in {${family.allowed.join(', ')}}`);
  const min = family.minPart ?? 1;
  if (family.maxPart !== undefined && family.allowed !== undefined && family.minPart === undefined) bits.push(`all parts <= ${family.maxPart}`);
  else if (family.maxPart !== undefined) bits.push(`all parts between ${min} and ${family.maxPart}`);
  else if (family.minPart !== undefined || bits.length === 0) bits.push(`all parts >= ${min}`);
  return bits.join(' and ');
}

/** "no composition of 7 into 3 parts has all parts in {2, 4}" and the like. */
function describe(family: CompositionFamily): string {
  const into = family.length === undefined ? '' : ` into ${family.length} part${family.length === 1 ? '' : 's'}`;
  return `composition of ${family.n}${into} has ${describeParts(family)}`;
}

/** The EmptyFamilyError for a resolved family, with an optional reason. */
export function emptyFamily(resolved: ResolvedCompositions, reason?: string): EmptyFamilyError {
  return new EmptyFamilyError(`no ${resolved.describe}${reason ? ` (${reason})` : ''}`);
}

/**
 * Validates a composition family and makes its part set explicit. Throws RangeError for
 * malformed or contradictory parameters and EmptyFamilyError when the bounds alone show the
 * family has no member; finer emptiness (e.g. parts {2, 4} and n = 7) is found by the counters
 * and planners.
 */
export function resolveCompositions(family: CompositionFamily): ResolvedCompositions {
  const n = checkInteger('n', family.n, 0, MAX_COMPOSITION_N);
  const length = family.length === undefined ? undefined : checkInteger('length', family.length, 0, MAX_COMPOSITION_N);
  const minPartGiven = family.minPart === undefined ? 1 : checkInteger('minPart', family.minPart, 0, MAX_COMPOSITION_N);
  const maxPart = family.maxPart === undefined ? undefined : checkInteger('maxPart', family.maxPart, 0, MAX_COMPOSITION_N);
  if (maxPart !== undefined && maxPart < minPartGiven) {
    throw new RangeError(`minPart (${minPartGiven}) is greater than maxPart (${maxPart})`);
  }
  let allowed: number[] | undefined;
  if (family.allowed !== undefined) {
    if (!Array.isArray(family.allowed) || family.allowed.length === 0) {
      throw new RangeError('allowed must list at least one part size');
    }
    for (const v of family.allowed) checkInteger('every allowed part size', v, 0, MAX_COMPOSITION_N);
    allowed = [...new Set(family.allowed)].sort((a, b) => a - b);
  }
  if (length === undefined && (minPartGiven === 0 || allowed?.[0] === 0)) {
    throw new RangeError(
      'parts of size 0 (minPart = 0 or 0 in allowed) need length: without a fixed number of parts a composition could hold any number of empty parts',
    );
  }
  // An explicit list is not filtered by the default minPart (a 0 in it means empty parts are wanted).
  const minPart = family.minPart === undefined && allowed !== undefined ? 0 : minPartGiven;
  const text = describe({ ...family, allowed });
  const base = { n, length, describe: text };

  // Largest part any member could have: n itself, less the smallest possible other parts.
  const low = Math.max(minPart, allowed?.[0] ?? 0);
  const cap = length === undefined ? n : length === 0 ? 0 : n - (length - 1) * low;
  const hi = Math.min(maxPart ?? Infinity, cap);

  let parts: PartSet;
  if (allowed !== undefined) {
    let values = allowed.filter((v) => v >= minPart && (maxPart === undefined || v <= maxPart));
    // The empty composition of 0 has no part, so it belongs even when no size is allowed; its
    // family keeps the given list (no part is ever drawn from it).
    if (values.length === 0 && n === 0 && (length ?? 0) === 0) values = allowed;
    if (values.length === 0) {
      throw new EmptyFamilyError(`no part size is both in {${allowed.join(', ')}} and between ${minPart} and ${maxPart ?? 'n'}`);
    }
    const usable = values.filter((v) => v <= Math.max(hi, values[0]));
    parts = normalisedSet(usable);
  } else {
    parts = { kind: 'range', min: minPart, max: Math.max(minPart, Math.min(maxPart ?? Infinity, Math.max(cap, minPart))) };
  }
  const resolved: ResolvedCompositions = { ...base, parts };

  // Bounds-only emptiness (the empty composition of 0 belongs to every family without length).
  const { min, max } = partBounds(parts);
  if (length === undefined) {
    if (n > 0 && min > n) throw emptyFamily(resolved, `the smallest allowed part ${min} exceeds ${n}`);
  } else if (length === 0) {
    if (n > 0) throw emptyFamily(resolved, 'only the empty composition has 0 parts, and it sums to 0');
  } else {
    if (length * min > n) throw emptyFamily(resolved, `the smallest possible sum is ${length * min}`);
    if (length * max < n) throw emptyFamily(resolved, `the largest possible sum is ${length * max}`);
  }
  return resolved;
}
