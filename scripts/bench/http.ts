/**
 * In-process cost of one HTTP request (no sockets), so a change to the HTTP layer can be
 * measured without the noise of a load test: a seeded single-sample request at n = 1000 and
 * n = 10 through the Node adapter's request listener (as `npm start` serves it, with stand-ins
 * for node:http's request and response objects that only record what is written), through
 * `app.fetch` with a Fetch Request, and the pieces a request is made of. Times are medians of
 * rounds of 2,000 calls, in microseconds per call.
 */
import { getRequestListener } from '@hono/node-server';
import { Hono } from 'hono';
import { familyKey } from '../../src/core/family.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { SampleStreams, sampleSource } from '../../src/core/seeding.js';
import { createApp } from '../../src/http/app.js';
import { strongEtag } from '../../src/http/caching.js';
import { parseQuery, QueryReader } from '../../src/http/query.js';
import { partitionFamilyOf } from '../../src/library/partitions.js';
import { partitionsQuery } from '../../src/schemas/partitions.js';
import { FIXED_HEADERS } from '../load/fixed-headers.js';

const ROUNDS = 7;
const CALLS = 2000;

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  return s[s.length >> 1];
}

/** Median µs per call of `once(i)` (sync or async), over ROUNDS rounds of CALLS calls. */
async function microseconds(once: (i: number) => unknown): Promise<number> {
  let i = 0;
  for (let k = 0; k < CALLS; k++) await once(i++); // warm-up
  const rounds: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    const t0 = performance.now();
    for (let k = 0; k < CALLS; k++) {
      const result = once(i++);
      if (result instanceof Promise) await result;
    }
    rounds.push(((performance.now() - t0) * 1000) / CALLS);
  }
  return median(rounds);
}

/** What the adapter's listener needs of node:http's IncomingMessage and ServerResponse. */
function fakeExchange(path: string, done: (bytes: number) => void) {
  const incoming = { method: 'GET', url: path, headers: { host: '127.0.0.1' }, rawHeaders: ['Host', '127.0.0.1'], socket: { encrypted: false } };
  let bytes = 0;
  const outgoing = {
    _contentLength: null,
    _hasBody: true,
    useChunkedEncodingByDefault: true,
    _removedContLen: false,
    writable: true,
    destroyed: false,
    writableFinished: false,
    hasHeader: () => false,
    writeHead(_status: number, headers: Record<string, unknown> = {}) {
      for (const key in headers) bytes += key.length + String(headers[key]).length + 4;
    },
    write(chunk: string | Uint8Array) {
      bytes += chunk.length;
      return true;
    },
    end(chunk?: string | Uint8Array) {
      if (chunk) bytes += chunk.length;
      this.writableFinished = true;
      done(bytes);
    },
    on: () => outgoing,
    once: () => outgoing,
    flushHeaders() {},
  };
  return { incoming, outgoing };
}

/** The Hono reference of `npm run load` (scripts/load/fixed-hono-server.ts): partsmith's headers, a fixed n = 1000 body. */
const FIXED_BODY = `{"family":{"kind":"partition","n":1000},"seed":"fixed","start":0,"method":"table-recursive/1","samples":[[${'7,'.repeat(80)}1]]}`;

export async function benchHttp(): Promise<void> {
  const app = createApp();
  const listener = getRequestListener(app.fetch); // also installs the adapter's Request/Response
  const path = (n: number, i: number) => `/v1/partitions?n=${n}&count=1&seed=a64-${i}`;
  const url = (n: number, i: number) => `http://127.0.0.1${path(n, i)}`;
  const listenOnce = (n: number) => (i: number) =>
    new Promise<number>((resolve) => {
      const { incoming, outgoing } = fakeExchange(path(n, i), resolve);
      void listener(incoming as never, outgoing as never);
    });
  const fetchOnce = (n: number) => async (i: number) => {
    const response = await app.fetch(new Request(url(n, i)));
    await response.text();
  };
  const family = partitionFamilyOf(parseQuery(url(1000, 0), partitionsQuery));
  const sampler = planPartitionSampler(family);
  const key = familyKey(family);
  const reader = new QueryReader(partitionsQuery);
  const streams = new SampleStreams(key);
  const reference = new Hono();
  reference.get('/v1/partitions', () => new Response(FIXED_BODY, { status: 200, headers: { ...FIXED_HEADERS } }));
  const referenceListener = getRequestListener(reference.fetch);
  const referenceOnce = (i: number) =>
    new Promise<number>((resolve) => {
      const { incoming, outgoing } = fakeExchange(path(1000, i), resolve);
      void referenceListener(incoming as never, outgoing as never);
    });
  const rows: [string, number][] = [
    ['Node adapter listener, Hono fixed-body reference (as `npm run load`\'s)', await microseconds(referenceOnce)],
    ['Node adapter listener, n = 1000, 1 sample', await microseconds(listenOnce(1000))],
    ['Node adapter listener, n = 10, 1 sample', await microseconds(listenOnce(10))],
    ['app.fetch + body read, n = 1000, 1 sample', await microseconds(fetchOnce(1000))],
    ['new Request(url) only', await microseconds((i) => new Request(url(1000, i)))],
    ['parseQuery (zod, whole query)', await microseconds((i) => parseQuery(url(1000, i), partitionsQuery))],
    ['QueryReader.read (zod: the seed; the rest remembered)', await microseconds((i) => reader.read(url(1000, i)).query)],
    ['familyKey(partitionFamilyOf(query))', await microseconds(() => familyKey(partitionFamilyOf({ n: 1000 } as never)))],
    ['strongEtag(parsed query)', await microseconds((i) => strongEtag('/v1/partitions', { n: 1000, count: 1, seed: `a64-${i}`, start: 0, format: 'json', as: 'parts' }))],
    ['sampleSource (stream seeding, whole key)', await microseconds((i) => sampleSource(`a64-${i}`, 0, key))],
    ['SampleStreams.source (family prefix hashed once)', await microseconds((i) => streams.source(`a64-${i}`, 0))],
    ['sampler.sample, n = 1000', await microseconds((i) => sampler.sample(streams.source(`a64-${i}`, 0)))],
  ];
  console.log('| step | µs per call |');
  console.log('|---|---:|');
  for (const [name, us] of rows) console.log(`| ${name} | ${us.toFixed(1)} |`);
}
