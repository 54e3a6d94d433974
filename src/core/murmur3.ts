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
  const h = seed | 0; // the same 32 bits as seed >>> 0, kept a small integer (int32) for the JIT
  // Every stream key and ETag input is ASCII, which is its own UTF-8: hash the text as it is,
  // and only if a character turns out to be non-ASCII hash its UTF-8 bytes instead.
  return hashBytes(text, h, h, h, h, 0, true) ?? hashBytes(utf8Bytes(text), h, h, h, h, 0, false)!;
}

/**
 * Hashes many texts that start with the same prefix: `hash(suffix)` equals
 * `murmur3x86_128(prefix + suffix, seed)`, but the prefix's whole 16-byte blocks are mixed in
 * once, here (prefix and suffix are each encoded as UTF-8, so the prefix must not end inside a
 * surrogate pair). A sample's stream key starts with the version and the family (seeding.ts), which
 * are the same for every sample of a family and are most of the key.
 */
export class Murmur3x86_128Prefix {
  private readonly h1: number;
  private readonly h2: number;
  private readonly h3: number;
  private readonly h4: number;
  /** The prefix's bytes after its last whole block (fewer than 16), one character per byte. */
  private readonly rest: string;
  /** Bytes already mixed in. */
  private readonly mixed: number;
  private readonly asciiPrefix: boolean;

  constructor(prefix: string, seed = 0) {
    this.asciiPrefix = !NON_ASCII.test(prefix);
    const bytes = this.asciiPrefix ? prefix : utf8Bytes(prefix);
    this.mixed = bytes.length - (bytes.length % 16);
    this.rest = bytes.slice(this.mixed);
    const h = seed | 0; // the same 32 bits as seed >>> 0, kept a small integer (int32) for the JIT
    const state = [h, h, h, h];
    mixBlocks(bytes, this.mixed, state);
    [this.h1, this.h2, this.h3, this.h4] = state;
  }

  hash(suffix: string): [number, number, number, number] {
    const { h1, h2, h3, h4, mixed } = this;
    if (this.asciiPrefix) {
      const words = hashBytes(this.rest + suffix, h1, h2, h3, h4, mixed, true);
      if (words) return words;
    }
    return hashBytes(this.rest + utf8Bytes(suffix), h1, h2, h3, h4, mixed, false)!;
  }
}

/** Mixes the whole 16-byte blocks in bytes[0, end) into the lanes `state` (end a multiple of 16). */
function mixBlocks(bytes: string, end: number, state: number[]): void {
  let [h1, h2, h3, h4] = state;
  for (let i = 0; i < end; i += 16) {
    h1 = mixLane1(h1, h2, word(bytes, i));
    h2 = mixLane2(h2, h3, word(bytes, i + 4));
    h3 = mixLane3(h3, h4, word(bytes, i + 8));
    h4 = mixLane4(h4, h1, word(bytes, i + 12));
  }
  state[0] = h1;
  state[1] = h2;
  state[2] = h3;
  state[3] = h4;
}

/**
 * The reference algorithm from lanes h1..h4 that have already mixed `before` bytes: the whole
 * blocks of `bytes`, its last length % 16 bytes, then the finalisation over the total length.
 * With `asciiOnly`, returns undefined as soon as it is clear that a character was above 0x7f
 * (the bytes were not one character per byte after all); the caller then passes UTF-8 bytes.
 */
function hashBytes(bytes: string, h1: number, h2: number, h3: number, h4: number, before: number, asciiOnly: boolean): [number, number, number, number] | undefined {
  const length = bytes.length;
  const blocks = length - (length % 16);
  let seen = 0; // OR of every character code: above 0x7f iff some character is not ASCII
  let i = 0;
  for (; i < blocks; i += 16) {
    // Each character is read once: the codes go into both the ASCII check and the words.
    const a0 = bytes.charCodeAt(i), a1 = bytes.charCodeAt(i + 1), a2 = bytes.charCodeAt(i + 2), a3 = bytes.charCodeAt(i + 3);
    const b0 = bytes.charCodeAt(i + 4), b1 = bytes.charCodeAt(i + 5), b2 = bytes.charCodeAt(i + 6), b3 = bytes.charCodeAt(i + 7);
    const c0 = bytes.charCodeAt(i + 8), c1 = bytes.charCodeAt(i + 9), c2 = bytes.charCodeAt(i + 10), c3 = bytes.charCodeAt(i + 11);
    const d0 = bytes.charCodeAt(i + 12), d1 = bytes.charCodeAt(i + 13), d2 = bytes.charCodeAt(i + 14), d3 = bytes.charCodeAt(i + 15);
    seen |= a0 | a1 | a2 | a3 | b0 | b1 | b2 | b3 | c0 | c1 | c2 | c3 | d0 | d1 | d2 | d3;
    h1 = mixLane1(h1, h2, a0 | (a1 << 8) | (a2 << 16) | (a3 << 24));
    h2 = mixLane2(h2, h3, b0 | (b1 << 8) | (b2 << 16) | (b3 << 24));
    h3 = mixLane3(h3, h4, c0 | (c1 << 8) | (c2 << 16) | (c3 << 24));
    h4 = mixLane4(h4, h1, d0 | (d1 << 8) | (d2 << 16) | (d3 << 24));
  }

  // The last length % 16 bytes, little-endian into k1..k4 (the reference's fall-through switch).
  let k1 = 0;
  let k2 = 0;
  let k3 = 0;
  let k4 = 0;
  for (let at = length - 1; at >= i; at--) {
    const byte = bytes.charCodeAt(at);
    seen |= byte;
    const lane = (at - i) >> 2;
    if (lane === 0) k1 = (k1 << 8) | byte;
    else if (lane === 1) k2 = (k2 << 8) | byte;
    else if (lane === 2) k3 = (k3 << 8) | byte;
    else k4 = (k4 << 8) | byte;
  }
  if (asciiOnly && seen > 0x7f) return undefined;
  const tail = length - i;
  if (tail > 12) h4 ^= Math.imul(rotl(Math.imul(k4, C4), 18), C1);
  if (tail > 8) h3 ^= Math.imul(rotl(Math.imul(k3, C3), 17), C4);
  if (tail > 4) h2 ^= Math.imul(rotl(Math.imul(k2, C2), 16), C3);
  if (tail > 0) h1 ^= Math.imul(rotl(Math.imul(k1, C1), 15), C2);

  const total = before + length;
  h1 ^= total;
  h2 ^= total;
  h3 ^= total;
  h4 ^= total;
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

// One block's update of each lane (the reference's loop body), with each lane's constants.
function mixLane1(h1: number, h2: number, k1: number): number {
  h1 ^= Math.imul(rotl(Math.imul(k1, C1), 15), C2);
  return (Math.imul(rotl(h1, 19) + h2, 5) + 0x561ccd1b) | 0;
}

function mixLane2(h2: number, h3: number, k2: number): number {
  h2 ^= Math.imul(rotl(Math.imul(k2, C2), 16), C3);
  return (Math.imul(rotl(h2, 17) + h3, 5) + 0x0bcaa747) | 0;
}

function mixLane3(h3: number, h4: number, k3: number): number {
  h3 ^= Math.imul(rotl(Math.imul(k3, C3), 17), C4);
  return (Math.imul(rotl(h3, 15) + h4, 5) + 0x96cd1c35) | 0;
}

function mixLane4(h4: number, h1: number, k4: number): number {
  h4 ^= Math.imul(rotl(Math.imul(k4, C4), 18), C1);
  return (Math.imul(rotl(h4, 13) + h1, 5) + 0x32ac3b17) | 0;
}

/** The hash as 32 lowercase hex digits, h1 first. */
export function murmur3Hex(text: string, seed = 0): string {
  return wordsToHex(murmur3x86_128(text, seed));
}

/** Four 32-bit words as 32 lowercase hex digits, the first word first (the form of murmur3Hex). */
export function wordsToHex([h1, h2, h3, h4]: readonly [number, number, number, number]): string {
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

/** Four bytes at `at`, little-endian; `bytes` is a string with one character per byte. */
function word(bytes: string, at: number): number {
  return bytes.charCodeAt(at) | (bytes.charCodeAt(at + 1) << 8) | (bytes.charCodeAt(at + 2) << 16) | (bytes.charCodeAt(at + 3) << 24);
}

const encoder = new TextEncoder();

/** Any character outside ASCII (a native regex scan). */
const NON_ASCII = /[^\x00-\x7f]/;

/** The UTF-8 bytes of a text, as a string with one character per byte. */
function utf8Bytes(text: string): string {
  return latin1(encoder.encode(text));
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
