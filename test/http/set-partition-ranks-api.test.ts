import { describe, expect, it } from 'vitest';
import { enumerateSetPartitions } from '../support/enumerate-set-partitions.js';
import { randomRanks } from '../ranks/support.js';
import { CONSTRAINT_SHAPES } from '../set-partitions/support.js';
import { appClient } from './helpers.js';

/**
 * GET /v1/set-partitions/list, /rank and /unrank: the members in the lexicographic order of
 * their restricted growth strings, against a brute-force enumeration of the strings in that
 * order (test/support/enumerate-set-partitions.ts, independent of the ranker).
 */
const { get } = appClient();

async function json(path: string) {
  const response = await get(path);
  return { response, body: await response.json() };
}

const query = (shape: Record<string, number>) => Object.entries(shape).map(([k, v]) => `&${k}=${v}`).join('');

/** The blocks of a restricted growth string, as the API writes them (test-side conversion). */
function blocksOf(rgs: readonly number[]): number[][] {
  const blocks: number[][] = [];
  rgs.forEach((b, i) => (blocks[b] ??= []).push(i + 1));
  return blocks;
}

/** Every member over HTTP, paging through NDJSON with start. */
async function listByPages(path: string, page: number): Promise<{ rank: string; rgs: number[] }[]> {
  const out: { rank: string; rgs: number[] }[] = [];
  for (let start = 0; ; start += page) {
    const response = await get(`${path}&as=rgs&format=ndjson&count=${page}&start=${start}`);
    expect(response.status).toBe(200);
    const lines = (await response.text()).split('\n').filter(Boolean);
    out.push(...lines.map((line) => JSON.parse(line)));
    if (lines.length < page) return out;
  }
}

describe('GET /v1/set-partitions/list', () => {
  it.each(CONSTRAINT_SHAPES)('equals the brute-force enumeration in RGS order, paged, with the count endpoint\'s number of members: %j, n = 7', async (shape) => {
    const family = { n: 7, ...shape };
    const members = enumerateSetPartitions(family);
    const listed = await listByPages(`/v1/set-partitions/list?n=7${query(shape)}`, 37);
    expect(listed.map((m) => m.rgs)).toEqual(members);
    listed.forEach((m, i) => expect(m.rank).toBe(String(i)));
    const count = (await json(`/v1/set-partitions/count?n=7${query(shape)}`)).body.count;
    expect(String(listed.length)).toBe(count);
  });

  it('lists the blocks form in json, ndjson and text alike, and the header gives the total (B_6 = 203, OEIS A000110)', async () => {
    const expected = enumerateSetPartitions({ n: 6 }).slice(40, 65).map((rgs, i) => ({ rank: String(40 + i), blocks: blocksOf(rgs) }));
    const base = '/v1/set-partitions/list?n=6&start=40&count=25';
    const { response, body } = await json(base);
    expect(response.headers.get('partsmith-total')).toBe('203');
    expect(body).toMatchObject({ family: { kind: 'set-partition', n: 6 }, total: '203', start: '40' });
    expect(body.members).toEqual(expected);
    const ndjson = (await (await get(`${base}&format=ndjson`)).text()).split('\n').filter(Boolean).map((l) => JSON.parse(l));
    expect(ndjson).toEqual(expected);
    const text = (await (await get(`${base}&format=text`)).text()).split('\n').filter(Boolean);
    expect(text).toEqual(expected.map((m) => `${m.rank}\t${m.blocks.map((b) => b.join(' ')).join(' | ')}`));
  });

  it('one long listing equals its pages (S(10, 4) = 34105, OEIS A008277)', async () => {
    const all = (await (await get('/v1/set-partitions/list?n=10&blocks=4&as=rgs&format=text&count=10000&start=20000')).text()).split('\n').filter(Boolean);
    expect(all).toHaveLength(10000);
    const pages: string[] = [];
    for (const start of [20000, 23000, 26500, 29999]) {
      const count = start === 29999 ? 1 : start === 26500 ? 3499 : start === 23000 ? 3500 : 3000;
      pages.push(...(await (await get(`/v1/set-partitions/list?n=10&blocks=4&as=rgs&format=text&count=${count}&start=${start}`)).text()).split('\n').filter(Boolean));
    }
    expect(pages).toEqual(all);
    expect((await json('/v1/set-partitions/count?n=10&blocks=4')).body.count).toBe('34105');
    expect((await json('/v1/set-partitions/list?n=10&blocks=4&start=34105')).body.members).toEqual([]);
  });
});

describe('GET /v1/set-partitions/rank and /unrank', () => {
  it('round trips: rank(unrank(r)) = r on random ranks, the first and the last, and unrank(rank(x)) = x (30 items in blocks of at most 4: ranks past 2^53)', async () => {
    const total = BigInt((await json('/v1/set-partitions/count?n=30&maxBlockSize=4')).body.count);
    expect(total > 2n ** 53n).toBe(true);
    for (const r of [0n, 1n, total - 1n, ...randomRanks('sp-ranks', total, 6)]) {
      const unranked = await json(`/v1/set-partitions/unrank?n=30&maxBlockSize=4&rank=${r}&as=rgs`);
      expect(unranked.body).toMatchObject({ family: { kind: 'set-partition', n: 30, maxBlockSize: 4 }, rank: String(r), total: String(total) });
      const ranked = await json(`/v1/set-partitions/rank?rgs=${unranked.body.rgs.join(',')}&maxBlockSize=4`);
      expect(ranked.body).toEqual({ family: { kind: 'set-partition', n: 30, maxBlockSize: 4 }, rgs: unranked.body.rgs, rank: String(r), total: String(total) });
      const asBlocks = await json(`/v1/set-partitions/unrank?n=30&maxBlockSize=4&rank=${r}`);
      expect(asBlocks.body.blocks).toEqual(blocksOf(unranked.body.rgs));
    }
    // The first member has blocks of 4 from the left; the last is all singletons.
    expect((await json('/v1/set-partitions/unrank?n=6&maxBlockSize=4&rank=0')).body.blocks).toEqual([[1, 2, 3, 4], [5, 6]]);
    expect((await json('/v1/set-partitions/unrank?n=6&rank=202&as=rgs')).body.rgs).toEqual([0, 1, 2, 3, 4, 5]);
  });

  it('takes n from the length of rgs, and checks it when given', async () => {
    expect((await json('/v1/set-partitions/rank?rgs=0,1,0,2')).body).toEqual({ family: { kind: 'set-partition', n: 4 }, rgs: [0, 1, 0, 2], rank: '7', total: '15' });
    expect((await json('/v1/set-partitions/rank?rgs=')).body).toMatchObject({ family: { n: 0 }, rank: '0', total: '1' });
  });
});

/** [request, status, parameter the problem names, words the detail must contain] */
const BAD: [string, number, string, RegExp][] = [
  ['/v1/set-partitions/rank?rgs=0,2,1', 422, 'rgs', /at most one more than the largest before it/],
  ['/v1/set-partitions/rank?rgs=1,0', 422, 'rgs', /entry 0 is 1/],
  ['/v1/set-partitions/rank?rgs=0,1,0&n=4', 422, 'rgs', /places 3 items, not n = 4/],
  ['/v1/set-partitions/rank?rgs=0,1,2&blocks=2', 422, 'rgs', /3 blocks, but the family has exactly 2/],
  ['/v1/set-partitions/rank?rgs=0,0,0,1&maxBlockSize=2', 422, 'rgs', /block 0 has 3 items, above maxBlockSize = 2/],
  ['/v1/set-partitions/rank?rgs=0,1,1&minBlockSize=2', 422, 'rgs', /block 0 has 1 item, below minBlockSize = 2/],
  ['/v1/set-partitions/rank?rgs=0,x', 400, 'rgs', /comma-separated list/],
  ['/v1/set-partitions/rank?n=3', 400, 'rgs', /required/],
  ['/v1/set-partitions/unrank?n=4&rank=15', 422, 'rank', /from 0 to 14; it has 15 members/],
  ['/v1/set-partitions/unrank?n=10&blocks=3&minBlockSize=4&rank=0', 422, 'rank', /no member/],
  ['/v1/set-partitions/unrank?n=4&rank=-1', 400, 'rank', /whole number/],
  ['/v1/set-partitions/unrank?n=4&rank=1&as=parts', 400, 'as', /one of: blocks, rgs/],
  ['/v1/set-partitions/list?n=4&start=16', 422, 'start', /from 0 to 15/],
  ['/v1/set-partitions/list?n=4&count=0', 400, 'count', /whole number from 1/],
  ['/v1/set-partitions/list?n=4&blocks=5', 422, 'blocks', /at most 4/],
  ['/v1/set-partitions/list?n=4&minBlockSize=3&maxBlockSize=2', 422, 'minBlockSize', /give minBlockSize <= maxBlockSize/],
  ['/v1/set-partitions/list?n=4&blocks=2&maxBlocks=3', 400, 'maxBlocks', /cannot be combined/],
  ['/v1/set-partitions/list?n=4&distinct=true', 400, 'distinct', /not a parameter/],
  ['/v1/set-partitions/list?n=3000&blocks=2&count=10000', 422, 'count', /at most 3333 members/],
];

describe('bad input gets a problem document naming the parameter', () => {
  it.each(BAD)('%s -> %i (%s)', async (path, status, param, detail) => {
    const response = await get(path);
    expect(response.status).toBe(status);
    expect(response.headers.get('content-type')).toMatch(/^application\/problem\+json/);
    const body = await response.json();
    expect(body.errors.map((e: { param: string }) => e.param)).toContain(param);
    expect(body.detail).toMatch(detail);
  });

  it('a family past the ranking limits is a 422 naming the limit', async () => {
    const body = (await json('/v1/set-partitions/list?n=6000')).body;
    expect(body.status).toBe(422);
    expect(body.detail).toMatch(/over the limit of n <= 5000 items/);
    const bounded = (await json('/v1/set-partitions/unrank?n=100&maxBlockSize=50&rank=0')).body;
    expect(bounded.status).toBe(422);
    expect(bounded.detail).toMatch(/needs more counting states than the limit allows/);
  });
});
