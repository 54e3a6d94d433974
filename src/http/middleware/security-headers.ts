import type { Context, MiddlewareHandler } from 'hono';
import { API_CONTENT_SECURITY_POLICY } from './complete-response.js';

export { API_CONTENT_SECURITY_POLICY } from './complete-response.js';

/**
 * Policy for HTML pages of this service, apart from the inline scripts and styles it allows by
 * hash. Everything loads from the service's own origin only; no 'unsafe-inline', no eval, no
 * style or event-handler attributes (those cannot be allowed by hash without 'unsafe-hashes').
 */
const HTML_POLICY_BASE = [
  "default-src 'none'",
  "img-src 'self' data:",
  "font-src 'self'",
  "connect-src 'self'",
  "manifest-src 'self'",
  "base-uri 'none'",
  "form-action 'self'",
  "frame-ancestors 'none'",
];

const INLINE_SCRIPT = /<script\b([^>]*)>([\s\S]*?)<\/script\s*>/gi;
const INLINE_STYLE = /<style\b[^>]*>([\s\S]*?)<\/style\s*>/gi;

/** The exact text of each inline <script> (without src) and <style> element of a page. */
export function inlineSources(html: string): { scripts: string[]; styles: string[] } {
  const scripts = [...html.matchAll(INLINE_SCRIPT)].filter((m) => !/\bsrc\s*=/i.test(m[1])).map((m) => m[2]);
  const styles = [...html.matchAll(INLINE_STYLE)].map((m) => m[1]);
  return { scripts, styles };
}

/** A CSP hash source for one inline element: 'sha256-<base64 of SHA-256 of its UTF-8 text>' (CSP Level 3, §8.4). */
export async function cspHash(text: string): Promise<string> {
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(text)));
  let binary = '';
  for (const byte of digest) binary += String.fromCharCode(byte);
  return `'sha256-${btoa(binary)}'`;
}

/**
 * The Content-Security-Policy for an HTML page: same-origin resources, plus exactly the inline
 * scripts and styles the page contains, allowed by their SHA-256 hashes. A page handler may set
 * this header itself (e.g. computed once at startup); otherwise the middleware computes it from
 * the response body. Any change to an inline block changes its hash, so the policy must be
 * computed from the final HTML, byte for byte.
 */
export async function htmlContentSecurityPolicy(html: string): Promise<string> {
  const { scripts, styles } = inlineSources(html);
  const scriptHashes = [...new Set(await Promise.all(scripts.map(cspHash)))];
  const styleHashes = [...new Set(await Promise.all(styles.map(cspHash)))];
  return [
    ...HTML_POLICY_BASE,
    ["script-src 'self'", ...scriptHashes].join(' '),
    ["style-src 'self'", ...styleHashes].join(' '),
  ].join('; ');
}

/**
 * Sets `X-Content-Type-Options: nosniff`, `Referrer-Policy: no-referrer` and a
 * Content-Security-Policy on every response (errors included): the API policy for data, the
 * hash-based policy for HTML unless the handler already set one.
 */
export function securityHeaders(): MiddlewareHandler {
  const memo = htmlPolicyMemo();
  return async (c, next) => {
    await next();
    await addSecurityHeaders(c, memo);
  };
}

/** One-entry memo of the last HTML page's policy: pages are usually the same bytes on every request; never grows. */
export interface HtmlPolicyMemo {
  html: string | undefined;
  policy: string;
}

export function htmlPolicyMemo(): HtmlPolicyMemo {
  return { html: undefined, policy: '' };
}

/** Sets the security headers on the context's response (see securityHeaders). */
export async function addSecurityHeaders(c: Context, memo: HtmlPolicyMemo): Promise<void> {
  let response = c.res;
  const type = response.headers.get('content-type') ?? '';
  if (/^text\/html\b/i.test(type) && !response.headers.has('content-security-policy') && response.body) {
    const html = await response.text();
    if (html !== memo.html) {
      memo.policy = await htmlContentSecurityPolicy(html);
      memo.html = html;
    }
    response = new Response(html, response);
    response.headers.set('content-security-policy', memo.policy);
    c.res = response; // Hono copies the old headers over; they have no policy, so this one stays
  } else if (!response.headers.has('content-security-policy')) {
    response.headers.set('content-security-policy', API_CONTENT_SECURITY_POLICY);
  }
  c.res.headers.set('x-content-type-options', 'nosniff');
  c.res.headers.set('referrer-policy', 'no-referrer');
}
