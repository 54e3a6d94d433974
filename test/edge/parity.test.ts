import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PARITY_REQUESTS, SERVED, type ParityRequest } from './parity-requests.js';
import { inProcessRuntime, nodeRuntime, workerRuntime, type Answer, type Runtime } from './runtimes.js';

/**
 * One app, three runtimes: the same request must get the same status, the same bytes and the
 * same key headers from createApp().fetch, from the Node server (`npm start`) and from the
 * bundled worker in workerd. Sample i is a pure function of (seed, i, family, algorithm version),
 * so any difference is a runtime dependence (number formatting, hashing, streaming, Web APIs).
 */
const KEY_HEADERS = ['content-type', 'etag', 'cache-control', 'partsmith-seed', 'partsmith-method', 'allow'] as const;

function keyHeaders(answer: Answer): Record<string, string | undefined> {
  return Object.fromEntries(KEY_HEADERS.map((name) => [name, answer.headers[name]]));
}

function label(request: ParityRequest): string {
  return `${request.method ?? 'GET'} ${request.path}`;
}

describe('runtime parity: in-process, Node server, workerd', () => {
  let runtimes: Runtime[] = [];

  beforeAll(async () => {
    // Node and workerd start concurrently (each takes a few seconds); if one fails to start,
    // the other is stopped before the error is reported, so no server outlives the test.
    const started = await Promise.allSettled([nodeRuntime(), workerRuntime()]);
    const ready = started.flatMap((s) => (s.status === 'fulfilled' ? [s.value] : []));
    const failure = started.find((s) => s.status === 'rejected');
    if (failure) {
      await Promise.all(ready.map((r) => r.close()));
      throw failure.reason;
    }
    runtimes = [inProcessRuntime(), ...ready];
  }, 60_000);

  afterAll(async () => {
    await Promise.all(runtimes.map((r) => r.close()));
  });

  it('has at least 50 requests covering every endpoint, format and error status', () => {
    expect(PARITY_REQUESTS.length).toBeGreaterThanOrEqual(50);
    const servedAt = (path: string) => SERVED.filter((r) => r.path.split('?')[0] === path).map((r) => r.path);
    const endpoints = ['/v1/partitions', '/v1/partitions/count', '/v1/compositions', '/v1/compositions/count', '/v1/set-partitions', '/v1/set-partitions/count', '/v1/partitions/diagram', '/v1/partitions/check', '/v1/compositions/check', '/healthz', '/openapi.json'];
    endpoints.push('/v1/partitions/list', '/v1/partitions/rank', '/v1/partitions/unrank', '/v1/compositions/list', '/v1/compositions/rank', '/v1/compositions/unrank', '/v1/set-partitions/list', '/v1/set-partitions/rank', '/v1/set-partitions/unrank');
    for (const path of [...endpoints, '/', '/assets/page.css', '/assets/page.js', '/favicon.ico']) expect(servedAt(path).length, path).toBeGreaterThan(0);
    // Every constraint answered with samples and with a count.
    for (const path of ['/v1/partitions', '/v1/partitions/count']) {
      for (const param of ['distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed']) expect(servedAt(path).some((p) => p.includes(`&${param}=`)), `${path} ${param}`).toBe(true);
    }
    for (const path of ['/v1/compositions', '/v1/compositions/count']) {
      for (const param of ['length', 'minPart=0', 'maxPart', 'allowed']) expect(servedAt(path).some((p) => p.includes(`&${param}`)), `${path} ${param}`).toBe(true);
    }
    for (const path of ['/v1/set-partitions', '/v1/set-partitions/count']) {
      for (const param of ['blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize']) expect(servedAt(path).some((p) => p.includes(`&${param}=`)), `${path} ${param}`).toBe(true);
    }
    for (const needle of ['style=text', 'conjugate=true', 'parts=', 'index=']) expect(servedAt('/v1/partitions/diagram').some((p) => p.includes(needle)), needle).toBe(true);
    expect(servedAt('/v1/partitions/check').some((p) => p.includes('format=svg'))).toBe(true);
    for (const format of ['json', 'ndjson', 'text']) expect(PARITY_REQUESTS.some((r) => r.path.includes(`format=${format}`))).toBe(true);
    expect(PARITY_REQUESTS.some((r) => r.path.includes('as=multiplicities'))).toBe(true);
  });

  it('answers every request identically: status, body bytes, key headers', async () => {
    const statuses = new Set<number>();
    const served = new Set(SERVED);
    for (const request of PARITY_REQUESTS) {
      const init = { method: request.method, headers: request.headers ? { ...request.headers } : undefined };
      const answers = await Promise.all(runtimes.map((r) => r.send(request.path, init)));
      const [reference, ...others] = answers;
      statuses.add(reference.status);
      if (served.has(request)) expect(reference.status, `${label(request)}: ${reference.body.toString('utf8').slice(0, 300)}`).toBe(200);
      others.forEach((answer, k) => {
        const where = `${runtimes[k + 1].name} vs ${runtimes[0].name}: ${label(request)}`;
        expect(answer.status, where).toBe(reference.status);
        expect(keyHeaders(answer), where).toEqual(keyHeaders(reference));
        // Byte equality; on failure show text, which is what differs in practice.
        if (!answer.body.equals(reference.body)) expect(answer.body.toString('utf8'), where).toBe(reference.body.toString('utf8'));
      });
      if (request.method === 'HEAD') for (const answer of answers) expect(answer.body.length, label(request)).toBe(0);
    }
    // The list really exercises success and every error status the runtimes can produce.
    for (const status of [200, 400, 404, 405, 422]) expect(statuses, `some request answers ${status}`).toContain(status);
  }, 30_000);

  it('answers If-None-Match with the ETag by 304 on every runtime', async () => {
    let checked = 0;
    for (const request of PARITY_REQUESTS) {
      if (request.method && request.method !== 'GET') continue;
      const first = await runtimes[0].send(request.path);
      const etag = first.headers.etag;
      if (first.status !== 200 || !etag) continue;
      for (const runtime of runtimes) {
        const again = await runtime.send(request.path, { headers: { 'if-none-match': etag } });
        expect(again.status, `${runtime.name}: ${request.path}`).toBe(304);
        expect(again.headers.etag, `${runtime.name}: ${request.path}`).toBe(etag);
        expect(again.body.length).toBe(0);
        // A different tag is not a match.
        if (checked === 0) expect((await runtime.send(request.path, { headers: { 'if-none-match': '"0000"' } })).status).toBe(200);
      }
      checked++;
    }
    expect(checked).toBeGreaterThanOrEqual(20);
  }, 30_000);
});
