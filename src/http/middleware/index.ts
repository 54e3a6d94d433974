import type { MiddlewareHandler } from 'hono';
import { isComplete } from './complete-response.js';
import { addCorsHeaders } from './cors.js';
import { oversizedUrlProblem } from './request-size.js';
import { addSecurityHeaders, htmlPolicyMemo } from './security-headers.js';

export { ALLOWED_METHODS, CORS_EXPOSED_HEADERS, corsHeaders, otherMethods } from './cors.js';
export { API_HARDENING_HEADERS, completeResponse } from './complete-response.js';
export { MAX_PATH_LENGTH, MAX_URL_LENGTH, rejectOversizedUrls } from './request-size.js';
export { API_CONTENT_SECURITY_POLICY, cspHash, htmlContentSecurityPolicy, inlineSources, securityHeaders } from './security-headers.js';

/**
 * The middleware every request passes, as one handler (each async middleware layer costs a few
 * promises per request): oversized URLs are refused before any routing; then security and CORS
 * headers are added to every response, errors and 404s included. Responses built by
 * `completeResponse` already carry those headers and are passed through untouched. (A refused
 * URL becomes a problem response, which is built complete.)
 */
export function hardening(): MiddlewareHandler[] {
  const memo = htmlPolicyMemo();
  const harden: MiddlewareHandler = async (c, next) => {
    const problem = oversizedUrlProblem(c.req.url);
    if (problem) throw problem;
    await next();
    if (isComplete(c.res)) return;
    addCorsHeaders(c);
    await addSecurityHeaders(c, memo);
  };
  return [harden];
}
