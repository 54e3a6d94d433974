import { describe, expect, it } from 'vitest';
import { appClient } from './helpers.js';

const { get } = appClient();

/** [request, expected status, offending parameter (or null when the problem is not about one)] */
const BAD_REQUESTS: [string, number, string | null][] = [
  ['/v1/partitions', 400, 'n'],
  ['/v1/partitions?n=', 400, 'n'],
  ['/v1/partitions?n=abc', 400, 'n'],
  ['/v1/partitions?n=-5', 400, 'n'],
  ['/v1/partitions?n=1.5', 400, 'n'],
  ['/v1/partitions?n=1e3', 400, 'n'],
  ['/v1/partitions?n=+5', 400, 'n'],
  ['/v1/partitions?n=%205', 400, 'n'],
  ['/v1/partitions?n=0x10', 400, 'n'],
  ['/v1/partitions?n=1000000001', 400, 'n'],
  ['/v1/partitions?n=99999999999999999999', 400, 'n'],
  ['/v1/partitions?n=１２', 400, 'n'],
  ['/v1/partitions?n=10&n=12', 400, 'n'],
  ['/v1/partitions?n=10&cout=5', 400, 'cout'],
  ['/v1/partitions?n=10&N=5', 400, 'N'],
  ['/v1/partitions?n=10&count=0', 400, 'count'],
  ['/v1/partitions?n=10&count=10001', 400, 'count'],
  ['/v1/partitions?n=10&count=', 400, 'count'],
  ['/v1/partitions?n=10&count=2.0', 400, 'count'],
  ['/v1/partitions?n=10&start=-1', 400, 'start'],
  ['/v1/partitions?n=10&start=1000000000000001', 400, 'start'],
  ['/v1/partitions?n=10&seed=', 400, 'seed'],
  ['/v1/partitions?n=10&seed=has%20space', 400, 'seed'],
  ['/v1/partitions?n=10&seed=' + 'x'.repeat(65), 400, 'seed'],
  ['/v1/partitions?n=10&seed=%C3%A9', 400, 'seed'],
  ['/v1/partitions?n=10&format=xml', 400, 'format'],
  ['/v1/partitions?n=10&format=JSON', 400, 'format'],
  ['/v1/partitions?n=10&as=pairs', 400, 'as'],
  ['/v1/partitions?n=10&distinct=yes', 400, 'distinct'],
  ['/v1/partitions?n=10&minPart=0', 400, 'minPart'],
  ['/v1/partitions?n=10&allowed=', 400, 'allowed'],
  ['/v1/partitions?n=10&allowed=1,,2', 400, 'allowed'],
  ['/v1/partitions?n=10&allowed=0,1', 400, 'allowed'],
  ['/v1/partitions?n=10&length=3&maxLength=4', 400, 'maxLength'],
  ['/v1/partitions?n=10&__proto__=1', 400, '__proto__'],
  ['/v1/partitions?n=10&constructor=1', 400, 'constructor'],
  ['/v1/partitions/count', 400, 'n'],
  ['/v1/partitions/count?n=10&count=3', 400, 'count'],
  ['/v1/partitions/count?n=10&seed=abc', 400, 'seed'],
  ['/healthz?verbose=1', 400, 'verbose'],
  ['/v1/partitions?n=' + '9'.repeat(5000), 414, null],
  ['/v1/nothing-here', 404, null],
  ['/v1/partitions/', 404, null],
];

describe('bad requests get RFC 9457 problem details naming the parameter', () => {
  it(`the table has at least 30 cases (${BAD_REQUESTS.length})`, () => {
    expect(BAD_REQUESTS.length).toBeGreaterThanOrEqual(30);
  });
  it.each(BAD_REQUESTS)('%s -> %i (%s)', async (path, status, param) => {
    const response = await get(path);
    expect(response.status).toBe(status);
    expect(response.headers.get('content-type')).toMatch(/^application\/problem\+json/);
    const body = await response.json();
    expect(body).toMatchObject({ status, title: expect.any(String), type: expect.any(String), detail: expect.any(String) });
    if (param !== null) {
      expect(body.errors.map((e: { param: string }) => e.param)).toContain(param);
      for (const e of body.errors) expect(e.message.length).toBeGreaterThan(3);
    }
    expect(JSON.stringify(body)).not.toMatch(/\bat .*\.(ts|js):\d+|node_modules|\/work\//);
  });
  it('reports every offending parameter at once', async () => {
    const body = await (await get('/v1/partitions?n=x&count=0&format=xml&oops=1')).json();
    expect(body.errors.map((e: { param: string }) => e.param).sort()).toEqual(['count', 'format', 'n', 'oops']);
  });
  it('refuses, with 422 naming count and stating the limit, a response over the size limit', async () => {
    const small = appClient({ limits: { maxNumbers: 1000 } });
    const response = await small.get('/v1/partitions?n=200&count=500&seed=big');
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.errors[0].param).toBe('count');
    expect(body.detail).toMatch(/limit is 1,000 per response/);
  });
  it('refuses, with 422 naming count, a request over the work limit', async () => {
    const small = appClient({ limits: { workBudgetMs: 0.01 } });
    const response = await small.get('/v1/partitions?n=200&count=5&seed=work');
    expect(response.status).toBe(422);
    expect((await response.json()).detail).toMatch(/of work \(5 samples at about [0-9.]+ ms each\); the limit is 0.01 ms of work per request. Ask for count=\d+, then page with start=\d+/);
  });
  it.each(['POST', 'PUT', 'DELETE', 'PATCH'])('%s is 405 with Allow', async (method) => {
    const response = await get('/v1/partitions?n=5', { method });
    expect(response.status).toBe(405);
    expect(response.headers.get('allow')).toContain('GET');
    expect((await response.json()).status).toBe(405);
  });
  it('HEAD is answered like GET without a body', async () => {
    const response = await get('/v1/partitions?n=5&seed=head', { method: 'HEAD' });
    expect(response.status).toBe(200);
    expect(await response.text()).toBe('');
  });
});
