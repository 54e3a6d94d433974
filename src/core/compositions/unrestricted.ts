import type { RandomSource } from '../random.js';
import type { CompositionSampler } from '../sampler.js';

/**
 * Uniform composition of n with no restriction: each of the n-1 gaps between consecutive units
 * is cut independently with probability 1/2, which gives each of the 2^(n-1) compositions
 * probability 2^-(n-1) (Stanley, Enumerative Combinatorics vol. 1, §1.2). Every bit of each
 * 32-bit word decides one gap (only the unused tail of the last word is dropped), and the loop
 * jumps from cut to cut with count-trailing-zeros, so the cost is n/32 words plus one step per part.
 */
export function sampleUnrestricted(source: RandomSource, n: number): number[] {
  if (n === 0) return [];
  const parts: number[] = [];
  const gaps = n - 1;
  let last = 0; // position of the previous cut (0 = left end)
  for (let base = 0; base < gaps; base += 32) {
    let word = source.nextUint32();
    const used = gaps - base;
    if (used < 32) word &= (1 << used) - 1; // used >= 1, so the shift is in 1..31
    while (word !== 0) {
      const lowest = word & -word;
      const gap = base + (31 - Math.clz32(lowest)) + 1; // cut after unit `gap`
      parts.push(gap - last);
      last = gap;
      word ^= lowest;
    }
  }
  parts.push(n - last);
  return parts;
}

/**
 * Every composition of n, or with `scale` d every composition of n·d into multiples of d (parts
 * d·v): the family of a part list such as {3, 6} or {4, 8, 12} whose core (reduce.ts) is all
 * compositions.
 */
export function unrestrictedSampler(n: number, scale = 1): CompositionSampler {
  return {
    method: 'gap-bits/1',
    // 1 + Binomial(n-1, 1/2) parts.
    expectedLength: n === 0 ? 0 : (n + 1) / 2,
    // One word per 32 gaps plus one step per part.
    expectedWork: Math.ceil(Math.max(0, n - 1) / 32) + (n + 1) / 2,
    sample:
      scale === 1
        ? (source) => sampleUnrestricted(source, n)
        : (source) => {
            const parts = sampleUnrestricted(source, n);
            for (let i = 0; i < parts.length; i++) parts[i] *= scale;
            return parts;
          },
  };
}
