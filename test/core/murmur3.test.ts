import reference from 'murmurhash3js-revisited';
import { describe, expect, it } from 'vitest';
import { murmur3Hex, murmur3x86_128, Murmur3x86_128Prefix } from '../../src/core/murmur3.js';

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

  it('hashes one non-ASCII character at any position of a block or tail as the reference does', () => {
    // The ASCII fast path must notice every kind of character: 2-byte (é, U+0100 whose low byte
    // is 0), 3-byte (€, U+FFFF) and 4-byte (a surrogate pair), in each of the 16 byte positions.
    let mismatches = 0;
    for (const odd of ['\u0080', 'é', '\u00ff', '\u0100', '\u0180', '€', '\uffff', '😀']) {
      for (let at = 0; at < 40; at++) {
        const text = 'partsmith/v2|{"kind":"partition"}|seed|12'.slice(0, at) + odd + 'x'.repeat(at % 7);
        if (murmur3Hex(text, 42) !== referenceHex(text, 42)) mismatches++;
      }
    }
    expect(mismatches).toBe(0);
  });

  it('a prefix hashed once, then each suffix, equals hashing the whole text (every split, ASCII and not)', () => {
    const texts = ['partsmith/v2|{"kind":"partition","n":1000}|seed-7|123', 'ab', '', 'é€😀 and more ASCII after it, past two blocks', 'x'.repeat(47) + 'é'];
    let mismatches = 0;
    for (const text of texts) {
      for (let cut = 0; cut <= text.length; cut++) {
        const high = text.charCodeAt(cut - 1);
        if (high >= 0xd800 && high <= 0xdbff) continue; // a cut inside a surrogate pair leaves two lone halves
        for (const seed of [0, 0x9747b28c]) {
          const whole = murmur3x86_128(text, seed);
          const split = new Murmur3x86_128Prefix(text.slice(0, cut), seed).hash(text.slice(cut));
          if (whole.join() !== split.join()) mismatches++;
        }
      }
    }
    expect(mismatches).toBe(0);
    // And one prefix serves many suffixes.
    const prefix = new Murmur3x86_128Prefix('partsmith/v2|{"kind":"partition","n":10}|');
    for (const suffix of ['a|0', 'a|1', 'seed-é|2', 'x'.repeat(40)]) {
      expect(murmur3Hex(`partsmith/v2|{"kind":"partition","n":10}|${suffix}`)).toBe(prefix.hash(suffix).map((w) => w.toString(16).padStart(8, '0')).join(''));
    }
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
