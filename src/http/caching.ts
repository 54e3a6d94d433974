import { APP_VERSION } from '../version.js';
import { ALGORITHM_VERSION } from '../core/seeding.js';

/**
 * Caching of sample responses. A seeded response is a pure function of the request, the
 * algorithm version and the service version, so it is immutable: a strong ETag is a hash of
 * exactly those inputs, known before the body is produced (the body may be streamed).
 * An unseeded response used a freshly drawn seed and must never be stored.
 */
export async function strongEtag(path: string, canonicalQuery: unknown): Promise<string> {
  const material = `${APP_VERSION}|${ALGORITHM_VERSION}|${path}|${JSON.stringify(canonicalQuery)}`;
  const digest = await crypto.subtle.digest('SHA-256', new TextEncoder().encode(material));
  const hex = [...new Uint8Array(digest).slice(0, 16)].map((b) => b.toString(16).padStart(2, '0')).join('');
  return `"${hex}"`;
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
  return Object.fromEntries(Object.keys(query).sort().filter((k) => query[k] !== undefined).map((k) => [k, query[k]]));
}
