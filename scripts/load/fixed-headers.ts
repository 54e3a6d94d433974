/**
 * partsmith's response headers on a fixed sample response (n = 1000, seed "fixed", a fixed
 * ETag): what the Hono references of `npm run load -- --ceiling` (fixed-hono-server.ts) and of
 * `npm run bench` (scripts/bench/http.ts) send, so that both carry the same header bytes.
 */
export const FIXED_HEADERS: Readonly<Record<string, string>> = {
  'access-control-allow-origin': '*',
  'access-control-expose-headers': 'ETag, Partsmith-Seed, Partsmith-Method, Retry-After',
  'cache-control': 'public, max-age=31536000, immutable',
  'content-security-policy': "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'",
  'content-type': 'application/json; charset=utf-8',
  etag: '"00000000000000000000000000000000"',
  'partsmith-method': 'table-recursive/1',
  'partsmith-seed': 'fixed',
  'referrer-policy': 'no-referrer',
  'x-content-type-options': 'nosniff',
};
