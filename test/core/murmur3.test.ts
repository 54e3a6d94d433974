import reference from 'murmurhash3js-revisited';
import { describe, expect, it } from 'vitest';
import { murmur3Hex, murmur3x86_128 } from '../../src/core/murmur3.js';

/**
 * Outside check: murmurhash3js-revisited (npm), whose x86.hash128 "matches the reference
 * implementation (C++)" MurmurHash3_x86_128, hashing the same UTF-8 bytes.
 */
const referenceHex = (text: string, seed = 0): string => reference.x86.hash128(new TextEncoder().encode(text), seed);

describe('MurmurHash3 x86_128', () => {
  it('agrees with murmurhash3js-revisited on every length 0..80 (all tail cases), three seeds, ASCII and not', () => {
    const alphabet = 'abcXYZ019|{}":,._~-é€😀';
    let mismatches = 0;
    for (let length = 0; length <= 80; length++) {
      for (let variant = 0; variant < 6; variant++) {
        let text = '';
        for (let i = 0; text.length < length; i++) text += alphabet[(i * 7 + variant * 13 + length) % (variant < 3 ? 19 : alphabet.length)];
        text = text.slice(0, length);
        for (const seed of [0, 1, 0x9747b28c]) if (murmur3Hex(text, seed) !== referenceHex(text, seed)) mismatches++;
      }
    }
    expect(mismatches).toBe(0);
  });

  it('hashes a long non-ASCII text (UTF-8 longer than one 4096-byte slice) as the reference does', () => {
    const text = 'é'.repeat(5000) + 'x';
    expect(murmur3Hex(text)).toBe(referenceHex(text));
  });

  it('returns the four words unsigned, h1 first, matching the hex form', () => {
    const words = murmur3x86_128('partsmith');
    for (const w of words) expect(Number.isInteger(w) && w >= 0 && w < 2 ** 32).toBe(true);
    expect(words.map((w) => w.toString(16).padStart(8, '0')).join('')).toBe(murmur3Hex('partsmith'));
  });

  it('the empty input with seed 0 hashes to zero (all lanes start at 0 and nothing is mixed in)', () => {
    // Follows from the reference code: fmix32(0) = 0; also what the reference package returns.
    expect(murmur3Hex('')).toBe('0'.repeat(32));
    expect(referenceHex('')).toBe('0'.repeat(32));
  });

  it('avalanche: flipping one input bit flips each output bit with probability ~1/2', () => {
    // 64 keys x 8 bit positions x 128 output bits; mean flip rate within 0.5 ± 0.01
    // (sd of the mean ≈ 0.5/√65536 ≈ 0.002, so ±0.01 is 5 sd: false alarm < 1e-6).
    let flips = 0;
    let trials = 0;
    for (let k = 0; k < 64; k++) {
      const key = `partsmith/v2|{"kind":"partition","n":${1000 + k}}|seed-${k}|${k}`;
      const base = murmur3x86_128(key);
      for (let bit = 0; bit < 8; bit++) {
        const at = (k * 5 + bit * 3) % key.length;
        const changed = key.slice(0, at) + String.fromCharCode(key.charCodeAt(at) ^ (1 << (bit % 7))) + key.slice(at + 1);
        const other = murmur3x86_128(changed);
        for (let w = 0; w < 4; w++) {
          let x = (base[w] ^ other[w]) >>> 0;
          while (x) {
            flips += x & 1;
            x >>>= 1;
          }
        }
        trials += 128;
      }
    }
    expect(Math.abs(flips / trials - 0.5)).toBeLessThan(0.01);
  });
});
