import { describe, expect, it } from 'vitest';
import { appClient } from './helpers.js';

const { get } = appClient();

describe('GET /v1/compositions', () => {
  it('returns compositions of n in order, with the shared document shape', async () => {
    const body = await (await get('/v1/compositions?n=20&count=5&seed=demo')).json();
    expect(Object.keys(body)).toEqual(['family', 'seed', 'start', 'method', 'samples']);
    expect(body.family).toEqual({ kind: 'composition', n: 20 });
    for (const parts of body.samples as number[][]) expect(parts.reduce((a, b) => a + b, 0)).toBe(20);
  });

  it('keeps the seed/start/count contract and the three formats', async () => {
    const whole = (await (await get('/v1/compositions?n=30&count=6&seed=c&length=4')).json()).samples as number[][];
    const tail = (await (await get('/v1/compositions?n=30&count=3&start=3&seed=c&length=4')).json()).samples;
    expect(tail).toEqual(whole.slice(3));
    const text = await (await get('/v1/compositions?n=30&count=6&seed=c&length=4&format=text')).text();
    expect(text).toBe(whole.map((p) => p.join(' ')).join('\n') + '\n');
    const nd = (await (await get('/v1/compositions?n=30&count=6&seed=c&length=4&format=ndjson')).text()).trimEnd().split('\n').map((l) => JSON.parse(l));
    expect(nd.map((l) => l.parts)).toEqual(whole);
    for (const parts of whole) expect(parts).toHaveLength(4);
  });

  it('serves weak compositions (minPart=0 with length) and bounded/allowed parts', async () => {
    const weak = (await (await get('/v1/compositions?n=5&length=4&minPart=0&count=50&seed=w')).json()).samples as number[][];
    expect(weak.some((p) => p.includes(0))).toBe(true);
    const allowed = (await (await get('/v1/compositions?n=15&allowed=4,1,3&count=50&seed=a')).json());
    expect(allowed.family).toEqual({ kind: 'composition', n: 15, allowed: [1, 3, 4] });
    for (const p of allowed.samples as number[][]) for (const x of p) expect([1, 3, 4]).toContain(x);
  });

  it.each([
    // 2^(n-1) compositions of n (Stanley, EC1 §1.2): 2^9 = 512.
    ['n=10', '512'],
    // C(n-1, k-1) = C(13, 3) = 286 compositions of 14 into 4 parts (Stanley, EC1 §1.2).
    ['n=14&length=4', '286'],
    // Weak: C(n+k-1, k-1) = C(10, 2) = 45.
    ['n=8&length=3&minPart=0', '45'],
    // Parts in {1, 2}: Fibonacci F(n+1) = F(11) = 89 (OEIS A000045).
    ['n=10&allowed=1,2', '89'],
  ])('counts %s = %s', async (query, count) => {
    expect((await (await get(`/v1/compositions/count?${query}`)).json()).count).toBe(count);
  });

  it.each([
    ['/v1/compositions?n=10&as=multiplicities', 400, 'as'],
    ['/v1/compositions?n=10&minPart=0', 400, 'minPart'],
    ['/v1/compositions?n=10&distinct=true', 400, 'distinct'],
    ['/v1/compositions/count?n=10&minPart=0', 400, 'minPart'],
  ])('%s -> %i naming %s', async (path, status, param) => {
    const response = await get(path);
    expect(response.status).toBe(status);
    expect((await response.json()).errors.map((e: { param: string }) => e.param)).toContain(param);
  });

  it('answers an empty family with 422 saying why', async () => {
    const response = await get('/v1/compositions?n=7&allowed=2,4&seed=e');
    expect(response.status).toBe(422);
    expect((await response.json()).detail).toMatch(/no composition of 7 has all parts in \{2, 4\}/);
  });

  it('refuses an unrestricted composition too large for one response, stating the limit', async () => {
    const response = await get('/v1/compositions?n=1000000000&seed=big');
    expect(response.status).toBe(422);
    expect((await response.json()).detail).toMatch(/10,000,000/);
  });
});
