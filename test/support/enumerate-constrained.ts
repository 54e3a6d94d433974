import type { PartitionFamily } from '../../src/core/family.js';
import { partsOf, type Partition } from '../../src/core/partition.js';
import { enumeratePartitions } from './enumerate-partitions.js';

/**
 * Brute force, independent of the library's counting code: every partition of n as a list of
 * parts, largest first (plain recursion on the largest part), filtered by the family's
 * constraints read straight from their definitions. For n <= ~45 (p(45) = 89134, OEIS A000041).
 */
export const allPartitions = enumeratePartitions;

/** Does a list of parts belong to the family? */
export function satisfies(parts: readonly number[], family: PartitionFamily): boolean {
  let sum = 0;
  for (const p of parts) sum += p;
  if (sum !== family.n) return false;
  if (family.distinct && new Set(parts).size !== parts.length) return false;
  if (family.minPart !== undefined && parts.some((p) => p < family.minPart!)) return false;
  if (family.maxPart !== undefined && parts.some((p) => p > family.maxPart!)) return false;
  if (family.length !== undefined && parts.length !== family.length) return false;
  if (family.maxLength !== undefined && parts.length > family.maxLength) return false;
  if (family.allowed !== undefined && parts.some((p) => !family.allowed!.includes(p))) return false;
  return true;
}

/** The members of the family, each as a key "5,3,3,1". */
export function enumerateFamily(family: PartitionFamily): string[] {
  return allPartitions(family.n)
    .filter((parts) => satisfies(parts, family))
    .map((parts) => parts.join(','));
}

/** The key of a sampled partition (parts largest first). */
export function partitionKey(partition: Partition): string {
  return partsOf(partition).join(',');
}

/** Multiplicity form is well formed: sizes strictly decreasing, multiplicities positive integers. */
export function wellFormed(partition: Partition): boolean {
  const { sizes, multiplicities } = partition;
  if (sizes.length !== multiplicities.length) return false;
  for (let i = 0; i < sizes.length; i++) {
    if (!Number.isInteger(sizes[i]) || sizes[i] < 1) return false;
    if (!Number.isInteger(multiplicities[i]) || multiplicities[i] < 1) return false;
    if (i > 0 && sizes[i] >= sizes[i - 1]) return false;
  }
  return true;
}
