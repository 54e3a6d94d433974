import { serve } from '@hono/node-server';
import { createApp } from '../http/app.js';
import { UsageError } from './flags.js';

/** `partsmith serve`: the same server as `npm start`, with --port/--host (or PORT/HOST). */
export function startServer(portText: string | undefined, hostText: string | undefined): Promise<never> {
  const port = Number(portText ?? process.env.PORT ?? 8787);
  const host = hostText ?? process.env.HOST ?? '127.0.0.1';
  if (!/^[0-9]{1,5}$/.test(String(portText ?? process.env.PORT ?? 8787)) || port > 65535) {
    throw new UsageError(`--port must be a whole number from 0 to 65535, got ${JSON.stringify(portText ?? process.env.PORT)}`);
  }
  return new Promise((_resolve, reject) => {
    const server = serve({ fetch: createApp().fetch, port, hostname: host }, (info) => {
      const base = `http://${host.includes(':') ? `[${host}]` : host}:${info.port}`;
      console.log(`partsmith listening on ${base}`);
      console.log(`try: curl '${base}/v1/partitions?n=20&count=3&seed=demo'`);
    });
    server.on('error', (error: Error) => reject(error));
    for (const signal of ['SIGINT', 'SIGTERM'] as const) {
      process.on(signal, () => server.close(() => process.exit(0)));
    }
  });
}
