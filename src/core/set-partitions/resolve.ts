import { EmptyFamilyError } from '../errors.js';
import type { SetPartitionFamily } from '../family.js';

/**
 * The largest n (items) of a set-partition family. A sample is n numbers (its restricted growth
 * string, or its blocks' items), so n is bounded by what one response may hold (10^7 numbers
 * by default; see src/http/limits.ts); samplers are linear in n at every size.
 */
export const MAX_SET_PARTITION_N = 10_000_000;

/**
 * A set-partition family with its constraints made explicit: every member has between `kMin`
 * and `kMax` blocks, each of `minSize` to `maxSize` items. `fixed` says whether the number of
 * blocks is given exactly (kMin = kMax = blocks). maxSize >= n and kMax >= n mean "no bound".
 */
export interface ResolvedSetPartitions {
  readonly family: SetPartitionFamily;
  readonly n: number;
  readonly fixed: boolean;
  readonly kMin: number;
  readonly kMax: number;
  readonly minSize: number;
  readonly maxSize: number;
}

/** A constraint that contradicts n or another constraint; `param` is the parameter at fault. */
export class ContradictoryConstraintError extends RangeError {
  override readonly name = 'ContradictoryConstraintError';
  constructor(
    message: string,
    readonly param: keyof SetPartitionFamily,
  ) {
    super(message);
  }
}

function checkWhole(value: number | undefined, name: string, min: number, max: number): void {
  if (value === undefined) return;
  if (!Number.isSafeInteger(value) || value < min || value > max) {
    throw new ContradictoryConstraintError(`${name} must be a whole number from ${min} to ${max}, got ${value}`, name as keyof SetPartitionFamily);
  }
}

/**
 * The first contradiction in the family's parameters (malformed values, blocks > n,
 * minBlockSize > maxBlockSize, blocks with maxBlocks), or null. An empty family whose
 * parameters are each sensible (e.g. 3 blocks of at least 4 items from 10) is not a
 * contradiction: see emptinessReason.
 */
export function contradiction(family: SetPartitionFamily): ContradictoryConstraintError | null {
  try {
    checkWhole(family.n, 'n', 0, MAX_SET_PARTITION_N);
    checkWhole(family.blocks, 'blocks', 0, MAX_SET_PARTITION_N);
    checkWhole(family.maxBlocks, 'maxBlocks', 0, MAX_SET_PARTITION_N);
    checkWhole(family.minBlockSize, 'minBlockSize', 1, MAX_SET_PARTITION_N);
    checkWhole(family.maxBlockSize, 'maxBlockSize', 1, MAX_SET_PARTITION_N);
  } catch (error) {
    return error as ContradictoryConstraintError;
  }
  const { n, blocks, maxBlocks, minBlockSize, maxBlockSize } = family;
  if (blocks !== undefined && maxBlocks !== undefined) {
    return new ContradictoryConstraintError('maxBlocks cannot be combined with blocks: give one of them', 'maxBlocks');
  }
  if (blocks !== undefined && blocks > n) {
    return new ContradictoryConstraintError(`blocks = ${blocks} is more than the n = ${n} items: every block holds at least one item, so blocks must be at most ${n}`, 'blocks');
  }
  if (minBlockSize !== undefined && maxBlockSize !== undefined && minBlockSize > maxBlockSize) {
    return new ContradictoryConstraintError(`minBlockSize = ${minBlockSize} is more than maxBlockSize = ${maxBlockSize}: give minBlockSize <= maxBlockSize`, 'minBlockSize');
  }
  return null;
}

/**
 * The family with its bounds explicit. Throws ContradictoryConstraintError (a RangeError
 * naming the parameter) for contradictions; does not check emptiness.
 */
export function resolveSetPartitions(family: SetPartitionFamily): ResolvedSetPartitions {
  const reason = contradiction(family);
  if (reason) throw reason;
  const n = family.n;
  const fixed = family.blocks !== undefined;
  const minSize = family.minBlockSize ?? 1;
  const maxSize = Math.min(family.maxBlockSize ?? n, Math.max(n, 1)) || 1;
  const kMin = family.blocks ?? 0;
  const kMax = Math.min(family.blocks ?? family.maxBlocks ?? n, n);
  return { family, n, fixed, kMin, kMax, minSize, maxSize };
}

/**
 * The numbers of blocks a member can have: k blocks of minSize..maxSize items hold between
 * k·minSize and k·maxSize items, so k runs from ceil(n / maxSize) to floor(n / minSize),
 * intersected with the family's own range. Empty (lo > hi) exactly when the family is.
 */
export function blockRange(resolved: ResolvedSetPartitions): { lo: number; hi: number } {
  const { n, kMin, kMax, minSize, maxSize } = resolved;
  if (n === 0) return { lo: 0, hi: kMin === 0 ? 0 : -1 };
  return { lo: Math.max(kMin, 1, Math.ceil(n / maxSize)), hi: Math.min(kMax, Math.floor(n / minSize)) };
}

/** Why the family has no member (null when it has one): a closed form, no counting needed. */
export function emptinessReason(resolved: ResolvedSetPartitions): string | null {
  const { lo, hi } = blockRange(resolved);
  if (lo <= hi) return null;
  const { n, fixed, kMin, kMax, minSize, maxSize } = resolved;
  if (n === 0) return `the only set partition of 0 items has 0 blocks, not ${kMin}`;
  const sizes = `${minSize === maxSize ? `exactly ${minSize}` : maxSize >= n ? `at least ${minSize}` : `${minSize} to ${maxSize}`} items`;
  const possible = `blocks of ${sizes} split ${n} items into ${Math.ceil(n / maxSize)} to ${Math.floor(n / minSize)} blocks`;
  if (Math.ceil(n / maxSize) > Math.floor(n / minSize)) return `no set partition of ${n} items has every block of ${sizes}`;
  const asked = fixed ? `exactly ${kMin}` : `at most ${kMax}`;
  return `no set partition of ${n} items has ${asked} blocks of ${sizes} (${possible})`;
}

/** Throws EmptyFamilyError with the reason when the family has no member. */
export function assertNotEmpty(resolved: ResolvedSetPartitions): void {
  const reason = emptinessReason(resolved);
  if (reason !== null) throw new EmptyFamilyError(reason);
}

/** Whether the family is every set partition of n (no effective constraint). */
export function isFree(resolved: ResolvedSetPartitions): boolean {
  return !resolved.fixed && resolved.kMax >= resolved.n && resolved.minSize === 1 && resolved.maxSize >= resolved.n;
}
