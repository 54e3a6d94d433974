import { serve } from '@hono/node-server';
import { createApp } from './http/app.js';

/** Node entry point: `npm start`. PORT and HOST override the defaults. */
const port = Number(process.env.PORT ?? 8787);
const host = process.env.HOST ?? '127.0.0.1';
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`PORT must be a whole number from 0 to 65535, got ${JSON.stringify(process.env.PORT)}`);
  process.exit(2);
}

const server = serve({ fetch: createApp().fetch, port, hostname: host }, (info) => {
  const base = `http://${host.includes(':') ? `[${host}]` : host}:${info.port}`;
  console.log(`partsmith listening on ${base}`);
  console.log(`try: curl '${base}/v1/partitions?n=20&count=3&seed=demo'`);
});

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => server.close(() => process.exit(0)));
}
