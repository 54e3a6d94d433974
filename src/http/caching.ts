import { APP_VERSION } from '../version.js';
import { murmur3x86_128, Murmur3x86_128Prefix } from '../core/murmur3.js';
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
export function strongEtag(path: string, parsedQuery: Readonly<Record<string, unknown>>): string {
  return quotedHex(murmur3x86_128(etagText(parsedQuery), etagNamespace(path)));
}

/**
 * The text an ETag hashes: the parsed query's JSON without its seed, then the seed's JSON when
 * there is one. A JSON object's text ends where its braces close, so distinct queries give
 * distinct texts; the seed goes last so that SeedEtags hashes the rest once per query.
 */
function etagText(parsedQuery: Readonly<Record<string, unknown>>): string {
  if (!Object.hasOwn(parsedQuery, 'seed') || parsedQuery.seed === undefined) return JSON.stringify(parsedQuery);
  const { seed, ...rest } = parsedQuery;
  return JSON.stringify(rest) + JSON.stringify(seed);
}

/**
 * The ETags of one parsed query for every seed: `etag(seed)` equals
 * `strongEtag(path, { ...query, seed })` (the same text is hashed), but the query's JSON
 * without the seed is serialised and hashed once: per request only the seed is (1.2 against
 * 1.55 µs per tag when the seed sat inside the JSON and the text after it was hashed again:
 * interleaved rounds on a loaded 2-core machine).
 */
export class SeedEtags {
  private readonly rest: Murmur3x86_128Prefix;

  constructor(path: string, parsedQuery: Readonly<Record<string, unknown>>) {
    if (!Object.hasOwn(parsedQuery, 'seed')) throw new RangeError('SeedEtags needs a parsed query with a seed');
    const { seed: _seed, ...rest } = parsedQuery;
    this.rest = new Murmur3x86_128Prefix(JSON.stringify(rest), etagNamespace(path));
  }

  etag(seed: string): string {
    return quotedHex(this.rest.hash(JSON.stringify(seed)));
  }
}

/** Character codes of the hex digits. */
const HEX_CODES = Array.from('0123456789abcdef', (digit) => digit.charCodeAt(0));

/** The 34 character codes of a quoted tag: '"', 32 hex digits, '"' (reused: JS runs one call at a time). */
const TAG_CODES: number[] = new Array<number>(34).fill(34);

/**
 * `"` + murmur3Hex's 32 hex digits (h1 first) + `"`, made as one flat string from its
 * character codes. Joining the hex pieces with + made a string of many linked pieces, which
 * node:http's check of every header value (a regular expression) first has to copy into one:
 * 1.3 against 1.9 µs per tag with that check (.scratch micro-timing; bench: http,
 * "SeedEtags.etag + node:http's header-value check").
 */
function quotedHex(words: readonly [number, number, number, number]): string {
  let at = 1;
  for (let w = 0; w < 4; w++) {
    const word = words[w];
    for (let shift = 28; shift >= 0; shift -= 4) TAG_CODES[at++] = HEX_CODES[(word >>> shift) & 15];
  }
  return String.fromCharCode.apply(null, TAG_CODES);
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
