import type { Hono } from 'hono';
import type { AppContext } from '../endpoint.js';
import { ProblemError } from '../problem.js';
import { readForm } from '../page/form.js';
import { renderPage } from '../page/render.js';
import { PAGE_JS } from '../page/script.js';
import { PAGE_CSS } from '../page/styles.js';
import { FAVICON_SVG } from '../page/render.js';

/** The page's own files: same origin, so `'self'` in the CSP covers them. */
export const PAGE_ASSETS = {
  '/assets/page.css': { body: PAGE_CSS, contentType: 'text/css; charset=utf-8' },
  '/assets/page.js': { body: PAGE_JS, contentType: 'text/javascript; charset=utf-8' },
  '/favicon.ico': { body: FAVICON_SVG, contentType: 'image/svg+xml' },
} as const;

/** Every path `registerPage` serves (the app puts its hardening middleware on exactly these). */
export const PAGE_PATHS: readonly string[] = ['/', ...Object.keys(PAGE_ASSETS)];

/**
 * The Content-Security-Policy the page works under: no inline script or style (the page uses
 * none; its drawings use presentation attributes only), assets and form submission same-origin.
 */
export const PAGE_CSP = "default-src 'none'; style-src 'self'; script-src 'self'; img-src 'self' data:; connect-src 'self'; form-action 'self'; base-uri 'none'; frame-ancestors 'none'";

/**
 * GET / (the page, server-rendered from its query: the form submits with GET, so every result
 * has a URL) and its two assets. Not API endpoints, so not in the OpenAPI document.
 */
export function registerPage(app: Hono, context: AppContext): void {
  app.get('/', (c) => {
    const url = new URL(c.req.url);
    const body = renderPage(url, readForm(url), context);
    return new Response(body, { status: 200, headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' } });
  });
  for (const [path, asset] of Object.entries(PAGE_ASSETS)) {
    app.get(path, () => new Response(asset.body, { status: 200, headers: { 'content-type': asset.contentType, 'cache-control': 'public, max-age=3600' } }));
  }
  for (const path of PAGE_PATHS) {
    app.all(path, (c) => {
      throw new ProblemError(405, `${c.req.method} is not supported on ${path}; use GET or HEAD.`, undefined, { allow: 'GET, HEAD' });
    });
  }
}
