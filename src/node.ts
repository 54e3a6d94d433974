import { serve } from '@hono/node-server';
import { createApp } from './http/app.js';
import { warmUp } from './http/warm-up.js';
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

const app = createApp({ limits, clock: () => performance.now() });
const server = serve({ fetch: app.fetch, port, hostname: host }, async (info) => {
  const base = `http://${host.includes(':') ? `[${host}]` : host}:${info.port}`;
  // The first requests cost what later ones do once this has run (see warm-up.ts); the server
  // already answers meanwhile, and says it is ready after.
  try {
    await warmUp(async (path) => (await fetch(base + path)).arrayBuffer());
  } catch (error) {
    console.warn(`partsmith: warm-up failed (${error instanceof Error ? error.message : String(error)}); serving anyway`);
  }
  const effective = { ...DEFAULT_LIMITS, ...limits };
  console.log(`partsmith listening on ${base}`);
  console.log(`limits: count <= ${effective.maxCount}, numbers <= ${effective.maxNumbers}, work <= ${effective.workBudgetMs} ms (estimated), deadline ${effective.deadlineMs} ms`);
  console.log(`try: curl '${base}/v1/partitions?n=20&count=3&seed=demo'`);
});

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => server.close(() => process.exit(0)));
}
