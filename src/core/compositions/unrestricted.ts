import type { RandomSource } from '../random.js';
import type { CompositionSampler } from '../sampler.js';

/**
 * Uniform composition of n with no restriction: each of the n-1 gaps between consecutive units
 * is cut independently with probability 1/2, which gives each of the 2^(n-1) compositions
 * probability 2^-(n-1) (Stanley, Enumerative Combinatorics vol. 1, §1.2). Every bit of each
 * 32-bit word decides one gap (only the unused tail of the last word is dropped), and the loop
 * jumps from cut to cut with count-trailing-zeros, so the cost is n/32 words plus one step per part.
 *
 * Two passes over the same words, in the same order: the first draws them and counts the cuts
 * (population count), so the second writes the parts into a typed array of the exact length.
 * A number[] of 5·10^5 parts costs several times the sampling itself to grow (see the serving
 * section of `npm run bench`); the HTTP layer writes its text straight from the typed array.
 */
export function unrestrictedParts(source: RandomSource, n: number): Int32Array {
  if (n === 0) return new Int32Array(0);
  const gaps = n - 1;
  const words = new Int32Array(Math.ceil(gaps / 32));
  let cuts = 0;
  for (let k = 0; k < words.length; k++) {
    let word = source.nextUint32();
    const used = gaps - 32 * k;
    if (used < 32) word &= (1 << used) - 1; // used >= 1, so the shift is in 1..31
    words[k] = word;
    cuts += bitCount(word);
  }
  const parts = new Int32Array(cuts + 1);
  let length = 0;
  let last = 0; // position of the previous cut (0 = left end)
  for (let k = 0; k < words.length; k++) {
    let word = words[k];
    const base = 32 * k;
    while (word !== 0) {
      const lowest = word & -word;
      const gap = base + (31 - Math.clz32(lowest)) + 1; // cut after unit `gap`
      parts[length++] = gap - last;
      last = gap;
      word ^= lowest;
    }
  }
  parts[length] = n - last;
  return parts;
}

/** The same composition as unrestrictedParts (the same draws), as a list. */
export function sampleUnrestricted(source: RandomSource, n: number): number[] {
  return listOf(unrestrictedParts(source, n));
}

/** Number of set bits of a 32-bit word (the classic SWAR population count). */
function bitCount(word: number): number {
  let x = word - ((word >>> 1) & 0x55555555);
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  return Math.imul((x + (x >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
}

/** The parts as a list, allocated at its length (growing it by push cost ~3x as much at 5·10^5 parts). */
function listOf(parts: Int32Array): number[] {
  const list = new Array<number>(parts.length);
  for (let i = 0; i < parts.length; i++) list[i] = parts[i];
  return list;
}

/**
 * Every composition of n, or with `scale` d every composition of n·d into multiples of d (parts
 * d·v): the family of a part list such as {3, 6} or {4, 8, 12} whose core (reduce.ts) is all
 * compositions. Parts are at most n·d <= MAX_N < 2^31, so they fit an Int32Array.
 */
export function unrestrictedSampler(n: number, scale = 1): CompositionSampler {
  const sampleParts =
    scale === 1
      ? (source: RandomSource) => unrestrictedParts(source, n)
      : (source: RandomSource) => {
          const parts = unrestrictedParts(source, n);
          for (let i = 0; i < parts.length; i++) parts[i] *= scale;
          return parts;
        };
  return {
    method: 'gap-bits/1',
    // 1 + Binomial(n-1, 1/2) parts.
    expectedLength: n === 0 ? 0 : (n + 1) / 2,
    // One word per 32 gaps plus one step per part.
    expectedWork: Math.ceil(Math.max(0, n - 1) / 32) + (n + 1) / 2,
    sample: (source) => listOf(sampleParts(source)),
    sampleParts,
  };
}
