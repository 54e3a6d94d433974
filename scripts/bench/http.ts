/**
 * In-process cost of one HTTP request (no sockets), so a change to the HTTP layer can be
 * measured without the noise of a load test: a seeded single-sample request at n = 1000 and
 * n = 10 through the Node adapter's request listener (as `npm start` serves it, with stand-ins
 * for node:http's request and response objects that only record what is written), beside the
 * two Hono references of `npm run load` (scripts/load/reference-apps.ts), through `app.fetch`
 * with a Fetch Request, and the pieces a request is made of. Times are medians of rounds of
 * 2,000 calls, in CPU microseconds per call (the process's CPU time: this machine's cores are shared).
 */
import { getRequestListener } from '@hono/node-server';
import { familyKey } from '../../src/core/family.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { SampleStreams, sampleSource } from '../../src/core/seeding.js';
import { createApp } from '../../src/http/app.js';
import { SeedEtags, strongEtag } from '../../src/http/caching.js';
import { parseQuery, QueryReader } from '../../src/http/query.js';
import { partitionFamilyOf } from '../../src/library/partitions.js';
import { partitionsQuery } from '../../src/schemas/partitions.js';
import { fixedHonoApp, samplingHonoApp } from '../load/reference-apps.js';

const ROUNDS = 7;
const CALLS = 2000;

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  return s[s.length >> 1];
}

/**
 * CPU µs per call of CALLS calls of `once(i)` (sync or async), from index `i`: the process's
 * CPU time, not the wall clock, since on a shared machine this process waits for a core for
 * much of the wall time (everything here runs on the main thread; GC helpers count too).
 */
async function oneRound(once: (i: number) => unknown, i: number): Promise<number> {
  const cpu0 = process.cpuUsage();
  for (let k = 0; k < CALLS; k++) {
    const result = once(i + k);
    if (result instanceof Promise) await result;
  }
  const cpu = process.cpuUsage(cpu0);
  return (cpu.user + cpu.system) / CALLS;
}

/** Median CPU µs per call of `once(i)` (sync or async), over ROUNDS rounds of CALLS calls. */
async function microseconds(once: (i: number) => unknown): Promise<number> {
  return (await interleaved([once]))[0];
}

/**
 * Median CPU µs per call of each of `ways`, measured in alternating rounds (A B C A B C ...) after
 * a warm-up round each, so that a machine whose speed drifts slows them alike.
 */
async function interleaved(ways: readonly ((i: number) => unknown)[]): Promise<number[]> {
  let i = 0;
  for (const once of ways) await oneRound(once, (i += CALLS)); // warm-up
  const rounds: number[][] = ways.map(() => []);
  for (let r = 0; r < ROUNDS; r++) for (const [k, once] of ways.entries()) rounds[k].push(await oneRound(once, (i += CALLS)));
  return rounds.map(median);
}

/** node:http's test of a header value (lib/_http_common.js, checkInvalidHeaderChar). */
const INVALID_HEADER_CHAR = /[^\t\x20-\x7e\x80-\xff]/;

/**
 * What the adapter's listener needs of node:http's IncomingMessage and ServerResponse; the
 * request's headers are those undici's Pool sends (`npm run load`'s client).
 */
function fakeExchange(path: string, done: (bytes: number) => void) {
  const incoming = { method: 'GET', url: path, headers: { host: '127.0.0.1:8787', connection: 'keep-alive' }, rawHeaders: ['host', '127.0.0.1:8787', 'connection', 'keep-alive'], socket: { encrypted: false } };
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
      for (const key in headers) {
        const value = String(headers[key]);
        // node:http checks every header value so (checkInvalidHeaderChar); its cost depends on the string's shape.
        if (INVALID_HEADER_CHAR.test(value)) throw new TypeError(`invalid character in header ${key}`);
        bytes += key.length + value.length + 4;
      }
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
  const etags = new SeedEtags('/v1/partitions', { n: 1000, count: 1, seed: 'a64-0', start: 0, format: 'json', as: 'parts' });
  const referenceOnce = (fetch: (request: Request) => Response | Promise<Response>) => {
    const referenceListener = getRequestListener(fetch);
    return (i: number) =>
      new Promise<number>((resolve) => {
        const { incoming, outgoing } = fakeExchange(path(1000, i), resolve);
        void referenceListener(incoming as never, outgoing as never);
      });
  };
  // The three `npm run load` compares at n = 1000, side by side: partsmith, and its two Hono references.
  const [fixedUs, samplingUs, partsmithUs] = await interleaved([referenceOnce(fixedHonoApp().fetch), referenceOnce(samplingHonoApp().fetch), listenOnce(1000)]);
  const rows: [string, number][] = [
    ["Node adapter listener, Hono fixed-body reference (`npm run load`'s)", fixedUs],
    ["Node adapter listener, Hono + core sample reference, n = 1000 (`npm run load`'s)", samplingUs],
    ['Node adapter listener, n = 1000, 1 sample', partsmithUs],
    ['  partsmith − Hono + core sample (what partsmith adds to a Hono app that samples)', partsmithUs - samplingUs],
    ['Node adapter listener, n = 10, 1 sample', await microseconds(listenOnce(10))],
    ['app.fetch + body read, n = 1000, 1 sample', await microseconds(fetchOnce(1000))],
    ['new Request(url) only', await microseconds((i) => new Request(url(1000, i)))],
    ['parseQuery (zod, whole query)', await microseconds((i) => parseQuery(url(1000, i), partitionsQuery))],
    ['QueryReader.read (zod: the seed; the rest remembered)', await microseconds((i) => reader.read(url(1000, i)).query)],
    ['familyKey(partitionFamilyOf(query))', await microseconds(() => familyKey(partitionFamilyOf({ n: 1000 } as never)))],
    ['strongEtag(parsed query)', await microseconds((i) => strongEtag('/v1/partitions', { n: 1000, count: 1, seed: `a64-${i}`, start: 0, format: 'json', as: 'parts' }))],
    ["SeedEtags.etag + node:http's header-value check", await microseconds((i) => INVALID_HEADER_CHAR.test(etags.etag(`a64-${i}`)))],
    ['sampleSource (stream seeding, whole key)', await microseconds((i) => sampleSource(`a64-${i}`, 0, key))],
    ['SampleStreams.source (family prefix hashed once)', await microseconds((i) => streams.source(`a64-${i}`, 0))],
    ['sampler.sample, n = 1000', await microseconds((i) => sampler.sample(streams.source(`a64-${i}`, 0)))],
  ];
  console.log('| step | CPU µs per call |');
  console.log('|---|---:|');
  for (const [name, us] of rows) console.log(`| ${name} | ${us.toFixed(1)} |`);
}
