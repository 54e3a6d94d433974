import { describe, expect, it } from 'vitest';
import { compositionRanker } from '../../src/core/ranks/composition-ranker.js';
import { partitionRanker } from '../../src/core/ranks/partition-ranker.js';
import { listAll } from '../ranks/support.js';
import { appClient } from './helpers.js';

const { get } = appClient();

async function json(path: string) {
  const response = await get(path);
  return { response, body: await response.json() };
}

/** Every member of a family over HTTP, paging through NDJSON with start. */
async function listByPages(path: string, page: number): Promise<{ rank: string; parts: number[] }[]> {
  const out: { rank: string; parts: number[] }[] = [];
  for (let start = 0; ; start += page) {
    const response = await get(`${path}&format=ndjson&count=${page}&start=${start}`);
    expect(response.status).toBe(200);
    const lines = (await response.text()).split('\n').filter(Boolean);
    out.push(...lines.map((line) => JSON.parse(line)));
    if (lines.length < page) return out;
  }
}

describe('GET /v1/partitions/list and /v1/compositions/list', () => {
  it('lists the family in the documented order, each member with its rank (JSON)', async () => {
    const { response, body } = await json('/v1/partitions/list?n=6');
    expect(response.status).toBe(200);
    expect(response.headers.get('partsmith-total')).toBe('11');
    expect(response.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    expect(Object.keys(body)).toEqual(['family', 'total', 'start', 'members']);
    expect(body).toMatchObject({ family: { kind: 'partition', n: 6 }, total: '11', start: '0' });
    // The order of OEIS A080577 (n = 6), as in test/ranks/order.test.ts.
    expect(body.members.slice(0, 4)).toEqual([
      { rank: '0', parts: [6] },
      { rank: '1', parts: [5, 1] },
      { rank: '2', parts: [4, 2] },
      { rank: '3', parts: [4, 1, 1] },
    ]);
    expect(body.members.at(-1)).toEqual({ rank: '10', parts: [1, 1, 1, 1, 1, 1] });
  });

  it.each([
    ['/v1/partitions/list?n=12&maxLength=4', '/v1/partitions/count?n=12&maxLength=4'],
    ['/v1/partitions/list?n=30&distinct=true&minPart=2', '/v1/partitions/count?n=30&distinct=true&minPart=2'],
    ['/v1/partitions/list?n=25', '/v1/partitions/count?n=25'],
    ['/v1/compositions/list?n=10&allowed=1,2,3', '/v1/compositions/count?n=10&allowed=1,2,3'],
    ['/v1/compositions/list?n=12&length=4&minPart=0', '/v1/compositions/count?n=12&length=4&minPart=0'],
  ])('a full listing (paged) has as many members as %s counts, with ranks 0, 1, ...', async (list, count) => {
    const members = await listByPages(list, 400);
    const total = (await json(count)).body.count;
    expect(String(members.length)).toBe(total);
    members.forEach((m, i) => expect(m.rank).toBe(String(i)));
  });

  it('answers what the core ranker lists, in all three formats alike', async () => {
    const expected = listAll(partitionRanker({ kind: 'partition', n: 20, maxPart: 6 })).slice(17, 17 + 50);
    const base = '/v1/partitions/list?n=20&maxPart=6&start=17&count=50';
    const viaJson = (await json(base)).body.members;
    const viaNdjson = (await (await get(`${base}&format=ndjson`)).text()).split('\n').filter(Boolean).map((l) => JSON.parse(l));
    const viaText = (await (await get(`${base}&format=text`)).text()).split('\n').filter(Boolean).map((l) => {
      const [rank, parts] = l.split('\t');
      return { rank, parts: parts.split(' ').map(Number) };
    });
    const wanted = expected.map((parts, i) => ({ rank: String(17 + i), parts }));
    expect(viaJson).toEqual(wanted);
    expect(viaNdjson).toEqual(wanted);
    expect(viaText).toEqual(wanted);
  });

  it('writes partitions as multiplicities on request', async () => {
    const { body } = await json('/v1/partitions/list?n=8&as=multiplicities&count=3&start=6');
    expect(body.members).toEqual([
      { rank: '6', multiplicities: [[5, 1], [1, 3]] },
      { rank: '7', multiplicities: [[4, 2]] },
      { rank: '8', multiplicities: [[4, 1], [3, 1], [1, 1]] },
    ]);
    const text = await (await get('/v1/partitions/list?n=8&as=multiplicities&count=1&start=6&format=text')).text();
    expect(text).toBe('6\t5 1^3\n');
  });

  it('streams long listings completely (several chunks), and start = total gives an empty page', async () => {
    const ranker = partitionRanker({ kind: 'partition', n: 30 });
    const response = await get('/v1/partitions/list?n=30&count=10000&format=text');
    const lines = (await response.text()).split('\n').filter(Boolean);
    expect(String(lines.length)).toBe(String(ranker.count));
    expect(lines.at(-1)).toBe(`${ranker.count - 1n}\t${new Array(30).fill(1).join(' ')}`);
    const end = await json(`/v1/partitions/list?n=30&start=${ranker.count}`);
    expect(end.body.members).toEqual([]);
  });

  it('lists from a rank beyond 2^53 (ranks are decimal strings)', async () => {
    const ranker = compositionRanker({ kind: 'composition', n: 80 });
    const start = (1n << 70n) + 12345n;
    const { body } = await json(`/v1/compositions/list?n=80&start=${start}&count=3`);
    expect(body.members.map((m: { rank: string }) => m.rank)).toEqual([0n, 1n, 2n].map((i) => String(start + i)));
    expect(body.members.map((m: { parts: number[] }) => m.parts)).toEqual([0n, 1n, 2n].map((i) => ranker.unrank(start + i)));
    expect(body.total).toBe(String(1n << 79n));
  });

  it('lists an empty family as no member', async () => {
    const { response, body } = await json('/v1/partitions/list?n=7&allowed=2,4');
    expect(response.status).toBe(200);
    expect(body).toMatchObject({ total: '0', members: [] });
  });

  it('revalidates with the ETag and answers HEAD without a body', async () => {
    const first = await get('/v1/compositions/list?n=9&length=3');
    const etag = first.headers.get('etag')!;
    expect(etag).toMatch(/^"[0-9a-f]{32}"$/);
    expect((await get('/v1/compositions/list?length=3&n=9&start=0', { headers: { 'if-none-match': etag } })).status).toBe(304);
    const head = await get('/v1/compositions/list?n=9&length=3', { method: 'HEAD' });
    expect(head.status).toBe(200);
    expect(head.headers.get('partsmith-total')).toBe('28');
    expect(await head.text()).toBe('');
  });
});

describe('GET .../rank and .../unrank', () => {
  it('ranks a member and unranks the rank back, for partitions and compositions', async () => {
    const rank = await json('/v1/partitions/rank?parts=5,4,2,1');
    expect(rank.response.status).toBe(200);
    expect(rank.body).toEqual({ family: { kind: 'partition', n: 12 }, parts: [5, 4, 2, 1], rank: String(partitionRanker({ kind: 'partition', n: 12 }).rank([5, 4, 2, 1])), total: '77' });
    const back = await json(`/v1/partitions/unrank?n=12&rank=${rank.body.rank}`);
    expect(back.body).toEqual({ family: { kind: 'partition', n: 12 }, rank: rank.body.rank, total: '77', parts: [5, 4, 2, 1] });
    const multiplicities = await json(`/v1/partitions/unrank?n=12&rank=${rank.body.rank}&as=multiplicities`);
    expect(multiplicities.body.multiplicities).toEqual([[5, 1], [4, 1], [2, 1], [1, 1]]);
    const c = await json('/v1/compositions/rank?parts=0,3,0&length=3&minPart=0');
    expect(c.body).toMatchObject({ family: { kind: 'composition', n: 3, length: 3, minPart: 0 }, rank: '3', total: '10' }); // after 0+0+3, 0+1+2, 0+2+1
    expect((await json('/v1/compositions/unrank?n=3&length=3&minPart=0&rank=3')).body.parts).toEqual([0, 3, 0]);
  });

  it('takes n from the parts when it is not given, and checks it when it is', async () => {
    expect((await json('/v1/compositions/rank?parts=1,3,1')).body).toMatchObject({ family: { n: 5 }, rank: '6', total: '16' });
    expect((await json('/v1/compositions/rank?parts=1,3,1&n=5')).body.rank).toBe('6');
    expect((await json('/v1/partitions/rank?parts=')).body).toMatchObject({ family: { n: 0 }, rank: '0', total: '1' });
  });

  it('unranks the first and the last member', async () => {
    const count = (await json('/v1/partitions/count?n=40&distinct=true')).body.count;
    expect((await json('/v1/partitions/unrank?n=40&distinct=true&rank=0')).body.parts).toEqual([40]);
    // The lexicographically smallest: the smallest possible part at each place (1 + ... + 8 = 36 < 40 forces 9 first).
    expect((await json(`/v1/partitions/unrank?n=40&distinct=true&rank=${BigInt(count) - 1n}`)).body.parts).toEqual([9, 8, 7, 6, 4, 3, 2, 1]);
  });
});

/** [request, status, parameter the problem names, words the detail must contain] */
const BAD: [string, number, string, RegExp][] = [
  ['/v1/partitions/rank?parts=1,2', 422, 'parts', /listed largest first/],
  ['/v1/partitions/rank?parts=5,4,2&n=12', 422, 'parts', /sum to 11, not n = 12/],
  ['/v1/partitions/rank?parts=5,5,2&distinct=true', 422, 'parts', /more than once/],
  ['/v1/partitions/rank?parts=6,4&maxPart=5', 422, 'parts', /above maxPart = 5/],
  ['/v1/partitions/rank?parts=5,a', 400, 'parts', /comma-separated list/],
  ['/v1/partitions/rank?parts=5,,1', 400, 'parts', /comma-separated list/],
  ['/v1/partitions/rank?parts=0,3', 400, 'parts', /from 1 to/],
  ['/v1/partitions/rank?n=4', 400, 'parts', /required/],
  ['/v1/compositions/rank?parts=2,2&length=3', 422, 'parts', /2 parts, but the family has exactly 3/],
  ['/v1/compositions/rank?parts=2,-1', 400, 'parts', /comma-separated list/],
  ['/v1/partitions/unrank?n=12&rank=77', 422, 'rank', /from 0 to 76; it has 77 members/],
  ['/v1/compositions/unrank?n=3&rank=4', 422, 'rank', /from 0 to 3/],
  ['/v1/partitions/unrank?n=7&allowed=2,4&rank=0', 422, 'rank', /no member/],
  ['/v1/partitions/unrank?n=12&rank=-1', 400, 'rank', /whole number/],
  ['/v1/partitions/unrank?n=12&rank=1e3', 400, 'rank', /whole number/],
  ['/v1/partitions/unrank?n=12', 400, 'rank', /required/],
  ['/v1/partitions/list?n=12&start=78', 422, 'start', /from 0 to 77/],
  ['/v1/partitions/list?n=12&start=x', 400, 'start', /whole number/],
  ['/v1/partitions/list?n=12&count=0', 400, 'count', /whole number from 1/],
  ['/v1/partitions/list?n=12&count=10001', 400, 'count', /from 1 to 10000/],
  ['/v1/compositions/list?n=12&as=multiplicities', 400, 'as', /one of: parts/],
  ['/v1/partitions/list?n=12&seed=x', 400, 'seed', /not a parameter/],
  ['/v1/partitions/list?n=12&length=2&maxLength=3', 400, 'maxLength', /cannot be combined/],
  ['/v1/partitions/list?n=1000&count=10000&minPart=1', 200, '', /./],
  ['/v1/partitions/list?n=1500&count=10000', 422, 'count', /at most 6666 members/],
];

describe('bad input gets a problem document naming the parameter', () => {
  it.each(BAD)('%s -> %i (%s)', async (path, status, param, detail) => {
    const response = await get(path);
    expect(response.status).toBe(status);
    if (status === 200) return;
    expect(response.headers.get('content-type')).toMatch(/^application\/problem\+json/);
    const body = await response.json();
    expect(body.status).toBe(status);
    expect(body.errors.map((e: { param: string }) => e.param)).toContain(param);
    expect(body.detail).toMatch(detail);
  });

  it('a family past the rank tables is a 422 naming the limit and the n that fits', async () => {
    const response = await get('/v1/partitions/unrank?n=5000&rank=0');
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.detail).toMatch(/over the limit of 32 MiB per table; without constraints, n <= 1,670 fits/);
    const composition = await get(`/v1/compositions/unrank?n=${2 ** 20 + 2}&rank=0`);
    expect(composition.status).toBe(422);
    expect((await composition.json()).detail).toMatch(/n <= 1,048,577/);
  });
});
