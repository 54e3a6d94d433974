import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { bodyPieces, startBody, type SamplingJob } from '../../src/http/sampling.js';
import { Deadline } from '../../src/http/deadline.js';
import { partitionAsParts } from '../../src/http/encode.js';
import { partitionFromParts, type Partition } from '../../src/core/partition.js';
import { SampleStreams } from '../../src/core/seeding.js';
import { readAll } from '../support/read-stream.js';

/** A clock that reads `start` for the first `reads` readings and far in the future after. */
function clockExpiringAfter(reads: number): { clock: () => number; readings: () => number } {
  let count = 0;
  return { clock: () => (++count <= reads ? 0 : 1e12), readings: () => count };
}

describe('request deadline', () => {
  it('answers 503 problem+json with Retry-After when it passes before the first byte (injected clock)', async () => {
    // The clock passes the deadline after 5 readings: one at the start, then one per sample.
    const { clock, readings } = clockExpiringAfter(5);
    const app = createApp({ clock, limits: { deadlineMs: 50 } });
    const response = await app.fetch(new Request('http://x/v1/partitions?n=200&count=1000&seed=d'));
    expect(response.status).toBe(503);
    expect(response.headers.get('content-type')).toMatch(/^application\/problem\+json/);
    expect(response.headers.get('retry-after')).toBe('1');
    const problem = await response.json();
    expect(problem).toMatchObject({ status: 503, title: 'Service unavailable' });
    expect(problem.detail).toMatch(/deadline of 50 ms/);
    expect(problem.detail).toMatch(/continue with start=4/);
    expect(readings()).toBe(6); // it stopped at the first check past the deadline
  });

  it('stops a request mid-way when its time runs out between samples (clock advancing 8 ms per sample)', async () => {
    // The clock reads 0 at the start and 8 ms more at each check before a sample: the checks
    // before samples 0 and 1 pass (8, 16 < 20), the one before sample 2 (24) stops the request.
    // Samples of n = 10^6 are ~8 KB each, so the first 64 KiB chunk is still being gathered:
    // the answer is a 503 that says where to continue. Whatever the machine's speed.
    let readings = 0;
    const app = createApp({ clock: () => 8 * readings++, limits: { deadlineMs: 20 } });
    const response = await app.fetch(new Request('http://x/v1/partitions?n=1000000&count=2000&seed=d&as=multiplicities'));
    expect(response.status).toBe(503);
    expect(response.headers.get('retry-after')).toBe('1');
    const problem = await response.json();
    expect(problem.detail).toMatch(/deadline of 20 ms/);
    expect(problem.detail).toMatch(/2 samples were done in time; continue with start=2\./);
    expect(readings).toBe(4); // the start, then one check per sample: it drew nothing past the deadline
  });

  it('with the real clock and a 1 ms deadline, a request of 10^5 large samples stops early (either way it can)', async () => {
    // Behaviour that holds on slow and fast machines: 10^5 samples of n = 10^6 are seconds of work
    // anywhere, far past 1 ms, so the request never completes. It stops either before its first
    // byte (503 problem) or after it (200 whose stream ends with an error line and errors).
    const app = createApp({ limits: { deadlineMs: 1, maxCount: 100_000, maxNumbers: 1e12, workBudgetMs: 3_600_000 } });
    const response = await app.fetch(new Request('http://x/v1/partitions?n=1000000&count=100000&seed=d&as=multiplicities&format=ndjson'));
    if (response.status === 503) {
      expect((await response.json()).detail).toMatch(/deadline of 1 ms.*(continue with start=\d+)?/);
      return;
    }
    expect(response.status).toBe(200);
    const { text, failure } = await readAll(response);
    expect(failure).toBeInstanceOf(Error);
    const lines = text.trimEnd().split('\n').map((line) => JSON.parse(line));
    const last = lines.pop();
    expect(last.error).toMatchObject({ status: 503 });
    expect(last.error.detail).toMatch(new RegExp(`continue with start=${lines.length}\\.`));
    expect(lines.length).toBeLessThan(100_000);
  });

  it('ends an NDJSON stream that is already flowing with an error line, then errors the stream', async () => {
    // 5,000 samples of n = 30 are ~5 chunks of 64 KiB; the deadline passes after 2,000 samples.
    const app = createApp({ clock: clockExpiringAfter(2001).clock });
    const response = await app.fetch(new Request('http://x/v1/partitions?n=30&count=5000&seed=m&format=ndjson'));
    expect(response.status).toBe(200);
    const { text, failure } = await readAll(response);
    expect(failure).toBeInstanceOf(Error);
    expect(String(failure)).not.toMatch(/\/|\.ts|at /);
    const lines = text.trimEnd().split('\n').map((line) => JSON.parse(line));
    const last = lines.pop();
    expect(last.error).toMatchObject({ status: 503, type: '/problems/unavailable' });
    expect(last.error.detail).toMatch(/continue with start=2000/);
    expect(lines).toHaveLength(2000);
    lines.forEach((line, i) => expect(line.index).toBe(i));
  });

  it('truncates JSON and text bodies that are already flowing (no closing "]}", stream errors)', async () => {
    for (const format of ['json', 'text']) {
      const app = createApp({ clock: clockExpiringAfter(2001).clock });
      const response = await app.fetch(new Request(`http://x/v1/partitions?n=200&count=5000&seed=m&format=${format}`));
      expect(response.status).toBe(200);
      const { text, failure } = await readAll(response);
      expect(failure).toBeInstanceOf(Error);
      expect(text.length).toBeGreaterThan(64 * 1024);
      if (format === 'json') expect(() => JSON.parse(text)).toThrow();
      else expect(text.split('\n').filter(Boolean).length).toBe(2000);
    }
  });
});

describe('errors inside a stream', () => {
  /** A sampler that fails like a bug would, with internals in its message, at sample `failAt`. */
  function failingJob(failAt: number): SamplingJob<Partition> {
    let drawn = 0;
    return {
      family: { kind: 'partition', n: 3 },
      streams: new SampleStreams('{"kind":"partition","n":3}'),
      sampler: {
        method: 'failing/1',
        expectedWork: 1,
        sample: () => {
          if (drawn++ === failAt) throw new TypeError('cannot read x of undefined at /work/src/core/secret.ts:12:3');
          return partitionFromParts([2, 1]);
        },
      },
      encoder: partitionAsParts,
      numbersPerSample: 2,
      seed: 's',
      start: 0,
      count: 100_000,
      format: 'ndjson',
    };
  }

  it('before the first byte: the error reaches the app, which answers a generic 500', async () => {
    expect(() => startBody(failingJob(0))).toThrow(TypeError);
  });

  it('after the first byte: a generic problem line, no internals, then the stream errors', async () => {
    const { text, failure } = await readAll(new Response(startBody(failingJob(20_000))));
    expect(failure).toBeInstanceOf(Error);
    expect(text).not.toMatch(/secret|\/work|\.ts|TypeError|undefined/);
    const last = JSON.parse(text.trimEnd().split('\n').pop()!);
    expect(last.error).toMatchObject({ status: 500, type: '/problems/internal' });
  });

  it('the sampling loop checks the deadline before every sample', () => {
    let readings = 0;
    const deadline = new Deadline(() => readings++, 1e9);
    const pieces = [...bodyPieces({ ...failingJob(-1), count: 50 }, deadline)];
    expect(pieces).toHaveLength(50);
    expect(readings).toBe(51); // one at the start, one per sample
  });
});
