/** Positions looked at on each end of a long member, and spread between them. */
const POSITIONS = 32;

/**
 * The positions a shrink step looks at: every position of a member of at most 4·POSITIONS
 * parts (or sizes); of a longer one the first and last POSITIONS and POSITIONS evenly spread
 * between, so that a step of a member of 10^5 parts proposes a few hundred candidates.
 */
export function spread(length: number): number[] {
  if (length <= 4 * POSITIONS) return Array.from({ length }, (_, i) => i);
  const middle = Array.from({ length: POSITIONS }, (_, i) => POSITIONS + Math.floor(((i + 0.5) * (length - 2 * POSITIONS)) / POSITIONS));
  return [...Array.from({ length: POSITIONS }, (_, i) => i), ...middle, ...Array.from({ length: POSITIONS }, (_, i) => length - POSITIONS + i)];
}
