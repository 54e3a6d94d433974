import { serve } from '@hono/node-server';
import { fixedHonoApp, samplingHonoApp } from './reference-apps.js';

/**
 * A reference server for `npm run load` (see reference-apps.ts): with SAMPLE=1 the Hono app that
 * draws the requested sample with the core and nothing else; otherwise the fixed-body app, after
 * busy-waiting WORK_US microseconds per request (default 0; `npm run load -- --ceiling`).
 */
const workUs = Number(process.env.WORK_US ?? 0);
if (!Number.isFinite(workUs) || workUs < 0) throw new Error(`WORK_US must be a non-negative number, got ${process.env.WORK_US}`);

const app = process.env.SAMPLE === '1' ? samplingHonoApp() : fixedHonoApp(workUs);
const server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' }, (info) => console.log(`fixed Hono server listening on http://127.0.0.1:${info.port}`));
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.close(() => process.exit(0)));
