/**
 * Ranks of all compositions of n, without a table. A composition of n is a choice, for each of
 * the n - 1 gaps between consecutive units, of cut or join (Stanley, Enumerative Combinatorics
 * vol. 1, §1.2). Read the gaps left to right as the binary digits of a number, most significant
 * first, with 1 for "join": lexicographic order of the parts is exactly the order of that number.
 * (Comparing two compositions at their first differing part, the smaller part cuts where the
 * other joins; every gap before agrees.) So 1 + 1 + ... + 1 (all cuts) has rank 0 and n (all
 * joins) has rank 2^(n-1) - 1: O(n) per rank or unrank at any n.
 */

/** The rank of a composition (parts >= 1, in order). */
export function gapBitsRank(parts: readonly number[]): bigint {
  if (parts.length <= 1) return parts.length === 0 ? 0n : (1n << BigInt(parts[0] - 1)) - 1n;
  const digits: string[] = [];
  for (let i = 0; i < parts.length; i++) {
    digits.push('1'.repeat(parts[i] - 1));
    if (i < parts.length - 1) digits.push('0');
  }
  return BigInt(`0b${digits.join('')}`);
}

/** The composition of n of the given rank (0 <= rank < 2^(n-1); n = 0 gives the empty composition). */
export function gapBitsUnrank(rank: bigint, n: number): number[] {
  if (n === 0) return [];
  const gaps = n === 1 ? '' : rank.toString(2).padStart(n - 1, '0');
  const parts: number[] = [];
  let run = 1;
  for (let i = 0; i < gaps.length; i++) {
    if (gaps.charCodeAt(i) === 49) run++; // '1': join
    else {
      parts.push(run);
      run = 1;
    }
  }
  parts.push(run);
  return parts;
}
