import { serve } from '@hono/node-server';
import { Hono } from 'hono';
import { familyKey } from '../../src/core/family.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { SampleStreams } from '../../src/core/seeding.js';
import { partitionAsParts } from '../../src/http/encode.js';
import { FIXED_HEADERS } from './fixed-headers.js';

/**
 * A reference for `npm run load -- --ceiling`: a Hono app on the same Node adapter as partsmith,
 * answering every request with a fixed sample response of n = 1000 and partsmith's exact response
 * headers, after busy-waiting WORK_US microseconds (default 0). It separates the cost of the HTTP
 * stack (adapter, Hono, headers) from the cost of per-request work: with WORK_US = 0 it is
 * the ceiling any Hono app here can reach; with WORK_US > 0 it shows what a given amount of
 * per-request work costs in the ratio on this machine.
 *
 * With SAMPLE=1 it draws instead the sample the request asks for (n and seed from the query, no
 * validation) with the core's planned sampler and seeded streams, and writes it as partsmith
 * does (the same encoder, body form and headers, the ETag a fixed one): the ceiling of any Hono
 * app that samples, i.e. partsmith without its query schema, limits, caches and ETag.
 */
const workUs = Number(process.env.WORK_US ?? 0);
if (!Number.isFinite(workUs) || workUs < 0) throw new Error(`WORK_US must be a non-negative number, got ${process.env.WORK_US}`);

const BODY =
  '{"family":{"kind":"partition","n":1000},"seed":"fixed","start":0,"method":"table-recursive/1","samples":[[109,62,59,56,52,50,37,36,36,29,22,22,22,21,20,19,16,16,16,16,14,14,13,12,12,12,8,8,8,8,8,7,7,7,7,7,7,7,7,7,6,6,5,5,4,4,4,3,3,3,3,3,3,3,3,3,3,3,3,3,3,3,2,2,2,2,2,1,1,1,1,1,1,1,1,1,1,1,1,1,1,1]]}';

const sampleFromQuery = process.env.SAMPLE === '1';
const planned = new Map<number, { sampler: ReturnType<typeof planPartitionSampler>; streams: SampleStreams }>();

/** The body partsmith sends for sample `start` of `seed` at n (json, as=parts). */
function sampleBody(n: number, seed: string): string {
  let family = planned.get(n);
  if (family === undefined) {
    family = { sampler: planPartitionSampler({ kind: 'partition', n }), streams: new SampleStreams(familyKey({ kind: 'partition', n })) };
    planned.set(n, family);
  }
  const sample = family.sampler.sample(family.streams.source(seed, 0));
  return `{"family":${family.streams.familyKey},"seed":${JSON.stringify(seed)},"start":0,"method":${JSON.stringify(family.sampler.method)},"samples":[${partitionAsParts.json(sample)}]}`;
}

const app = new Hono();
app.get('/v1/partitions', (c) => {
  if (sampleFromQuery) {
    const seed = c.req.query('seed') ?? 'fixed';
    return new Response(sampleBody(Number(c.req.query('n')), seed), { status: 200, headers: { ...FIXED_HEADERS, 'partsmith-seed': seed } });
  }
  if (workUs > 0) {
    const until = performance.now() + workUs / 1000;
    while (performance.now() < until);
  }
  return new Response(BODY, { status: 200, headers: { ...FIXED_HEADERS } });
});

const server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' }, (info) => console.log(`fixed Hono server listening on http://127.0.0.1:${info.port}`));
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.close(() => process.exit(0)));
