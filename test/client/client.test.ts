import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { createClient, PartsmithError, type PartsmithClient } from '../../src/client/index.js';
import { ok, problem, startApp, startScripted, type Running } from './servers.js';

/** The client against the real app on an ephemeral port: answers equal the app's own. */
describe('client against the real app', () => {
  let server: Running;
  let client: PartsmithClient;
  const app = createApp();
  const direct = async (path: string) => (await app.fetch(new Request(`http://x${path}`))).text();

  beforeAll(async () => {
    server = await startApp();
    client = createClient({ baseUrl: server.url, retries: 0 });
  });
  afterAll(async () => {
    await client.close();
    await server.close();
  });

  it('partitions() returns the JSON document the service returns', async () => {
    const doc = await client.partitions({ n: 30, count: 5, seed: 'client', start: 3 });
    expect(JSON.stringify(doc)).toBe(await direct('/v1/partitions?n=30&count=5&seed=client&start=3&format=json'));
    expect(doc.samples).toHaveLength(5);
    for (const parts of doc.samples as number[][]) expect(parts.reduce((a, b) => a + b, 0)).toBe(30);
  });

  it('streamPartitions() yields the NDJSON records, in order, equal to the JSON samples', async () => {
    const doc = await client.partitions({ n: 25, count: 300, seed: 'stream', as: 'multiplicities' });
    const lines = [];
    for await (const line of client.streamPartitions({ n: 25, count: 300, seed: 'stream', as: 'multiplicities' })) lines.push(line);
    expect(lines.map((l) => l.index)).toEqual([...Array(300).keys()]);
    expect(lines.map((l) => l.multiplicities)).toEqual(doc.samples);
  });

  it('countPartitions(), health() and openapi() return the service documents', async () => {
    // p(100) = 190569292, OEIS A000041.
    expect(await client.countPartitions({ n: 100 })).toEqual({ family: { kind: 'partition', n: 100 }, count: '190569292' });
    expect((await client.health()).status).toBe('ok');
    const spec = await client.openapi();
    expect(Object.keys(spec.paths as object)).toContain('/v1/partitions');
  });

  it('compositions() and streamCompositions() return the service document and records, constraints included', async () => {
    const doc = await client.compositions({ n: 20, count: 6, seed: 'client-comp', length: 4, maxPart: 9 });
    expect(JSON.stringify(doc)).toBe(await direct('/v1/compositions?n=20&count=6&seed=client-comp&length=4&maxPart=9&format=json'));
    for (const parts of doc.samples) {
      expect(parts).toHaveLength(4);
      expect(parts.reduce((a, b) => a + b, 0)).toBe(20);
      expect(Math.max(...parts)).toBeLessThanOrEqual(9);
    }
    const weak = await client.compositions({ n: 5, count: 40, seed: 'weak', length: 3, minPart: 0 });
    expect(weak.samples.some((parts) => parts.includes(0))).toBe(true);
    const lines = [];
    for await (const line of client.streamCompositions({ n: 12, count: 50, seed: 'client-comp', allowed: [1, 3, 4] })) lines.push(`${JSON.stringify(line)}\n`);
    expect(lines.join('')).toBe(await direct('/v1/compositions?n=12&count=50&seed=client-comp&allowed=1,3,4&format=ndjson'));
  });

  it('countPartitions() and countCompositions() give exact counts, with constraints', async () => {
    // Compositions of 10: 2^9 = 512 (OEIS A011782).
    expect(await client.countCompositions({ n: 10 })).toEqual({ family: { kind: 'composition', n: 10 }, count: '512' });
    // Compositions of 10 into parts 1 and 2: Fibonacci F(11) = 89 (OEIS A000045).
    expect((await client.countCompositions({ n: 10, allowed: [1, 2] })).count).toBe('89');
    // Compositions of 10 into 4 parts: C(9, 3) = 84 (OEIS A007318, Pascal's triangle).
    expect((await client.countCompositions({ n: 10, length: 4 })).count).toBe('84');
    // Weak compositions of 10 into 3 parts: C(12, 2) = 66 (OEIS A000217, triangular numbers).
    expect((await client.countCompositions({ n: 10, length: 3, minPart: 0 })).count).toBe('66');
    // Partitions of 30 into distinct parts: 296 (OEIS A000009, value from memory).
    expect((await client.countPartitions({ n: 30, distinct: true })).count).toBe('296');
    // Partitions of 20 into at most 4 parts (= parts at most 4): 108 (OEIS A001400, value from memory).
    expect((await client.countPartitions({ n: 20, maxPart: 4 })).count).toBe('108');
    // @ts-expect-error n is required: the type comes from the zod schema.
    await expect(client.countCompositions({ length: 3 })).rejects.toBeInstanceOf(PartsmithError);
  });

  it('a composition family the service refuses surfaces as a 400 or 422 PartsmithError', async () => {
    const weakWithoutLength = (await client.compositions({ n: 10, seed: 'x', minPart: 0 }).catch((e: unknown) => e)) as PartsmithError;
    expect(weakWithoutLength.status).toBe(400);
    expect(weakWithoutLength.errors.map((e) => e.param)).toEqual(['minPart']);
    const empty = (await client.compositions({ n: 7, seed: 'x', allowed: [2, 4] }).catch((e: unknown) => e)) as PartsmithError;
    expect(empty.status).toBe(422);
    expect(empty.detail).toContain('{2, 4}');
  });

  it('surfaces problem documents as PartsmithError with the problem fields', async () => {
    const error = await client.partitions({ n: 10, seed: 'x', length: 2, maxLength: 3 }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(PartsmithError);
    const problem = error as PartsmithError;
    expect(problem.status).toBe(400);
    expect(problem.type).toBe('/problems/invalid-parameters');
    expect(problem.errors.map((e) => e.param)).toEqual(['maxLength']);
    expect(problem.url).toContain('/v1/partitions?');
    const missing = (await client.get('/v1/nothing').catch((e: unknown) => e)) as PartsmithError;
    expect(missing.status).toBe(404);
  });

  it('listPartitions(), listCompositions() and listSetPartitions() yield the NDJSON listing, each member with its rank', async () => {
    const lines = [];
    for await (const line of client.listPartitions({ n: 12, maxLength: 4, start: 30n })) lines.push(line);
    expect(lines).toEqual([
      { rank: '30', parts: [4, 4, 3, 1] },
      { rank: '31', parts: [4, 4, 2, 2] },
      { rank: '32', parts: [4, 3, 3, 2] },
      { rank: '33', parts: [3, 3, 3, 3] },
    ]);
    const compositions = [];
    for await (const line of client.listCompositions({ n: 10, allowed: [1, 2, 3], start: '100', count: 50 })) compositions.push(`${JSON.stringify(line)}\n`);
    expect(compositions.join('')).toBe(await direct('/v1/compositions/list?n=10&allowed=1,2,3&start=100&count=50&format=ndjson'));
    const setPartitions = [];
    for await (const line of client.listSetPartitions({ n: 4, blocks: 2, as: 'rgs' })) setPartitions.push(line);
    // S(4, 2) = 7 (OEIS A008277), in the order of their restricted growth strings.
    expect(setPartitions.map((l) => l.rgs)).toEqual([[0, 0, 0, 1], [0, 0, 1, 0], [0, 0, 1, 1], [0, 1, 0, 0], [0, 1, 0, 1], [0, 1, 1, 0], [0, 1, 1, 1]]);
    // Leaving the loop early closes the stream.
    let seen = 0;
    for await (const line of client.listPartitions({ n: 60, count: 10000 })) {
      expect(line.rank).toBe(String(seen));
      if (++seen === 3) break;
    }
    expect(seen).toBe(3);
  });

  it('rank and unrank of every kind return the service documents; ranks are decimal strings (BigInts accepted)', async () => {
    expect(await client.rankPartition({ parts: [5, 4, 2, 1] })).toEqual({ family: { kind: 'partition', n: 12 }, parts: [5, 4, 2, 1], rank: '33', total: '77' });
    expect(await client.unrankPartition({ n: 12, rank: 33n })).toEqual({ family: { kind: 'partition', n: 12 }, rank: '33', total: '77', parts: [5, 4, 2, 1] });
    expect((await client.unrankPartition({ n: 12, rank: '33', as: 'multiplicities' })).multiplicities).toEqual([[5, 1], [4, 1], [2, 1], [1, 1]]);
    expect(JSON.stringify(await client.rankComposition({ parts: [1, 3, 1] }))).toBe(await direct('/v1/compositions/rank?parts=1,3,1'));
    const big = 12345678901234567890123456789n;
    expect((await client.unrankComposition({ n: 200, rank: big })).rank).toBe(String(big));
    expect(await client.rankSetPartition({ rgs: [0, 1, 0, 2] })).toEqual({ family: { kind: 'set-partition', n: 4 }, rgs: [0, 1, 0, 2], rank: '7', total: '15' });
    expect((await client.unrankSetPartition({ n: 4, rank: 7n })).blocks).toEqual([[1, 3], [2], [4]]);
    expect((await client.unrankSetPartition({ n: 4, rank: 7n, as: 'rgs' })).rgs).toEqual([0, 1, 0, 2]);
  });

  it('a non-member or a rank past the end is a 422 PartsmithError naming the parameter', async () => {
    const notMember = (await client.rankPartition({ parts: [1, 2] }).catch((e: unknown) => e)) as PartsmithError;
    expect(notMember.status).toBe(422);
    expect(notMember.errors.map((e) => e.param)).toEqual(['parts']);
    const past = (await client.unrankSetPartition({ n: 4, rank: 15n }).catch((e: unknown) => e)) as PartsmithError;
    expect(past.status).toBe(422);
    expect(past.errors.map((e) => e.param)).toEqual(['rank']);
    const start = (await (async () => {
      for await (const _ of client.listCompositions({ n: 5, start: 17n })) void _;
    })().catch((e: unknown) => e)) as PartsmithError;
    expect(start.errors.map((e) => e.param)).toEqual(['start']);
  });

  it('validates the way the service does: a bad value is a 400 from the service, not a client-side guess', async () => {
    const error = (await client.partitions({ n: 2.5, seed: 'x' }).catch((e: unknown) => e)) as PartsmithError;
    expect(error.status).toBe(400);
    expect(error.errors[0].param).toBe('n');
  });
});

describe('client retries, timeouts and aborts against scripted servers', () => {
  const servers: Running[] = [];
  const clients: PartsmithClient[] = [];
  async function scripted(script: Parameters<typeof startScripted>[0]): Promise<Running> {
    const s = await startScripted(script);
    servers.push(s);
    return s;
  }
  function clientOf(server: Running, extra: Partial<Parameters<typeof createClient>[0]> = {}): PartsmithClient {
    const c = createClient({ baseUrl: server.url, retries: 3, retryBaseMs: 1, retryMaxMs: 5, ...extra });
    clients.push(c);
    return c;
  }
  afterAll(async () => {
    await Promise.all(clients.map((c) => c.close()));
    await Promise.all(servers.map((s) => s.close()));
  });

  it('retries once after the connection is dropped, then succeeds', async () => {
    const server = await scripted((k, req, res) => (k === 0 ? req.socket.destroy() : ok(res, { status: 'ok' })));
    expect(await clientOf(server).health()).toEqual({ status: 'ok' });
    expect(server.hits()).toBe(2);
  });

  it('retries a 503 with Retry-After: 0, then succeeds', async () => {
    const server = await scripted((k, _req, res) => (k === 0 ? problem(res, 503, 'busy', { 'retry-after': '0' }) : ok(res, { status: 'ok' })));
    expect(await clientOf(server).health()).toEqual({ status: 'ok' });
    expect(server.hits()).toBe(2);
  });

  it('retries a 429 and honours Retry-After (1 s)', async () => {
    const server = await scripted((k, _req, res) => (k === 0 ? problem(res, 429, 'slow down', { 'retry-after': '1' }) : ok(res, { status: 'ok' })));
    // A lower bound (the wait cannot be shorter than Retry-After), true on slow and fast machines;
    // performance.now, unlike Date.now, never jumps with the system clock.
    const started = performance.now();
    expect(await clientOf(server).health()).toEqual({ status: 'ok' });
    expect(performance.now() - started).toBeGreaterThanOrEqual(950);
    expect(server.hits()).toBe(2);
  });

  it('never retries other 4xx, nor 500', async () => {
    for (const status of [400, 404, 405, 422, 500]) {
      const server = await scripted((_k, _req, res) => problem(res, status, `scripted ${status}`));
      const error = (await clientOf(server).health().catch((e: unknown) => e)) as PartsmithError;
      expect(error).toBeInstanceOf(PartsmithError);
      expect(error.status).toBe(status);
      expect(error.detail).toBe(`scripted ${status}`);
      expect(server.hits(), `status ${status}`).toBe(1);
    }
  });

  it('gives up after `retries` further attempts and throws the last problem', async () => {
    const server = await scripted((_k, _req, res) => problem(res, 503, 'down', { 'retry-after': '0' }));
    const error = (await clientOf(server, { retries: 2 }).health().catch((e: unknown) => e)) as PartsmithError;
    expect(error.status).toBe(503);
    expect(server.hits()).toBe(3);
  });

  it('does not wait for a Retry-After longer than maxRetryAfterMs', async () => {
    const server = await scripted((_k, _req, res) => problem(res, 503, 'maintenance', { 'retry-after': '3600' }));
    const error = (await clientOf(server).health().catch((e: unknown) => e)) as PartsmithError;
    expect(error.status).toBe(503);
    expect(server.hits()).toBe(1);
  });

  it('reuses keep-alive connections for sequential requests', async () => {
    const server = await scripted((_k, _req, res) => ok(res, { status: 'ok' }));
    const client = clientOf(server);
    for (let i = 0; i < 20; i++) await client.health();
    expect(server.hits()).toBe(20);
    // undici's pool may open a second socket while the first is being released; never one per request.
    expect(server.connections()).toBeLessThanOrEqual(2);
  });

  it('times out a silent server after timeoutMs, without retrying', async () => {
    const server = await scripted(() => {
      /* never answers */
    });
    const error = (await clientOf(server, { timeoutMs: 200 }).health().catch((e: unknown) => e)) as { code?: string };
    expect(error.code).toBe('UND_ERR_HEADERS_TIMEOUT');
    expect(server.hits()).toBe(1);
  });

  it('aborts a pending request and a pending retry wait with the AbortSignal', async () => {
    const silent = await scripted(() => {});
    const controller = new AbortController();
    setTimeout(() => controller.abort(new Error('stop')), 50);
    await expect(clientOf(silent).health({ signal: controller.signal })).rejects.toThrow('stop');

    const waiting = await scripted((_k, _req, res) => problem(res, 503, 'later', { 'retry-after': '30' }));
    const second = new AbortController();
    const started = performance.now();
    setTimeout(() => second.abort(new Error('enough')), 100);
    await expect(clientOf(waiting).health({ signal: second.signal })).rejects.toThrow('enough');
    // Far below the 30 s Retry-After it would otherwise wait: the abort ended the wait, on any machine.
    expect(performance.now() - started).toBeLessThan(15_000);
  });

  it('reads NDJSON incrementally: the first record arrives while the server still holds the rest', async () => {
    let release!: () => void;
    const released = new Promise<void>((done) => (release = done));
    const server = await scripted((_k, _req, res) => {
      res.writeHead(200, { 'content-type': 'application/x-ndjson' });
      res.write('{"index":0,"parts":[3,1]}\n{"index":1,"pa');
      void released.then(() => res.end('rts":[2,2]}\n'));
    });
    const records = clientOf(server).streamPartitions({ n: 4, count: 2, seed: 's' });
    const first = await records.next();
    expect(first.value).toEqual({ index: 0, parts: [3, 1] });
    release();
    expect((await records.next()).value).toEqual({ index: 1, parts: [2, 2] });
    expect((await records.next()).done).toBe(true);
  });

  it('closes the response when the caller stops reading a stream early', async () => {
    let closed!: () => void;
    const wasClosed = new Promise<void>((done) => (closed = done));
    const server = await scripted((_k, req, res) => {
      res.writeHead(200, { 'content-type': 'application/x-ndjson' });
      let i = 0;
      const timer = setInterval(() => res.write(`{"index":${i++},"parts":[1]}\n`), 5);
      res.on('close', () => {
        clearInterval(timer);
        closed();
      });
      req.on('error', () => {});
    });
    for await (const line of clientOf(server).streamPartitions({ n: 1, count: 10_000, seed: 's' })) {
      if (line.index === 3) break;
    }
    await wasClosed;
  });
});
