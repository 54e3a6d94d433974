import { APP_VERSION } from '../version.js';
import { murmur3Hex, murmur3x86_128, Murmur3x86_128Prefix, wordsToHex } from '../core/murmur3.js';
import { ALGORITHM_VERSION } from '../core/seeding.js';

/**
 * Caching of sample responses. A seeded response is a pure function of the request, the
 * algorithm version and the service version, so it is immutable: a strong ETag is a hash of
 * exactly those inputs, known before the body is produced (the body may be streamed): 128 bits
 * of MurmurHash3, synchronous and fast (Web Crypto's SHA-256 is async and cost ~150 µs per
 * request); an ETag needs distinct requests to get distinct tags, not resistance to an adversary.
 * An unseeded response used a freshly drawn seed and must never be stored.
 *
 * `parsedQuery` is the query as the endpoint's zod schema returned it: zod lists the schema's
 * keys in schema order whatever order the URL gave them in, and fills in defaults, so
 * equivalent spellings of a request serialise alike (tested in etag.test.ts).
 */
export function strongEtag(path: string, parsedQuery: unknown): string {
  return `"${murmur3Hex(JSON.stringify(parsedQuery), etagNamespace(path))}"`;
}

/**
 * The ETags of one parsed query for every seed: `etag(seed)` equals
 * `strongEtag(path, { ...query, seed })` (the same text is hashed), but the part of the query's
 * JSON before the seed is serialised and hashed once.
 */
export class SeedEtags {
  private readonly before: Murmur3x86_128Prefix;
  private readonly after: string;

  constructor(path: string, parsedQuery: Readonly<Record<string, unknown>>) {
    if (!Object.hasOwn(parsedQuery, 'seed')) throw new RangeError('SeedEtags needs a parsed query with a seed');
    // A marker no other value can contain: the parsed values are numbers, booleans, words and
    // lists of numbers. Setting the existing key keeps its place in the JSON.
    const marker = JSON.stringify(SEED_MARKER);
    const text = JSON.stringify({ ...parsedQuery, seed: SEED_MARKER });
    const at = text.indexOf(marker);
    if (at < 0 || text.indexOf(marker, at + 1) >= 0) throw new RangeError('the seed must appear exactly once in the parsed query');
    this.before = new Murmur3x86_128Prefix(text.slice(0, at), etagNamespace(path));
    this.after = text.slice(at + marker.length);
  }

  etag(seed: string): string {
    return `"${wordsToHex(this.before.hash(JSON.stringify(seed) + this.after))}"`;
  }
}

const SEED_MARKER = '\u0000seed\u0000';

/**
 * The hash seed for one path's ETags: a hash of the versions and the path, so the ETag depends
 * on all of them without hashing them again for every request. Paths come from the endpoint
 * definitions (a handful), never from the request, so the memo stays small.
 */
const namespaces = new Map<string, number>();

function etagNamespace(path: string): number {
  let seed = namespaces.get(path);
  if (seed === undefined) {
    seed = murmur3x86_128(`${APP_VERSION}|${ALGORITHM_VERSION}|${path}`)[0];
    namespaces.set(path, seed);
  }
  return seed;
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
