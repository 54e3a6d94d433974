/**
 * The additions of countsByParts (bounded-count-tables.ts) for parts in [a, b] up to size end,
 * 2 Σ_{j=1}^{J} (min(jb, end) − ja + 1), J = ⌊end/a⌋, in closed form: with j0 = min(J, ⌊end/b⌋),
 * the rows j <= j0 contribute j(b − a) + 1 and the rows j0 < j <= J contribute end + 1 − ja, so
 *   Σ = (b − a) j0(j0 + 1)/2 + j0 + (J − j0)(end + 1) − a (J(J + 1) − j0(j0 + 1))/2.
 * O(1) instead of a loop over J (J reaches 1e9 for a = 1 at n = 1e9, about a second of planning).
 * Exact in doubles while the terms stay below 2^53 (end up to ~4e7 whatever a, b); beyond, an
 * estimate with relative error ~1e-16, as the loop's own sum.
 */
export function partsTableWork(a: number, b: number, end: number): number {
  const J = Math.floor(end / a);
  if (J < 1) return 0;
  const j0 = Math.min(J, Math.floor(end / b));
  const low = ((b - a) * j0 * (j0 + 1)) / 2 + j0;
  const high = (J - j0) * (end + 1) - (a * (J * (J + 1) - j0 * (j0 + 1))) / 2;
  return 2 * (low + high);
}
