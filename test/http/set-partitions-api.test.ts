import { describe, expect, it } from 'vitest';
import { appClient } from './helpers.js';

/** GET /v1/set-partitions and /v1/set-partitions/count: the sampling contract and the errors. */
describe('GET /v1/set-partitions', () => {
  const { get } = appClient();

  it('answers a document with the canonical family, the method and the samples as blocks', async () => {
    const response = await get('/v1/set-partitions?n=8&count=3&seed=api&minBlockSize=1&maxBlockSize=3');
    expect(response.status).toBe(200);
    expect(response.headers.get('partsmith-method')).toMatch(/^[a-z-]+\/\d+$/);
    const body = await response.json();
    expect(body.family).toEqual({ kind: 'set-partition', n: 8, maxBlockSize: 3 }); // the default minBlockSize dropped
    expect(body.samples).toHaveLength(3);
    for (const blocks of body.samples as number[][][]) {
      expect(blocks.flat().sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
      expect(blocks.every((b) => b.length <= 3)).toBe(true);
    }
  });

  it('replays: start/count frame the same samples; the formats and forms agree', async () => {
    const whole = await (await get('/v1/set-partitions?n=10&count=6&seed=replay')).json();
    const tail = await (await get('/v1/set-partitions?n=10&count=3&start=3&seed=replay')).json();
    expect(tail.samples).toEqual(whole.samples.slice(3));
    const rgs = await (await get('/v1/set-partitions?n=10&count=6&seed=replay&as=rgs')).json();
    rgs.samples.forEach((string: number[], i: number) => {
      const blocks: number[][] = [];
      string.forEach((b, item) => (blocks[b] ??= []).push(item + 1));
      expect(blocks).toEqual(whole.samples[i]);
    });
    const text = await (await get('/v1/set-partitions?n=10&count=6&seed=replay&format=text')).text();
    expect(text).toBe(whole.samples.map((s: number[][]) => `${s.map((b) => b.join(' ')).join(' | ')}\n`).join(''));
    const ndjson = (await (await get('/v1/set-partitions?n=10&count=6&seed=replay&format=ndjson&as=rgs')).text()).trim().split('\n').map((l) => JSON.parse(l));
    expect(ndjson.map((l) => l.rgs)).toEqual(rgs.samples);
    expect(ndjson.map((l) => l.index)).toEqual([0, 1, 2, 3, 4, 5]);
  });

  it('is seeded and cacheable like the other families (ETag, 304), and draws a seed when none is given', async () => {
    const first = await get('/v1/set-partitions?n=10&seed=etag');
    const etag = first.headers.get('etag')!;
    expect(first.headers.get('cache-control')).toContain('immutable');
    expect((await get('/v1/set-partitions?n=10&seed=etag', { headers: { 'if-none-match': etag } })).status).toBe(304);
    const drawn = await get('/v1/set-partitions?n=10');
    expect(drawn.headers.get('partsmith-seed')).toBe('drawn-seed');
    expect(drawn.headers.get('cache-control')).toBe('no-store');
  });

  it('serves large n in the compact form', async () => {
    const response = await get('/v1/set-partitions?n=200000&seed=big&as=rgs');
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.method).toBe('stam/1');
    expect(body.samples[0]).toHaveLength(200_000);
  });

  const problems: [string, number, string, RegExp][] = [
    ['/v1/set-partitions?n=10000001&seed=x', 400, 'n', /0 to 10000000/],
    ['/v1/set-partitions?n=10&seed=x&blocks=11', 422, 'blocks', /at most 10/],
    ['/v1/set-partitions?n=10&seed=x&minBlockSize=4&maxBlockSize=3', 422, 'minBlockSize', /maxBlockSize/],
    ['/v1/set-partitions?n=10&seed=x&blocks=3&maxBlocks=4', 400, 'maxBlocks', /blocks/],
    ['/v1/set-partitions?n=10&seed=x&blocks=3&minBlockSize=4', 422, 'blocks', /no set partition of 10 items has exactly 3 blocks/],
    ['/v1/set-partitions?n=10&seed=x&maxBlocks=2&maxBlockSize=4', 422, 'maxBlocks', /at most 2 blocks/],
    ['/v1/set-partitions?n=10&seed=x&as=parts', 400, 'as', /blocks, rgs/],
    ['/v1/set-partitions/count?n=10&blocks=12', 422, 'blocks', /at most 10/],
    ['/v1/set-partitions/count?n=5000', 422, '', /limit/],
  ];
  for (const [path, status, param, detail] of problems) {
    it(`${path} -> ${status} naming ${param || 'the limit'}`, async () => {
      const response = await get(path);
      expect(response.status).toBe(status);
      expect(response.headers.get('content-type')).toContain('application/problem+json');
      const body = await response.json();
      expect(body.detail).toMatch(detail);
      if (param) expect(body.errors.map((e: { param: string }) => e.param)).toContain(param);
    });
  }

  it('refuses over the response limits before sampling, saying how many fit', async () => {
    const response = await get('/v1/set-partitions?n=5000000&count=3&seed=x&as=rgs');
    expect(response.status).toBe(422);
    expect((await response.json()).errors[0].param).toBe('count');
  });
});

describe('GET /v1/set-partitions/count', () => {
  const { get } = appClient();
  it('gives exact counts as decimal strings', async () => {
    const cases: [string, string][] = [
      ['n=50', '185724268771078270438257767181908917499221852770'], // B_50, OEIS A000110 (from memory; also tested against mathjs)
      ['n=10&blocks=3', '9330'], // S(10, 3), OEIS A008277
      ['n=10&minBlockSize=2', '17722'], // OEIS A000296
      ['n=10&blocks=3&minBlockSize=4', '0'],
    ];
    for (const [query, count] of cases) {
      const body = await (await get(`/v1/set-partitions/count?${query}`)).json();
      expect(body.count, query).toBe(count);
    }
  });
});
