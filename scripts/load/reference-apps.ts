import { Hono } from 'hono';
import { familyKey } from '../../src/core/family.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { SampleStreams } from '../../src/core/seeding.js';
import { partitionAsParts } from '../../src/http/encode.js';
import { FIXED_HEADERS } from './fixed-headers.js';

/**
 * The Hono references partsmith's serving is compared with, by `npm run load` (as servers, see
 * fixed-hono-server.ts) and `npm run bench -- http` (in process): Hono apps on the same Node
 * adapter, with partsmith's exact response headers (fixed-headers.ts).
 */

/** A fixed sample response of n = 1000 (seed "fixed"), as partsmith writes it. */
export const FIXED_BODY =
  '{"family":{"kind":"partition","n":1000},"seed":"fixed","start":0,"method":"table-recursive/1","samples":[[109,62,59,56,52,50,37,36,36,29,22,22,22,21,20,19,16,16,16,16,14,14,13,12,12,12,8,8,8,8,8,7,7,7,7,7,7,7,7,7,6,6,5,5,4,4,4,3,3,3,3,3,3,3,3,3,3,3,3,3,3,3,2,2,2,2,2,1,1,1,1,1,1,1,1,1,1,1,1,1,1,1]]}';

/**
 * Answers every GET /v1/partitions with FIXED_BODY after busy-waiting `workUs` microseconds:
 * with 0, the ceiling any Hono app here can reach; with more, what that much per-request work
 * costs on this machine.
 */
export function fixedHonoApp(workUs = 0): Hono {
  const app = new Hono();
  app.get('/v1/partitions', () => {
    if (workUs > 0) {
      const until = performance.now() + workUs / 1000;
      while (performance.now() < until);
    }
    return new Response(FIXED_BODY, { status: 200, headers: { ...FIXED_HEADERS } });
  });
  return app;
}

/**
 * Draws the sample the request asks for (n and seed from the query, no validation) with the
 * core's planned sampler and seeded streams, and writes it as partsmith does (the same encoder,
 * body form and headers, the ETag a fixed one): the ceiling of any Hono app that samples, i.e.
 * partsmith without its query schema, limits, caches and ETag.
 */
export function samplingHonoApp(): Hono {
  const planned = new Map<number, { sampler: ReturnType<typeof planPartitionSampler>; streams: SampleStreams }>();
  /** The body partsmith sends for sample 0 of `seed` at n (json, as=parts). */
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
    const seed = c.req.query('seed') ?? 'fixed';
    return new Response(sampleBody(Number(c.req.query('n')), seed), { status: 200, headers: { ...FIXED_HEADERS, 'partsmith-seed': seed } });
  });
  return app;
}
