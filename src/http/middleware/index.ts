import type { Context, MiddlewareHandler } from 'hono';
import { isComplete } from './complete-response.js';
import { addCorsHeaders } from './cors.js';
import { oversizedUrlProblem } from './request-size.js';
import { addSecurityHeaders, htmlPolicyMemo, type HtmlPolicyMemo } from './security-headers.js';

export { ALLOWED_METHODS, CORS_EXPOSED_HEADERS, corsHeaders, otherMethods } from './cors.js';
export { API_HARDENING_HEADERS, completeResponse } from './complete-response.js';
export { MAX_PATH_LENGTH, MAX_URL_LENGTH, oversizedUrlProblem, rejectOversizedUrls } from './request-size.js';
export { API_CONTENT_SECURITY_POLICY, cspHash, htmlContentSecurityPolicy, inlineSources, securityHeaders } from './security-headers.js';

/**
 * What every request goes through: oversized URLs are refused before any work, and every
 * response, errors and 404s included, gets the security and CORS headers. Responses built by
 * `completeResponse` (samples, counts, problems) already carry those headers and pass through
 * untouched; others get them set here.
 *
 * Two ways to apply it. `middleware()` is a Hono middleware, for routes such as the HTML page.
 * `route(handler)` wraps one route handler instead: a path whose only matching handler is that
 * route is dispatched by Hono without its middleware composer, and a route that answers
 * synchronously with a string body is then written by the Node adapter directly. For a small
 * API request that saves several promise turns and a 'close' listener per request. (A wrapped
 * route refuses oversized URLs after routing instead of before; routing does not look at the query.)
 */
export interface Hardening {
  middleware(): MiddlewareHandler;
  route(handler: (c: Context) => Response | Promise<Response>): (c: Context) => Response | Promise<Response>;
}

export function hardening(): Hardening {
  const memo = htmlPolicyMemo();
  return {
    middleware: () => async (c, next) => {
      const problem = oversizedUrlProblem(c.req.url);
      if (problem) throw problem;
      await next();
      if (!isComplete(c.res)) await addHeaders(c, memo);
    },
    route: (handler) => (c) => {
      const problem = oversizedUrlProblem(c.req.url);
      if (problem) throw problem;
      const response = handler(c);
      if (response instanceof Promise) return response.then((resolved) => finish(c, resolved, memo));
      return finish(c, response, memo);
    },
  };
}

function finish(c: Context, response: Response, memo: HtmlPolicyMemo): Response | Promise<Response> {
  if (isComplete(response)) return response;
  c.res = response;
  return addHeaders(c, memo).then(() => c.res);
}

async function addHeaders(c: Context, memo: HtmlPolicyMemo): Promise<void> {
  addCorsHeaders(c);
  await addSecurityHeaders(c, memo);
}
