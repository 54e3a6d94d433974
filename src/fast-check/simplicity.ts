import { rgsOf } from './shrink-set-partitions.js';

/**
 * The order shrinking descends for partitions and compositions: a member is simpler than another
 * when, compared in turn, it has
 *   1. a smaller n (only when n ranges),
 *   2. fewer parts,
 *   3. fewer distinct part sizes,
 *   4. a smaller largest part,
 *   5. and then comes earlier in the family's documented order: parts as written (largest first
 *      for partitions, in order for compositions), members in reverse lexicographic order, so
 *      the lexicographically larger one is simpler (towards rank 0).
 * It is a strict total order on the members of a family of one n, and n is bounded below, so
 * any chain of ever simpler members is finite: shrinking always ends.
 */
export function simpler(a: readonly number[], b: readonly number[]): boolean {
  return compareSimplicity(a, b) < 0;
}

/** Negative when a is simpler than b, positive when b is simpler, 0 when equal. */
export function compareSimplicity(a: readonly number[], b: readonly number[]): number {
  const sa = summary(a);
  const sb = summary(b);
  if (sa.n !== sb.n) return sa.n - sb.n;
  if (a.length !== b.length) return a.length - b.length;
  if (sa.distinct !== sb.distinct) return sa.distinct - sb.distinct;
  if (sa.max !== sb.max) return sa.max - sb.max;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return b[i] - a[i]; // lexicographically larger first
  return 0;
}

function summary(parts: readonly number[]): { n: number; distinct: number; max: number } {
  let n = 0;
  let max = 0;
  const sizes = new Set<number>();
  for (const p of parts) {
    n += p;
    if (p > max) max = p;
    sizes.add(p);
  }
  return { n, distinct: sizes.size, max };
}

/**
 * The order set partitions shrink down (members as their blocks): a set partition is simpler
 * than another when, compared in turn, it has
 *   1. fewer items (a smaller n, only when n ranges),
 *   2. fewer blocks,
 *   3. and then comes earlier in the family's documented order: the lexicographic order of the
 *      restricted growth strings (towards rank 0: one large block first, then the next).
 * A strict total order on the set partitions of n items; n is bounded below, so shrinking ends.
 */
export function simplerSetPartition(a: readonly (readonly number[])[], b: readonly (readonly number[])[]): boolean {
  return compareSetPartitions(a, b) < 0;
}

/** Negative when a is simpler than b, positive when b is simpler, 0 when equal. */
export function compareSetPartitions(a: readonly (readonly number[])[], b: readonly (readonly number[])[]): number {
  const na = itemsOf(a);
  const nb = itemsOf(b);
  if (na !== nb) return na - nb;
  if (a.length !== b.length) return a.length - b.length;
  const ra = rgsOf(a);
  const rb = rgsOf(b);
  for (let i = 0; i < ra.length; i++) if (ra[i] !== rb[i]) return ra[i] - rb[i];
  return 0;
}

function itemsOf(blocks: readonly (readonly number[])[]): number {
  let n = 0;
  for (const block of blocks) n += block.length;
  return n;
}
