import { MAX_N, type PartitionFamily } from '../../family.js';
import { gcd } from '../../gcd.js';

/**
 * A constrained partition family after validation, in the form the counting and sampling code
 * works with: the allowed part sizes as an interval [lo, hi] or as an explicit sorted list (both
 * already cut to sizes <= n), plus the length constraint.
 *
 * Limits checked here (stated for the README):
 * - n: integer, 0 <= n <= 1e9 (MAX_N);
 * - minPart, maxPart: integers >= 1 (safe integers);
 * - length, maxLength: integers >= 0, not both;
 * - allowed: non-empty, at most 1000 distinct integers >= 1 (MAX_ALLOWED).
 */
export { MAX_N };
export const MAX_ALLOWED = 1000;

/** The sizes a part may take: an interval (hi may be < lo: no size) or an explicit list. */
export type SizeSet =
  | { readonly kind: 'interval'; readonly lo: number; readonly hi: number }
  | { readonly kind: 'list'; readonly values: readonly number[] };

export interface ConstrainedSpec {
  readonly n: number;
  readonly distinct: boolean;
  /** Allowed sizes, already intersected with [minPart, maxPart] and [1, n]. */
  readonly sizes: SizeSet;
  /** Exact number of parts, if given. */
  readonly length?: number;
  /** At most this many parts, if given (already cut to n). */
  readonly maxLength?: number;
  /** The family as the user gave it, for messages. */
  readonly family: PartitionFamily;
}

function checkInteger(name: string, value: unknown, min: number, max = Number.MAX_SAFE_INTEGER): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    const range = max === Number.MAX_SAFE_INTEGER ? `>= ${min}` : `in ${min}..${max}`;
    throw new RangeError(`${name} must be an integer ${range}, got ${String(value)}`);
  }
  return value;
}

/**
 * Throws a RangeError saying what is wrong when the family is malformed: bad n, bad bounds,
 * length together with maxLength, an empty or oversized allowed list.
 */
export function validatePartitionFamily(family: PartitionFamily): void {
  checkInteger('n', family.n, 0, MAX_N);
  if (family.minPart !== undefined) checkInteger('minPart', family.minPart, 1);
  if (family.maxPart !== undefined) checkInteger('maxPart', family.maxPart, 1);
  if (family.length !== undefined) checkInteger('length', family.length, 0);
  if (family.maxLength !== undefined) checkInteger('maxLength', family.maxLength, 0);
  if (family.length !== undefined && family.maxLength !== undefined) {
    throw new RangeError('give either length (exactly that many parts) or maxLength (at most that many), not both');
  }
  if (family.allowed !== undefined) {
    if (!Array.isArray(family.allowed) || family.allowed.length === 0) {
      throw new RangeError('allowed must list at least one part size');
    }
    for (const a of family.allowed) checkInteger('every allowed part size', a, 1);
    if (new Set(family.allowed).size > MAX_ALLOWED) {
      throw new RangeError(`allowed may list at most ${MAX_ALLOWED} distinct part sizes, got ${new Set(family.allowed).size}`);
    }
  }
}

/**
 * The reason the bounds contradict each other outright (minPart > maxPart, length > n), or null.
 * Planners throw it as a RangeError; counting answers 0 for such a family.
 */
export function contradiction(family: PartitionFamily): string | null {
  const { n, minPart, maxPart, length } = family;
  if (minPart !== undefined && maxPart !== undefined && minPart > maxPart) {
    return `minPart (${minPart}) is larger than maxPart (${maxPart})`;
  }
  if (length !== undefined && length > n) {
    return `a partition of ${n} has at most ${n} parts, but length is ${length}`;
  }
  return null;
}

/** Validates and normalises; the caller has already ruled out contradictions if it cares. */
export function toSpec(family: PartitionFamily): ConstrainedSpec {
  validatePartitionFamily(family);
  const n = family.n;
  const lo = family.minPart ?? 1;
  const hi = Math.min(family.maxPart ?? n, n);
  let sizes: SizeSet;
  if (family.allowed !== undefined) {
    const values = [...new Set(family.allowed)].filter((a) => a >= lo && a <= hi).sort((a, b) => a - b);
    sizes = { kind: 'list', values };
  } else {
    sizes = { kind: 'interval', lo, hi };
  }
  const spec: { -readonly [K in keyof ConstrainedSpec]: ConstrainedSpec[K] } = {
    n,
    distinct: family.distinct === true,
    sizes,
    family,
  };
  if (family.length !== undefined) spec.length = family.length;
  if (family.maxLength !== undefined) spec.maxLength = Math.min(family.maxLength, n);
  return spec;
}

/** Number of allowed sizes. */
export function sizeCount(sizes: SizeSet): number {
  return sizes.kind === 'list' ? sizes.values.length : Math.max(0, sizes.hi - sizes.lo + 1);
}

/** The allowed sizes ascending, as an array (callers keep this for small sets only). */
export function sizeList(sizes: SizeSet): number[] {
  if (sizes.kind === 'list') return sizes.values.slice();
  const out: number[] = [];
  for (let k = sizes.lo; k <= sizes.hi; k++) out.push(k);
  return out;
}

export function smallestSize(sizes: SizeSet): number {
  return sizes.kind === 'list' ? sizes.values[0] : sizes.lo;
}

export function largestSize(sizes: SizeSet): number {
  return sizes.kind === 'list' ? sizes.values[sizes.values.length - 1] : sizes.hi;
}

export { gcd };

/** gcd of the allowed sizes (1 for an interval of two or more sizes). */
export function sizeGcd(sizes: SizeSet): number {
  if (sizes.kind === 'interval') return sizes.hi > sizes.lo ? 1 : sizes.lo;
  let g = 0;
  for (const v of sizes.values) g = gcd(v, g);
  return g;
}

/** True when the family has no constraint at all (the plain partitions of n). */
export function isUnrestricted(spec: ConstrainedSpec): boolean {
  return (
    !spec.distinct &&
    spec.length === undefined &&
    (spec.maxLength === undefined || spec.maxLength >= spec.n) &&
    spec.sizes.kind === 'interval' &&
    spec.sizes.lo <= 1 &&
    spec.sizes.hi >= spec.n
  );
}

/**
 * "no partition of 7 has all parts in {2, 4}": the message for an empty family, naming every
 * constraint the user gave.
 */
export function emptyFamilyMessage(family: PartitionFamily): string {
  const clauses = familyClauses(family);
  const what = clauses.length === 0 ? 'exists' : `has ${clauses.join(' and ')}`;
  return `no partition of ${family.n} ${what}`;
}

/** The constraints the user gave, in words: "distinct parts", "all parts <= 9", "exactly 4 parts". */
export function familyClauses(family: PartitionFamily): string[] {
  const clauses: string[] = [];
  if (family.distinct) clauses.push('distinct parts');
  if (family.allowed !== undefined) {
    const list = [...new Set(family.allowed)].sort((a, b) => a - b);
    const shown = list.length > 12 ? `${list.slice(0, 12).join(', ')}, …` : list.join(', ');
    clauses.push(`all parts in {${shown}}`);
  }
  if (family.minPart !== undefined && family.maxPart !== undefined) {
    clauses.push(`all parts between ${family.minPart} and ${family.maxPart}`);
  } else if (family.minPart !== undefined) {
    clauses.push(`all parts >= ${family.minPart}`);
  } else if (family.maxPart !== undefined) {
    clauses.push(`all parts <= ${family.maxPart}`);
  }
  if (family.length !== undefined) clauses.push(`exactly ${family.length} part${family.length === 1 ? '' : 's'}`);
  if (family.maxLength !== undefined) clauses.push(`at most ${family.maxLength} part${family.maxLength === 1 ? '' : 's'}`);
  return clauses;
}
