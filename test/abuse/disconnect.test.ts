import { serve, type ServerType } from '@hono/node-server';
import { connect, type Socket } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';

/**
 * A real Node server (in-process, ephemeral loopback port) streaming NDJSON: when the client goes
 * away, sampling stops. The app's clock is read once per sample (the deadline check), so the
 * number of clock readings is an exact counter of samples drawn — instrumentation without
 * touching the code under test. CPU time of this process is the second witness.
 */
let readings = 0;
let server: ServerType;
let port: number;

beforeAll(async () => {
  const app = createApp({
    clock: () => (readings++, performance.now()),
    // Limits raised so that one request may ask for 10^6 samples and a minute of time.
    limits: { maxCount: 1_000_000, maxNumbers: 1e9, maxWork: 1e12, deadlineMs: 60_000 },
  });
  server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' });
  await new Promise((resolve) => server.once('listening', resolve));
  port = (server.address() as AddressInfo).port;
});

afterAll(async () => {
  (server as { closeAllConnections?: () => void }).closeAllConnections?.();
  await new Promise((resolve) => server.close(resolve));
});

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

describe('a client that disconnects from an NDJSON stream of 10^6 samples', () => {
  it('stops sampling within a second: no samples drawn and no CPU spent afterwards', async () => {
    const before = readings;
    const { socket } = await startMillionSampleStream();
    socket.destroy();
    const atAbort = readings - before;
    await sleep(500); // grace: the chunk in hand when the close event arrives may finish
    const settled = readings - before;
    const cpuStart = process.cpuUsage();
    await sleep(500);
    const cpu = process.cpuUsage(cpuStart);
    const final = readings - before;

    expect(final).toBe(settled); // nothing drawn between 0.5 s and 1 s after the abort
    expect(settled - atAbort).toBeLessThan(20_000); // at most a few 64 KiB chunks after the abort
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
      let last = -1;
      for (let waited = 0; readings !== last && waited < 8000; waited += 500) {
        last = readings;
        await sleep(500);
      }
      expect(readings).toBe(last);
      expect(readings - before).toBeLessThan(500_000); // bounded by buffers, not by count
    } finally {
      socket.destroy();
    }
  });
});
