import type { Context, Handler, MiddlewareHandler } from 'hono';
import { ProblemError } from '../problem.js';
import { CORS_EXPOSED_HEADERS } from './complete-response.js';

/**
 * Cross-origin access. The data is public and read-only and no credentials are ever used, so
 * any origin may read it (`*`), including the problem details of failed requests; scripts may
 * read the headers that matter for replay and caching.
 */
export { CORS_EXPOSED_HEADERS } from './complete-response.js';
export const ALLOWED_METHODS = 'GET, HEAD, OPTIONS';
/** Request headers a cross-origin script may send (If-None-Match for revalidation); the rest are safelisted by Fetch. */
const ALLOWED_REQUEST_HEADERS = 'If-None-Match';
/** Browsers may cache a preflight answer for a day (Chromium caps it at 2 hours). */
const PREFLIGHT_MAX_AGE = '86400';

/** Adds the CORS headers to every response. */
export function corsHeaders(): MiddlewareHandler {
  return async (c, next) => {
    await next();
    addCorsHeaders(c);
  };
}

/** Sets the CORS headers on the context's response. */
export function addCorsHeaders(c: Context): void {
  c.res.headers.set('access-control-allow-origin', '*');
  c.res.headers.set('access-control-expose-headers', CORS_EXPOSED_HEADERS);
}

/**
 * The handler for every method but GET and HEAD on an endpoint's path: OPTIONS answers a CORS
 * preflight (or a plain capability query) with 204; anything else is 405 with Allow.
 */
export function otherMethods(path: string): Handler {
  return (c) => {
    if (c.req.method === 'OPTIONS') {
      return new Response(null, {
        status: 204,
        headers: {
          allow: ALLOWED_METHODS,
          'access-control-allow-methods': ALLOWED_METHODS,
          'access-control-allow-headers': ALLOWED_REQUEST_HEADERS,
          'access-control-max-age': PREFLIGHT_MAX_AGE,
          'cache-control': 'public, max-age=86400',
        },
      });
    }
    throw new ProblemError(405, `${c.req.method} is not supported on ${path}; use GET or HEAD (or OPTIONS for CORS).`, undefined, { allow: ALLOWED_METHODS });
  };
}
