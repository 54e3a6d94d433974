import type { CompositionFamily, PartitionFamily, SetPartitionFamily } from '../core/family.js';

/**
 * Whether a value is a member of a family, written as the library writes members: a partition
 * as its parts, largest first; a composition as its parts in order; a set partition as its
 * blocks. Each check is one pass over the parts or items (plus a binary search per part for an
 * `allowed` list).
 */

function isPart(part: unknown, min: number, max: number | undefined, allowed: readonly number[] | undefined): part is number {
  if (typeof part !== 'number' || !Number.isSafeInteger(part) || part < min) return false;
  if (max !== undefined && part > max) return false;
  return allowed === undefined || includesSorted(allowed, part);
}

function includesSorted(sorted: readonly number[], value: number): boolean {
  let lo = 0;
  let hi = sorted.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] === value) return true;
    if (sorted[mid] < value) lo = mid + 1;
    else hi = mid - 1;
  }
  return false;
}

/** A partition of the family: parts largest first (strictly decreasing when distinct), every constraint met. */
export function isPartitionMember(family: PartitionFamily, value: unknown): value is number[] {
  if (!Array.isArray(value)) return false;
  if (family.length !== undefined && value.length !== family.length) return false;
  if (family.maxLength !== undefined && value.length > family.maxLength) return false;
  let sum = 0;
  for (let i = 0; i < value.length; i++) {
    const part: unknown = value[i];
    if (!isPart(part, family.minPart ?? 1, family.maxPart, family.allowed)) return false;
    if (i > 0 && (family.distinct ? part >= value[i - 1] : part > value[i - 1])) return false;
    sum += part;
    if (sum > family.n) return false;
  }
  return sum === family.n;
}

/** A composition of the family: parts in order, each within the bounds and the allowed sizes. */
export function isCompositionMember(family: CompositionFamily, value: unknown): value is number[] {
  if (!Array.isArray(value)) return false;
  if (family.length !== undefined && value.length !== family.length) return false;
  let sum = 0;
  for (const part of value as unknown[]) {
    if (!isPart(part, family.minPart ?? 1, family.maxPart, family.allowed)) return false;
    sum += part;
    if (sum > family.n) return false;
  }
  return sum === family.n;
}

/**
 * A set partition of the family, written as the library writes it: its blocks, each a list of
 * items in increasing order, blocks ordered by their smallest item, every item 1..n in exactly
 * one block; the number and sizes of the blocks within the constraints. One pass over the items.
 */
export function isSetPartitionMember(family: SetPartitionFamily, value: unknown): value is number[][] {
  if (!Array.isArray(value)) return false;
  const k = value.length;
  if (family.blocks !== undefined && k !== family.blocks) return false;
  if (family.maxBlocks !== undefined && k > family.maxBlocks) return false;
  const n = family.n;
  const seen = new Uint8Array(n + 1);
  let items = 0;
  let previousFirst = 0;
  for (const block of value as unknown[]) {
    if (!Array.isArray(block) || block.length === 0) return false;
    if (block.length < (family.minBlockSize ?? 1) || block.length > (family.maxBlockSize ?? n)) return false;
    let previous = 0;
    for (const item of block as unknown[]) {
      if (typeof item !== 'number' || !Number.isInteger(item) || item <= previous || item > n || seen[item] === 1) return false;
      seen[item] = 1;
      previous = item;
    }
    if (block[0] <= previousFirst) return false;
    previousFirst = block[0];
    items += block.length;
  }
  return items === n;
}
