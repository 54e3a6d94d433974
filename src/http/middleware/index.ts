import type { MiddlewareHandler } from 'hono';
import { corsHeaders } from './cors.js';
import { rejectOversizedUrls } from './request-size.js';
import { securityHeaders } from './security-headers.js';

export { ALLOWED_METHODS, CORS_EXPOSED_HEADERS, otherMethods } from './cors.js';
export { MAX_PATH_LENGTH, MAX_URL_LENGTH } from './request-size.js';
export { API_CONTENT_SECURITY_POLICY, cspHash, htmlContentSecurityPolicy, inlineSources } from './security-headers.js';

/**
 * The middleware every request passes, outermost first: headers are added to every response
 * (errors and 404s included), then oversized URLs are refused before any routing.
 */
export function hardening(): MiddlewareHandler[] {
  return [securityHeaders(), corsHeaders(), rejectOversizedUrls()];
}
