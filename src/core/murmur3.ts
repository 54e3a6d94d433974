/**
 * MurmurHash3, x86 128-bit variant (Austin Appleby, public domain reference MurmurHash3.cpp:
 * MurmurHash3_x86_128), over the UTF-8 bytes of a string. A fast non-cryptographic hash with full
 * avalanche: every input bit affects every output bit with probability about 1/2. Used to derive
 * each sample's random stream (seeding.ts) and the ETags; neither needs resistance to an
 * adversary, both need distinct inputs to give unrelated outputs.
 *
 * Returns the four 32-bit words h1..h4 as unsigned numbers; `murmur3Hex` writes them as 32 hex
 * digits, h1 first (the form other implementations print).
 */
export function murmur3x86_128(text: string, seed = 0): [number, number, number, number] {
  const bytes = asBytes(text);
  const length = bytes.length;
  const blocks = length - (length % 16);
  let h1 = seed >>> 0;
  let h2 = h1;
  let h3 = h1;
  let h4 = h1;

  let i = 0;
  for (; i < blocks; i += 16) {
    let k1 = word(bytes, i);
    let k2 = word(bytes, i + 4);
    let k3 = word(bytes, i + 8);
    let k4 = word(bytes, i + 12);

    k1 = Math.imul(rotl(Math.imul(k1, C1), 15), C2);
    h1 ^= k1;
    h1 = (Math.imul(rotl(h1, 19) + h2, 5) + 0x561ccd1b) | 0;

    k2 = Math.imul(rotl(Math.imul(k2, C2), 16), C3);
    h2 ^= k2;
    h2 = (Math.imul(rotl(h2, 17) + h3, 5) + 0x0bcaa747) | 0;

    k3 = Math.imul(rotl(Math.imul(k3, C3), 17), C4);
    h3 ^= k3;
    h3 = (Math.imul(rotl(h3, 15) + h4, 5) + 0x96cd1c35) | 0;

    k4 = Math.imul(rotl(Math.imul(k4, C4), 18), C1);
    h4 ^= k4;
    h4 = (Math.imul(rotl(h4, 13) + h1, 5) + 0x32ac3b17) | 0;
  }

  // The last length % 16 bytes, little-endian into k1..k4 (the reference's fall-through switch).
  const tail = length - blocks;
  if (tail > 12) h4 ^= Math.imul(rotl(Math.imul(partialWord(bytes, i + 12, tail - 12), C4), 18), C1);
  if (tail > 8) h3 ^= Math.imul(rotl(Math.imul(partialWord(bytes, i + 8, Math.min(tail - 8, 4)), C3), 17), C4);
  if (tail > 4) h2 ^= Math.imul(rotl(Math.imul(partialWord(bytes, i + 4, Math.min(tail - 4, 4)), C2), 16), C3);
  if (tail > 0) h1 ^= Math.imul(rotl(Math.imul(partialWord(bytes, i, Math.min(tail, 4)), C1), 15), C2);

  h1 ^= length;
  h2 ^= length;
  h3 ^= length;
  h4 ^= length;
  h1 = (h1 + h2 + h3 + h4) | 0;
  h2 = (h2 + h1) | 0;
  h3 = (h3 + h1) | 0;
  h4 = (h4 + h1) | 0;
  h1 = fmix32(h1);
  h2 = fmix32(h2);
  h3 = fmix32(h3);
  h4 = fmix32(h4);
  h1 = (h1 + h2 + h3 + h4) | 0;
  h2 = (h2 + h1) | 0;
  h3 = (h3 + h1) | 0;
  h4 = (h4 + h1) | 0;
  return [h1 >>> 0, h2 >>> 0, h3 >>> 0, h4 >>> 0];
}

/** The hash as 32 lowercase hex digits, h1 first. */
export function murmur3Hex(text: string, seed = 0): string {
  const [h1, h2, h3, h4] = murmur3x86_128(text, seed);
  return hex8(h1) + hex8(h2) + hex8(h3) + hex8(h4);
}

const C1 = 0x239b961b;
const C2 = 0xab0e9789;
const C3 = 0x38b34ae5;
const C4 = 0xa1e38b93;

function rotl(x: number, r: number): number {
  return (x << r) | (x >>> (32 - r));
}

/** The reference's fmix32 finaliser: full avalanche of one 32-bit word. */
function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return h ^ (h >>> 16);
}

/** Four bytes at `at`, little-endian; `bytes` is a string of byte values (see asBytes). */
function word(bytes: string, at: number): number {
  return bytes.charCodeAt(at) | (bytes.charCodeAt(at + 1) << 8) | (bytes.charCodeAt(at + 2) << 16) | (bytes.charCodeAt(at + 3) << 24);
}

/** The first `count` (1..4) bytes at `at`, little-endian. */
function partialWord(bytes: string, at: number, count: number): number {
  let k = 0;
  for (let b = count - 1; b >= 0; b--) k = (k << 8) | bytes.charCodeAt(at + b);
  return k;
}

const encoder = new TextEncoder();

/** Any character outside ASCII (a native regex scan: ~4x faster than a charCodeAt loop here). */
const NON_ASCII = /[^\x00-\x7f]/;

/**
 * The UTF-8 bytes of the text as a string with one character per byte. An ASCII string (every
 * stream key and ETag input in practice) is its own UTF-8 and is used as it is, with no copy.
 */
function asBytes(text: string): string {
  return NON_ASCII.test(text) ? latin1(encoder.encode(text)) : text;
}

function latin1(bytes: Uint8Array): string {
  let out = '';
  // In slices: spreading a long array into one call would overflow the stack.
  for (let at = 0; at < bytes.length; at += 4096) out += String.fromCharCode(...bytes.subarray(at, at + 4096));
  return out;
}

/** Two hex digits per byte value: four lookups per word instead of toString(16) and padStart. */
const HEX_BYTES = Array.from({ length: 256 }, (_, byte) => byte.toString(16).padStart(2, '0'));

function hex8(word: number): string {
  return HEX_BYTES[word >>> 24] + HEX_BYTES[(word >>> 16) & 255] + HEX_BYTES[(word >>> 8) & 255] + HEX_BYTES[word & 255];
}
