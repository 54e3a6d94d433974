import { APP_VERSION } from '../version.js';
import { murmur3Hex, murmur3x86_128 } from '../core/murmur3.js';
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
