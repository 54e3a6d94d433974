import { partitionFromCounts, type Partition } from '../../partition.js';

/**
 * Bijections on partitions used to carry one family onto another (Andrews, "The Theory of
 * Partitions", 1976, ch. 1): conjugation (transpose the Ferrers diagram), adding a constant to
 * every part, and adding the staircase (k-1, k-2, ..., 0) to a partition with k parts.
 */

/**
 * The conjugate partition, in multiplicity form, in O(number of distinct sizes). With sizes
 * s_1 > ... > s_d and multiplicities m_i, the conjugate has part M_i = m_1 + ... + m_i with
 * multiplicity s_i - s_{i+1} (s_{d+1} = 0). Conjugation maps "at most k parts" to "parts <= k"
 * and "exactly k parts" to "largest part exactly k".
 */
export function conjugate(partition: Partition): Partition {
  const { sizes, multiplicities } = partition;
  const d = sizes.length;
  const outSizes: number[] = [];
  const outMult: number[] = [];
  let cumulative = 0;
  const cum: number[] = new Array(d);
  for (let i = 0; i < d; i++) {
    cumulative += multiplicities[i];
    cum[i] = cumulative;
  }
  // Largest conjugate part first: M_d with multiplicity s_d, then M_{d-1}, ...
  for (let i = d - 1; i >= 0; i--) {
    const gap = sizes[i] - (i + 1 < d ? sizes[i + 1] : 0);
    if (gap > 0) {
      outSizes.push(cum[i]);
      outMult.push(gap);
    }
  }
  return { sizes: outSizes, multiplicities: outMult };
}

/** Adds c to every part (c >= 0): exactly-k-part partitions of m to those of m + k*c with parts > c. */
export function shiftParts(partition: Partition, c: number): Partition {
  if (c === 0) return partition;
  return { sizes: partition.sizes.map((s) => s + c), multiplicities: partition.multiplicities.slice() };
}

/** Adds one part of size s. */
export function addPart(partition: Partition, s: number): Partition {
  const counts = new Map<number, number>();
  for (let i = 0; i < partition.sizes.length; i++) counts.set(partition.sizes[i], partition.multiplicities[i]);
  counts.set(s, (counts.get(s) ?? 0) + 1);
  return partitionFromCounts(counts);
}

/**
 * Adds the staircase (k-1, k-2, ..., 1, 0) to a partition with exactly k parts, largest part
 * getting k-1: a bijection from partitions of m into k parts onto partitions of m + k(k-1)/2
 * into k distinct parts (Andrews 1976, §1.3). Costs O(k).
 */
export function addStaircase(partition: Partition): Partition {
  const { sizes, multiplicities } = partition;
  let k = 0;
  for (const m of multiplicities) k += m;
  const outSizes: number[] = [];
  let rank = k - 1;
  for (let i = 0; i < sizes.length; i++) {
    for (let j = 0; j < multiplicities[i]; j++) outSizes.push(sizes[i] + rank--);
  }
  return { sizes: outSizes, multiplicities: outSizes.map(() => 1) };
}
