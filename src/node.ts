import { serve } from '@hono/node-server';
import { createApp } from './http/app.js';
import { ConfigurationError, DEFAULT_LIMITS, limitsFromEnvironment, unknownSettings, type Limits } from './http/limits.js';

/**
 * Node entry point: `npm start`. PORT and HOST override the defaults; PARTSMITH_* variables set
 * the limits (see LIMIT_SETTINGS). Bad values stop the server here, with a message saying why.
 */
const port = Number(process.env.PORT ?? 8787);
const host = process.env.HOST ?? '127.0.0.1';
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`PORT must be a whole number from 0 to 65535, got ${JSON.stringify(process.env.PORT)}`);
  process.exit(2);
}

let limits: Partial<Limits>;
try {
  limits = limitsFromEnvironment(process.env);
} catch (error) {
  if (!(error instanceof ConfigurationError)) throw error;
  console.error(`partsmith: ${error.message}`);
  process.exit(2);
}
for (const name of unknownSettings(process.env)) console.warn(`partsmith: ignoring ${name}, which is not a setting (typo?)`);

const server = serve({ fetch: createApp({ limits, clock: () => performance.now() }).fetch, port, hostname: host }, (info) => {
  const base = `http://${host.includes(':') ? `[${host}]` : host}:${info.port}`;
  const effective = { ...DEFAULT_LIMITS, ...limits };
  console.log(`partsmith listening on ${base}`);
  console.log(`limits: count <= ${effective.maxCount}, numbers <= ${effective.maxNumbers}, work <= ${effective.workBudgetMs} ms (estimated), deadline ${effective.deadlineMs} ms`);
  console.log(`try: curl '${base}/v1/partitions?n=20&count=3&seed=demo'`);
});

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => server.close(() => process.exit(0)));
}
