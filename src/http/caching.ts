import { APP_VERSION } from '../version.js';
import { ALGORITHM_VERSION } from '../core/seeding.js';

/**
 * Caching of sample responses. A seeded response is a pure function of the request, the
 * algorithm version and the service version, so it is immutable: a strong ETag is a hash of
 * exactly those inputs, known before the body is produced (the body may be streamed).
 * An unseeded response used a freshly drawn seed and must never be stored.
 */
export function strongEtag(path: string, canonicalQuery: unknown): string {
  return `"${hash128(`${APP_VERSION}|${ALGORITHM_VERSION}|${path}|${JSON.stringify(canonicalQuery)}`)}"`;
}

/**
 * A synchronous 128-bit non-cryptographic hash (32 hex digits): four FNV-1a lanes over the UTF-16
 * code units, with different offsets, each finished by MurmurHash3's fmix32 avalanche. An ETag
 * only needs distinct requests to get distinct tags with overwhelming probability, not
 * resistance to an adversary; Web Crypto's SHA-256 is async and cost ~150 us per request.
 */
export function hash128(text: string): string {
  let a = 0x811c9dc5;
  let b = 0x01000193 ^ 0x9e3779b9;
  let c = 0x85ebca6b;
  let d = 0xc2b2ae35;
  for (let i = 0; i < text.length; i++) {
    const unit = text.charCodeAt(i);
    a = Math.imul(a ^ unit, 0x01000193);
    b = Math.imul(b ^ unit, 0x01000193) ^ (a >>> 15);
    c = Math.imul(c ^ unit, 0x01000193) ^ (b >>> 13);
    d = Math.imul(d ^ unit, 0x01000193) ^ (c >>> 11);
  }
  return hex8(fmix32(a ^ text.length)) + hex8(fmix32(b)) + hex8(fmix32(c)) + hex8(fmix32(d));
}

/** Two hex digits per byte value: four lookups per lane instead of toString(16) and padStart. */
const HEX_BYTES = Array.from({ length: 256 }, (_, byte) => byte.toString(16).padStart(2, '0'));

function hex8(lane: number): string {
  return HEX_BYTES[lane >>> 24] + HEX_BYTES[(lane >>> 16) & 255] + HEX_BYTES[(lane >>> 8) & 255] + HEX_BYTES[lane & 255];
}

function fmix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return h ^ (h >>> 16);
}

export const IMMUTABLE = 'public, max-age=31536000, immutable';
export const NO_STORE = 'no-store';

/** True when If-None-Match lists this ETag (or is "*"); weak comparison, as RFC 9110 §13.1.2 asks. */
export function matchesIfNoneMatch(request: Request, etag: string): boolean {
  const header = request.headers.get('if-none-match');
  if (!header) return false;
  if (header.trim() === '*') return true;
  return header.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etag);
}

/** Query values with keys sorted, so equivalent spellings of a request share one ETag. */
export function sortedQuery(query: Record<string, unknown>): Record<string, unknown> {
  // A plain object rather than a null-prototype one (which V8 keeps in slow dictionary mode:
  // 0.5 µs more per request); "__proto__" is defined as an own property, never assigned.
  const sorted: Record<string, unknown> = {};
  for (const key of Object.keys(query).sort()) {
    const value = query[key];
    if (value === undefined) continue;
    if (key === '__proto__') Object.defineProperty(sorted, key, { value, enumerable: true, writable: true, configurable: true });
    else sorted[key] = value;
  }
  return sorted;
}
