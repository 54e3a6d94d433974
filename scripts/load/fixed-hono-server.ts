import { serve } from '@hono/node-server';
import { Hono } from 'hono';

/**
 * A reference for `npm run load -- --ceiling`: a Hono app on the same Node adapter as partsmith,
 * answering every request with a fixed sample response of n = 1000 and partsmith's exact response
 * headers, after busy-waiting WORK_US microseconds (default 0). It separates the cost of the HTTP
 * stack (adapter, Hono, headers) from the cost of per-request work: with WORK_US = 0 it is
 * the ceiling any Hono app here can reach; with WORK_US > 0 it shows what a given amount of
 * per-request work costs in the ratio on this machine.
 */
const workUs = Number(process.env.WORK_US ?? 0);
if (!Number.isFinite(workUs) || workUs < 0) throw new Error(`WORK_US must be a non-negative number, got ${process.env.WORK_US}`);

const HEADERS: Readonly<Record<string, string>> = {
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
const BODY =
  '{"family":{"kind":"partition","n":1000},"seed":"fixed","start":0,"method":"table-recursive/1","samples":[[109,62,59,56,52,50,37,36,36,29,22,22,22,21,20,19,16,16,16,16,14,14,13,12,12,12,8,8,8,8,8,7,7,7,7,7,7,7,7,7,6,6,5,5,4,4,4,3,3,3,3,3,3,3,3,3,3,3,3,3,3,3,2,2,2,2,2,1,1,1,1,1,1,1,1,1,1,1,1,1,1,1]]}';

const app = new Hono();
app.get('/v1/partitions', () => {
  if (workUs > 0) {
    const until = performance.now() + workUs / 1000;
    while (performance.now() < until);
  }
  return new Response(BODY, { status: 200, headers: { ...HEADERS } });
});

const server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' }, (info) => console.log(`fixed Hono server listening on http://127.0.0.1:${info.port}`));
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.close(() => process.exit(0)));
