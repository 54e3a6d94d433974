import { serve, type ServerType } from '@hono/node-server';
import { connect, type Socket } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { YIELD_AFTER_MS } from '../../src/http/yield-budget.js';

/**
 * A real Node server (in-process, ephemeral loopback port) streaming NDJSON: when the client goes
 * away, sampling stops. The app's clock is read once per sample (the deadline check), so the
 * number of clock readings is an exact counter of samples drawn — instrumentation without
 * touching the code under test. CPU time of this process is the second witness.
 *
 * The yield budget has its own clock (the app's turnClock), here one that moves a whole budget
 * at every reading: every chunk ends a turn of the event loop, so what is drawn after the client
 * goes away is counted in chunks, not in milliseconds of this machine's speed.
 */
let readings = 0;
let turnReadings = 0;
/** Samples drawn (clock readings) when the server's side of the last connection closed. */
let atServerClose = -1;
let server: ServerType;
let port: number;

beforeAll(async () => {
  const app = createApp({
    clock: () => (readings++, performance.now()),
    turnClock: () => YIELD_AFTER_MS * turnReadings++,
    // Limits raised so that one request may ask for 10^6 samples and a minute of time.
    limits: { maxCount: 1_000_000, maxNumbers: 1e9, workBudgetMs: 3_600_000, deadlineMs: 60_000 },
  });
  server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' });
  server.on('connection', (socket: Socket) => socket.on('close', () => (atServerClose = readings)));
  await new Promise((resolve) => server.once('listening', resolve));
  port = (server.address() as AddressInfo).port;
});

afterAll(async () => {
  (server as { closeAllConnections?: () => void }).closeAllConnections?.();
  await new Promise((resolve) => server.close(resolve));
});

/**
 * The most samples one chunk can hold: a chunk is cut once it reaches 64 KiB of text, and no
 * NDJSON line of n = 12 past index 999 is shorter than `{"index":1000,"parts":[12]}\n` (28 chars).
 */
const MAX_SAMPLES_PER_CHUNK = Math.ceil((64 * 1024) / 28) + 1;

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Opens a raw HTTP/1.1 request for 10^6 samples and resolves once the first lines arrived. */
async function startMillionSampleStream(): Promise<{ socket: Socket; received: () => number }> {
  const socket = connect(port, '127.0.0.1');
  let received = 0;
  let resolveFirst: () => void;
  const first = new Promise<void>((resolve) => (resolveFirst = resolve));
  socket.on('data', (chunk: Buffer) => {
    received += chunk.length;
    if (chunk.includes('{"index":')) resolveFirst();
  });
  socket.on('error', () => {});
  socket.write(`GET /v1/partitions?n=12&count=1000000&seed=gone&format=ndjson HTTP/1.1\r\nHost: 127.0.0.1\r\n\r\n`);
  await first;
  return { socket, received: () => received };
}

/** Polls `ready` every 10 ms for up to `boundMs`; returns whether it became true. */
async function until(ready: () => boolean, boundMs: number): Promise<boolean> {
  for (let waited = 0; waited <= boundMs; waited += 10) {
    if (ready()) return true;
    await sleep(10);
  }
  return ready();
}

/**
 * Resolves once no sample was drawn for `quietMs` (the readings counter stood still), checking
 * every `quietMs` for up to `boundMs`; returns whether it got quiet. A slow or loaded machine
 * only takes longer to get there; a producer that keeps drawing never does.
 */
async function untilNothingDrawnFor(quietMs: number, boundMs: number): Promise<boolean> {
  let last = -1;
  for (let waited = 0; waited <= boundMs; waited += quietMs) {
    if (readings === last) return true;
    last = readings;
    await sleep(quietMs);
  }
  return false;
}

describe('a client that disconnects from an NDJSON stream of 10^6 samples', () => {
  it('stops sampling: no samples drawn once the close is seen, and no CPU spent afterwards', async () => {
    const before = readings;
    atServerClose = -1;
    const { socket } = await startMillionSampleStream();
    socket.destroy();
    const atAbort = readings - before;
    // The end is the server's own close event, not a quiet spell: a starved machine only takes
    // longer to get there. Generous bound: 20 s (the test's own timeout is 60 s).
    expect(await until(() => atServerClose >= 0, 20_000)).toBe(true);
    const atClose = atServerClose - before;
    // Then let the process settle (socket teardown, collection) before the CPU window opens; any
    // sample drawn meanwhile fails the next assertion, however long the wait took.
    expect(await untilNothingDrawnFor(250, 20_000)).toBe(true);
    const settled = readings - before;
    // Nothing at all is drawn once the server has seen the close (its socket's close event).
    expect(settled).toBe(atClose);
    // Before that, at most the one chunk whose turn was already queued when the client went away:
    // the client's close is read in the loop's next poll phase (loopback delivers it at once),
    // and with every chunk ending a turn, one chunk at most is made before then.
    expect(settled - atAbort).toBeLessThanOrEqual(MAX_SAMPLES_PER_CHUNK);
    const cpuStart = process.cpuUsage();
    await sleep(500);
    const cpu = process.cpuUsage(cpuStart);
    const final = readings - before;

    expect(final).toBe(settled); // still nothing drawn 500 ms after it went quiet
    expect(final).toBeLessThan(100_000); // far from the 10^6 that were asked for
    // An idle process: well under a tenth of the 500 ms window (a spinning loop would use ~all of it).
    expect((cpu.user + cpu.system) / 1000).toBeLessThan(50);
  });

  it('also stops drawing while a connected client does not read (backpressure)', async () => {
    const before = readings;
    const { socket } = await startMillionSampleStream();
    socket.pause(); // connected, but not reading: the socket buffers (megabytes on loopback) fill up
    try {
      // Poll until nothing was drawn for 500 ms; a producer ignoring backpressure never gets there.
      expect(await untilNothingDrawnFor(500, 20_000)).toBe(true);
      expect(readings - before).toBeLessThan(500_000); // bounded by buffers, not by count
    } finally {
      socket.destroy();
    }
  });
});
