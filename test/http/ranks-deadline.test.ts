import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { readAll } from '../support/read-stream.js';

/** A clock that reads 0 for the first `reads` readings and far in the future after. */
function clockExpiringAfter(reads: number): () => number {
  let count = 0;
  return () => (++count <= reads ? 0 : 1e12);
}

/**
 * A listing that runs out of time (injected clock: no dependence on this machine's speed) says
 * where to continue with its exact next rank — also past 2^53, where a Number would round it.
 */
describe('listing deadline', () => {
  const start = (1n << 80n) + 7n; // compositions of 100 number 2^99

  it('before the first byte: 503 problem+json naming the exact rank to continue from', async () => {
    // One reading when the request starts, then one per member: 4 members pass in time.
    const app = createApp({ clock: clockExpiringAfter(5), limits: { deadlineMs: 50 } });
    const response = await app.fetch(new Request(`http://x/v1/compositions/list?n=100&start=${start}&count=1000`));
    expect(response.status).toBe(503);
    expect(response.headers.get('retry-after')).toBe('1');
    const problem = await response.json();
    expect(problem.detail).toMatch(/deadline of 50 ms/);
    expect(problem.detail).toContain(`continue with start=${start + 4n}.`);
  });

  it('mid-stream: the NDJSON ends with an error line naming the exact next rank, and the stream fails', async () => {
    // Enough readings for the first 64 KiB chunk (about 300 members of ~200 characters), then the deadline.
    const app = createApp({ clock: clockExpiringAfter(2000), limits: { deadlineMs: 50 } });
    const response = await app.fetch(new Request(`http://x/v1/compositions/list?n=100&start=${start}&count=10000&format=ndjson`));
    expect(response.status).toBe(200);
    const { text, failure } = await readAll(response);
    expect(failure).toBeDefined();
    const lines = text.trimEnd().split('\n').map((line) => JSON.parse(line));
    const last = lines.pop();
    expect(lines.length).toBe(1999);
    lines.forEach((line, i) => expect(line.rank).toBe(String(start + BigInt(i))));
    expect(last.error.status).toBe(503);
    expect(last.error.detail).toContain(`continue with start=${start + 1999n}.`);
  });
});
