import { describe, expect, it } from 'vitest';
import { compositions, count, createPartsmith, partitions, PartsmithError, streamCompositions, streamPartitions } from 'partsmith';
import { createApp } from '../../src/http/app.js';

/**
 * The library (`import ... from 'partsmith'`) answers exactly as the service: same documents,
 * same samples for the same seed, same errors (as PartsmithError).
 */
const app = createApp();
async function service(pathAndQuery: string): Promise<{ status: number; text: string }> {
  const response = await app.fetch(new Request(`http://service${pathAndQuery}`));
  return { status: response.status, text: await response.text() };
}

describe('library partitions/count', () => {
  it('partitions() returns the document the API returns for the same request', async () => {
    for (const as of ['parts', 'multiplicities'] as const) {
      const doc = await partitions({ n: 40, count: 20, seed: 'lib', start: 5, as });
      expect(JSON.stringify(doc)).toBe((await service(`/v1/partitions?n=40&count=20&seed=lib&start=5&as=${as}`)).text);
    }
  });

  it('sample i does not depend on how the request is framed (start/count)', async () => {
    const whole = await partitions({ n: 50, count: 10, seed: 'frame' });
    const tail = await partitions({ n: 50, count: 4, seed: 'frame', start: 6 });
    expect(tail.samples).toEqual(whole.samples.slice(6));
  });

  it('streamPartitions() yields the NDJSON records of the API', async () => {
    const lines: string[] = [];
    for await (const record of streamPartitions({ n: 33, count: 50, seed: 'lib-stream' })) lines.push(`${JSON.stringify(record)}\n`);
    expect(lines.join('')).toBe((await service('/v1/partitions?n=33&count=50&seed=lib-stream&format=ndjson')).text);
  });

  it('count() gives exact partition numbers', async () => {
    // p(200) = 3972999029388, OEIS A000041.
    expect(await count({ n: 200 })).toEqual({ family: { kind: 'partition', n: 200 }, count: '3972999029388' });
  });

  it('throws PartsmithError carrying the API problem for invalid requests', async () => {
    const error = (await partitions({ n: -1 as number, seed: 'x' }).catch((e: unknown) => e)) as PartsmithError;
    expect(error).toBeInstanceOf(PartsmithError);
    expect(error.status).toBe(400);
    expect(error.errors.map((e) => e.param)).toEqual(['n']);
    const body = JSON.parse((await service('/v1/partitions?n=-1&seed=x')).text);
    expect({ type: error.type, title: error.title, status: error.status, detail: error.detail, errors: error.errors }).toEqual(body);
  });

  it('separate instances agree (no shared state decides a sample)', async () => {
    const other = createPartsmith();
    expect(await other.partitions({ n: 77, count: 3, seed: 'inst' })).toEqual(await partitions({ n: 77, count: 3, seed: 'inst' }));
  });
});

describe('library compositions', () => {
  it('compositions() returns the API document; count() gives 2^(n-1)', async () => {
    const doc = await compositions({ n: 10, count: 30, seed: 'lib-comp' });
    expect(JSON.stringify(doc)).toBe((await service('/v1/compositions?n=10&count=30&seed=lib-comp')).text);
    for (const parts of doc.samples) expect(parts.reduce((a, b) => a + b, 0)).toBe(10);
    // Compositions of 10: 2^9 = 512 (OEIS A011782).
    expect((await count({ kind: 'composition', n: 10 })).count).toBe('512');
  });

  it('constrained compositions and their counts equal the API answers', async () => {
    const doc = await compositions({ n: 20, count: 8, seed: 'lib-comp', length: 4, minPart: 0, maxPart: 8 });
    expect(JSON.stringify(doc)).toBe((await service('/v1/compositions?n=20&count=8&seed=lib-comp&length=4&minPart=0&maxPart=8')).text);
    const lines: string[] = [];
    for await (const record of streamCompositions({ n: 15, count: 20, seed: 'lib-comp', allowed: [1, 2] })) lines.push(`${JSON.stringify(record)}\n`);
    expect(lines.join('')).toBe((await service('/v1/compositions?n=15&count=20&seed=lib-comp&allowed=1,2&format=ndjson')).text);
    // Compositions of 15 into 1s and 2s: Fibonacci F(16) = 987 (OEIS A000045).
    expect((await count({ kind: 'composition', n: 15, allowed: [1, 2] })).count).toBe('987');
  });
});
