/**
 * Serving at the speed of the core: each row a ratio of two figures measured in this run, with
 * its target (issue 18).
 *
 * Requests are read with node:http (keep-alive), the leanest client at hand.
 *
 * 1. A streamed NDJSON body (about 1.7 MB, many 64 KiB chunks) from a real server in this
 *    process, read by a client in this process: wall time over the CPU time of the process (server and reader
 *    both). Above 1 means the stream waited on something other than its own work. Beside it,
 *    the same ratio of a busy loop after each round: what waiting for a core adds here.
 * 2. A fresh server (its own process, as `npm start` runs it, warm-up included): the first
 *    request for an n against the repeated ones, at n = 1e3, 1e6, 1e9 (fresh servers per n).
 *    Beside them, the first /healthz after the idle second against repeated ones: the part of
 *    a first request's time that no per-family work explains.
 * 3. Warm server, n = 1e9, as=multiplicities: the HTTP answer time (over loopback) against the
 *    core sampler alone on the same family; beside it, the floor of any Node server for that
 *    answer: a bare node:http handler that draws the sample with the same sampler, encodes it
 *    with the same byte writer and writes the bytes (no Hono, no query, limits or caching).
 * 4. An unrestricted composition of 1e6 written as the JSON text the service sends, as the
 *    core's typed parts, and as the library's number[], against the same algorithm writing its parts into a typed array in one
 *    pass (the floor).
 */
import { serve, type ServerType } from '@hono/node-server';
import { Agent, createServer, get, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { resolve } from 'node:path';
import { unrestrictedSampler } from '../../src/core/compositions/unrestricted.js';
import { familyKey } from '../../src/core/family.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import type { RandomSource } from '../../src/core/random.js';
import { SampleStreams } from '../../src/core/seeding.js';
import { createApp } from '../../src/http/app.js';
import { compositionAsParts, partitionAsMultiplicities } from '../../src/http/encode.js';
import { startServer } from '../load/servers.js';

const ROOT = resolve(import.meta.dirname, '../..');

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  return s[s.length >> 1];
}

function row(name: string, a: number, b: number, unit: string, target: number): void {
  const ratio = a / b;
  console.log(`| ${name} | ${a.toFixed(2)} ${unit} | ${b.toFixed(2)} ${unit} | ${ratio.toFixed(2)} | <= ${target} | ${ratio <= target ? 'yes' : 'no'} |`);
}

async function listen(): Promise<{ server: ServerType; origin: string }> {
  const app = createApp({ clock: () => performance.now() });
  const server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' });
  await new Promise((done) => server.once('listening', done));
  return { server, origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

async function close(server: ServerType): Promise<void> {
  (server as { closeAllConnections?: () => void }).closeAllConnections?.();
  await new Promise((done) => server.close(done));
}

/** Keep-alive connections, as a client that sends more than one request holds them. */
const agent = new Agent({ keepAlive: true });

/**
 * Milliseconds until the whole body of `url` was read, by node:http (the leanest client here,
 * so that the figure is mostly the server's).
 */
function timeGet(url: string): Promise<{ ms: number; bytes: number }> {
  const t0 = performance.now();
  return new Promise((done, fail) => {
    get(url, { agent }, (response) => {
      let bytes = 0;
      response.on('data', (chunk: Buffer) => (bytes += chunk.length));
      response.on('end', () => (response.statusCode === 200 ? done({ ms: performance.now() - t0, bytes }) : fail(new Error(`${url}: ${response.statusCode}`))));
      response.on('error', fail);
    }).on('error', fail);
  });
}

async function streamedWallOverCpu(origin: string): Promise<void> {
  const url = (r: number) => `${origin}/v1/partitions?n=1000&count=7000&seed=stream-${r}&format=ndjson`;
  for (let r = 0; r < 3; r++) await timeGet(url(r)); // warm-up
  const walls: number[] = [];
  const cpus: number[] = [];
  const ratios: number[] = [];
  const loopRatios: number[] = [];
  let bytes = 0;
  for (let r = 0; r < 15; r++) {
    const cpu0 = process.cpuUsage();
    const got = await timeGet(url(100 + r));
    const cpu = process.cpuUsage(cpu0);
    walls.push(got.ms);
    cpus.push((cpu.user + cpu.system) / 1000);
    ratios.push(got.ms / cpus[cpus.length - 1]);
    bytes = got.bytes;
    loopRatios.push(busyLoopWallOverCpu(cpus[cpus.length - 1]));
  }
  // The ratio of each round, then their median: on a shared machine a round where this process
  // waited for a core counts as one round, not as a shift of the wall-time median only.
  const ratio = median(ratios);
  console.log(
    `| streamed NDJSON (${(bytes / 1e6).toFixed(2)} MB, ${Math.ceil(bytes / 65536)} chunks): wall / CPU, median of per-round ratios | ${median(walls).toFixed(2)} ms | ${median(cpus).toFixed(2)} ms | ${ratio.toFixed(2)} | <= 1.1 | ${ratio <= 1.1 ? 'yes' : 'no'} |`,
  );
  console.log(`| the same rounds, a busy loop of the stream's CPU time (no I/O): wall / CPU, median of per-round ratios | | | ${median(loopRatios).toFixed(2)} | (reference) | |`);
}

/**
 * Wall over CPU time of arithmetic alone for about `cpuMs` of CPU: above 1 by however long this
 * process waited for a core (the machine is shared), the part of the stream's ratio that is no
 * wait of the stream's own.
 */
let loopSink = 0;

function busyLoopWallOverCpu(cpuMs: number): number {
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  let x = 0;
  for (;;) {
    for (let i = 0; i < 100_000; i++) x = (x * 1103515245 + 12345) | 0;
    const cpu = process.cpuUsage(cpu0);
    if ((cpu.user + cpu.system) / 1000 >= cpuMs) {
      loopSink = x; // kept, so that the loop is not dropped as dead code
      return (performance.now() - t0) / ((cpu.user + cpu.system) / 1000);
    }
  }
}

/** A client warmed on a throwaway node:http server, so that its own first request is not timed. */
async function warmClient(): Promise<void> {
  const server = createServer((_q, s) => s.end('{}'));
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  const port = (server.address() as AddressInfo).port;
  for (let i = 0; i < 50; i++) await timeGet(`http://127.0.0.1:${port}/`);
  server.closeAllConnections();
  await new Promise((done) => server.close(done));
}

/** Fresh servers per n: a first request is one measurement, so it is taken on several servers. */
const FRESH_SERVERS = 3;

export async function coldOverWarm(): Promise<void> {
  await warmClient();
  // The same first-after-idle ratio for /healthz, which does no per-family work: what waking an
  // idle server costs any request on this machine (caches refilled after other processes ran).
  const healthFirsts: number[] = [];
  const healthRepeated: number[] = [];
  for (const n of [1e3, 1e6, 1e9]) {
    const firsts: number[] = [];
    const repeated: number[] = [];
    for (let k = 0; k < FRESH_SERVERS; k++) {
      const server = await startServer('partsmith', resolve(ROOT, 'src/node.ts'));
      try {
        const url = (seed: string) => `${server.origin}/v1/partitions?n=${n}&seed=${seed}&as=multiplicities`;
        // Started and idle (the compilations its warm-up queued are done), as a server is when
        // its first client arrives; the connection is opened by a request to another path.
        await new Promise((done) => setTimeout(done, 1000));
        healthFirsts.push((await timeGet(`${server.origin}/healthz`)).ms);
        firsts.push((await timeGet(url('first'))).ms);
        for (let r = 0; r < 5; r++) repeated.push((await timeGet(url(`again-${r}`))).ms);
        for (let r = 0; r < 5; r++) healthRepeated.push((await timeGet(`${server.origin}/healthz`)).ms);
      } finally {
        await server.stop();
      }
    }
    row(`fresh server, n = ${n.toExponential(0)}: first / repeated request (medians, ${FRESH_SERVERS} servers)`, median(firsts), median(repeated), 'ms', 2);
  }
  const [first, again] = [median(healthFirsts), median(healthRepeated)];
  console.log(`| the same servers, GET /healthz after the idle second: first / repeated (medians, ${healthFirsts.length} servers) | ${first.toFixed(2)} ms | ${again.toFixed(2)} ms | ${(first / again).toFixed(2)} | (reference) | |`);
}

/**
 * The floor of an HTTP answer of one sample at n, as=multiplicities, in Node: node:http alone,
 * drawing sample 0 of the query's seed and writing it as the one-sample body (the same bytes as
 * partsmith's but for the head: the family, seed and method are left out).
 */
async function bareSamplingServer(n: number): Promise<{ server: Server; origin: string }> {
  const sampler = planPartitionSampler({ kind: 'partition', n });
  const streams = new SampleStreams(familyKey({ kind: 'partition', n }));
  const server = createServer((request, response) => {
    const seed = new URLSearchParams(request.url!.slice(request.url!.indexOf('?') + 1)).get('seed') ?? 'bare';
    const body = partitionAsMultiplicities.jsonBytes!(sampler.sample(streams.source(seed, 0)), '{"samples":[', ']}')!;
    response.writeHead(200, { 'content-type': 'application/json; charset=utf-8', 'content-length': body.length });
    response.end(body);
  });
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  return { server, origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

async function httpOverCore(origin: string): Promise<void> {
  const n = 1e9;
  const sampler = planPartitionSampler({ kind: 'partition', n });
  const streams = new SampleStreams(familyKey({ kind: 'partition', n }));
  const bare = await bareSamplingServer(n);
  try {
    const url = (r: number) => `${origin}/v1/partitions?n=${n}&seed=core-${r}&as=multiplicities`;
    const bareUrl = (r: number) => `${bare.origin}/?seed=core-${r}`;
    for (let r = 0; r < 5; r++) {
      await timeGet(url(r));
      await timeGet(bareUrl(r));
      sampler.sample(streams.source(`core-${r}`, 0));
    }
    const http: number[] = [];
    const floor: number[] = [];
    const core: number[] = [];
    // The same seeds on each side, so each median is over the same samples.
    for (let r = 0; r < 21; r++) {
      http.push((await timeGet(url(100 + r))).ms);
      floor.push((await timeGet(bareUrl(100 + r))).ms);
      const t0 = performance.now();
      sampler.sample(streams.source(`core-${100 + r}`, 0));
      core.push(performance.now() - t0);
    }
    row('n = 1e9 as=multiplicities: HTTP answer / core sample', median(http), median(core), 'ms', 1.5);
    console.log(`| n = 1e9 as=multiplicities: the floor, bare node:http sampling and writing the same bytes / core sample | ${median(floor).toFixed(2)} ms | ${median(core).toFixed(2)} ms | ${(median(floor) / median(core)).toFixed(2)} | (reference) | |`);
    console.log(`| n = 1e9 as=multiplicities: HTTP answer / that floor | ${median(http).toFixed(2)} ms | ${median(floor).toFixed(2)} ms | ${(median(http) / median(floor)).toFixed(2)} | (reference) | |`);
  } finally {
    await new Promise((done) => bare.server.close(done));
  }
}

/** The floor: the unrestricted sampler's loop in one pass, its parts written into a typed array. */
function unrestrictedFloor(source: RandomSource, n: number): Int32Array {
  const parts = new Int32Array(n);
  let length = 0;
  const gaps = n - 1;
  let last = 0;
  for (let base = 0; base < gaps; base += 32) {
    let word = source.nextUint32();
    const used = gaps - base;
    if (used < 32) word &= (1 << used) - 1;
    while (word !== 0) {
      const lowest = word & -word;
      const gap = base + (31 - Math.clz32(lowest)) + 1;
      parts[length++] = gap - last;
      last = gap;
      word ^= lowest;
    }
  }
  parts[length++] = n - last;
  return parts.subarray(0, length);
}

function compositionOverFloor(): void {
  const n = 1e6;
  const sampler = unrestrictedSampler(n);
  const streams = new SampleStreams(familyKey({ kind: 'composition', n }));
  const paths: Record<string, (i: number) => unknown> = {
    floor: (i) => unrestrictedFloor(streams.source('floor', i), n),
    typed: (i) => sampler.sampleParts!(streams.source('floor', i)),
    text: (i) => compositionAsParts.json(sampler.sampleParts!(streams.source('floor', i))),
    list: (i) => sampler.sample(streams.source('floor', i)),
  };
  const times: Record<string, number[]> = Object.fromEntries(Object.keys(paths).map((k) => [k, []]));
  for (let r = 0; r < 31; r++) {
    for (const [name, once] of Object.entries(paths)) {
      const t0 = performance.now();
      once(r);
      if (r >= 5) times[name].push(performance.now() - t0);
    }
  }
  const floor = median(times.floor);
  row('composition n = 1e6, JSON text as served (typed parts + int-text) / typed-array floor', median(times.text), floor, 'ms', 3);
  row('composition n = 1e6, typed parts (sampleParts) / typed-array floor', median(times.typed), floor, 'ms', 3);
  row("composition n = 1e6, as a number[] (the library's sample) / typed-array floor", median(times.list), floor, 'ms', 3);
}

export async function benchServing(): Promise<void> {
  console.log('| row | measured | baseline | ratio | target | met |');
  console.log('|---|---:|---:|---:|---:|:---:|');
  const { server, origin } = await listen();
  try {
    await streamedWallOverCpu(origin);
    await httpOverCore(origin);
  } finally {
    await close(server);
  }
  compositionOverFloor();
  await coldOverWarm();
  console.log('\nImport time (library / core, target <= 2): see the library section.');
}
