import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { ConfigurationError, limitsFromEnvironment, unknownSettings } from '../../src/http/limits.js';
import { API_CONTENT_SECURITY_POLICY, cspHash, htmlContentSecurityPolicy } from '../../src/http/middleware/index.js';
import { Hono } from 'hono';
import { securityHeaders } from '../../src/http/middleware/security-headers.js';

const app = createApp({ limits: { workBudgetMs: 200 } });
const get = (path: string, init?: RequestInit) => app.fetch(new Request(`http://x${path}`, init));

describe('strict parameters', () => {
  it.each(['__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf'])('a %s key is a harmless 400 naming it', async (key) => {
    const response = await get(`/v1/partitions?n=5&${key}=1`);
    expect(response.status).toBe(400);
    const problem = await response.json();
    expect(problem.errors).toEqual([{ param: key, message: 'is not a parameter of this endpoint' }]);
    // The app is unharmed: the next request is served as usual.
    expect((await get('/v1/partitions?n=5&seed=a')).status).toBe(200);
  });

  it('a repeated parameter is a 400 naming it once', async () => {
    const problem = await (await get('/v1/partitions?n=5&n=5&n=6')).json();
    expect(problem.errors).toEqual([{ param: 'n', message: 'is given more than once; give it once' }]);
  });

  it('a malformed value is reported as malformed, not as missing', async () => {
    for (const value of ['abc', '-1', '1e3', '', '%zz', '١٢']) {
      const problem = await (await get(`/v1/partitions?n=${value}`)).json();
      expect(problem.errors[0].param).toBe('n');
      expect(problem.errors[0].message).toMatch(/whole number/);
    }
  });

  it('refuses long URLs (414) and long values (414 for the query, 400 for the value) early', async () => {
    expect((await get(`/v1/partitions?n=5&seed=${'a'.repeat(5000)}`)).status).toBe(414);
    expect((await get(`/${'p'.repeat(600)}`)).status).toBe(414);
    expect((await get(`/v1/partitions?n=5&x=${'a'.repeat(9000)}`)).status).toBe(414);
    const long = await get(`/v1/partitions?n=5&seed=${'a'.repeat(65)}`);
    expect(long.status).toBe(400);
    expect((await long.json()).errors[0].param).toBe('seed');
  });

  it('never puts internals in a body, even for malformed percent-encoding', async () => {
    for (const path of ['/v1/%E0%A4%A', '/%', '/v1/partitions?n=%E0%A4%A', '/v1/partitions?%=%&%%=1', '/v1/partitions?n=5&seed=%00', '/..%2f..%2fetc']) {
      const response = await get(path);
      expect(response.status).toBeGreaterThanOrEqual(400);
      expect(response.status).toBeLessThan(500);
      const text = await response.text();
      expect(text).not.toMatch(/at \S+ \(|node_modules|\.ts:|\/src\/|Error/);
      expect(JSON.parse(text).detail).toBeTruthy();
    }
  });

  it('a request past a limit of the service is a 422 that says "limit", naming which', async () => {
    // Found by the long fuzz run: the exact count of p(n) past n = 100000 was refused without
    // saying that a limit, rather than the query, was the reason.
    for (const path of ['/v1/partitions/count?n=1000000000', '/v1/partitions/count?n=100001']) {
      const response = await get(path);
      expect(response.status).toBe(422);
      expect((await response.json()).detail).toMatch(/\(limit: n <= 100000\)$/);
    }
  });
});

describe('methods and CORS', () => {
  it('answers a CORS preflight on an endpoint with 204', async () => {
    const response = await get('/v1/partitions', { method: 'OPTIONS', headers: { origin: 'https://example.org', 'access-control-request-method': 'GET' } });
    expect(response.status).toBe(204);
    expect(response.headers.get('access-control-allow-origin')).toBe('*');
    expect(response.headers.get('access-control-allow-methods')).toBe('GET, HEAD, OPTIONS');
    expect(response.headers.get('allow')).toBe('GET, HEAD, OPTIONS');
  });

  it.each(['POST', 'PUT', 'DELETE', 'PATCH'])('%s is 405 with Allow', async (method) => {
    const response = await get('/v1/partitions?n=5', { method });
    expect(response.status).toBe(405);
    expect(response.headers.get('allow')).toBe('GET, HEAD, OPTIONS');
    expect(response.headers.get('content-type')).toMatch(/^application\/problem\+json/);
  });

  it('exposes the replay and caching headers to cross-origin scripts on every response', async () => {
    for (const path of ['/v1/partitions?n=5&seed=a', '/v1/partitions?bad=1', '/nowhere', '/healthz']) {
      const response = await get(path);
      expect(response.headers.get('access-control-allow-origin')).toBe('*');
      expect(response.headers.get('access-control-expose-headers')).toBe('ETag, Partsmith-Seed, Partsmith-Method, Partsmith-Total, Retry-After');
    }
  });

  it('HEAD gives the headers of GET and draws no samples', async () => {
    let readings = 0;
    const counted = createApp({ clock: () => readings++ });
    const response = await counted.fetch(new Request('http://x/v1/partitions?n=5&count=100&seed=a', { method: 'HEAD' }));
    expect(response.status).toBe(200);
    expect(response.headers.get('etag')).toBeTruthy();
    expect(readings).toBe(1); // the deadline's start only: no per-sample checks ran
  });
});

describe('security headers', () => {
  it('are on every response, with the no-content policy for data', async () => {
    for (const [path, method] of [['/v1/partitions?n=5', 'GET'], ['/v1/partitions?x=1', 'GET'], ['/nope', 'GET'], ['/v1/partitions', 'POST'], ['/openapi.json', 'GET']]) {
      const response = await get(path, { method });
      expect(response.headers.get('x-content-type-options')).toBe('nosniff');
      expect(response.headers.get('referrer-policy')).toBe('no-referrer');
      expect(response.headers.get('content-security-policy')).toBe(API_CONTENT_SECURITY_POLICY);
    }
  });

  it('HTML pages get a same-origin policy that allows their inline blocks by hash only', async () => {
    const script = 'document.title = "partsmith";';
    const style = 'body { margin: 0 }';
    const html = `<!doctype html><style>${style}</style><script src="/app.js"></script><script>${script}</script><p>hi</p>`;
    const page = new Hono();
    page.use('*', securityHeaders());
    page.get('/', (c) => c.html(html));
    const response = await page.fetch(new Request('http://x/'));
    const policy = response.headers.get('content-security-policy')!;
    expect(await response.text()).toBe(html);
    expect(policy).toBe(await htmlContentSecurityPolicy(html));
    expect(policy).toContain(`script-src 'self' ${await cspHash(script)}`);
    expect(policy).toContain(`style-src 'self' ${await cspHash(style)}`);
    expect(policy).toContain("default-src 'none'");
    expect(policy).not.toMatch(/unsafe/);
    // SHA-256 of the empty string, base64 (FIPS 180-4 test vector e3b0c442...b855, from memory).
    expect(await cspHash('')).toBe("'sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU='");
  });
});

describe('configuration from the environment', () => {
  it('reads PARTSMITH_* limits, keeping defaults for absent ones', () => {
    expect(limitsFromEnvironment({ PARTSMITH_WORK_BUDGET_MS: '3e3', PARTSMITH_DEADLINE_MS: '2_500', PARTSMITH_MAX_COUNT: '' })).toEqual({ workBudgetMs: 3000, deadlineMs: 2500 });
    expect(limitsFromEnvironment({})).toEqual({});
  });

  it('refuses bad values with a message naming every bad variable', () => {
    const attempt = () => limitsFromEnvironment({ PARTSMITH_WORK_BUDGET_MS: 'lots', PARTSMITH_DEADLINE_MS: '0', PARTSMITH_MAX_COUNT: '1.5' });
    expect(attempt).toThrow(ConfigurationError);
    expect(attempt).toThrow(/PARTSMITH_WORK_BUDGET_MS must be .*, got "lots"/);
    expect(attempt).toThrow(/PARTSMITH_DEADLINE_MS must be .*, got "0"/);
    expect(attempt).toThrow(/PARTSMITH_MAX_COUNT must be .*, got "1.5"/);
  });

  it('points out PARTSMITH_* names that are not settings', () => {
    expect(unknownSettings({ PARTSMITH_MAX_WROK: '1', PARTSMITH_WORK_BUDGET_MS: '1', PATH: '/bin' })).toEqual(['PARTSMITH_MAX_WROK']);
  });

  it('refuses the retired PARTSMITH_MAX_WORK at startup, naming the variable that replaces it', () => {
    const attempt = () => limitsFromEnvironment({ PARTSMITH_MAX_WORK: '2e7' });
    expect(attempt).toThrow(ConfigurationError);
    expect(attempt).toThrow(/PARTSMITH_MAX_WORK is no longer a setting: .*PARTSMITH_WORK_BUDGET_MS \(milliseconds per request, default 2000\)/);
    expect(unknownSettings({ PARTSMITH_MAX_WORK: '2e7' })).toEqual([]); // refused, not also warned about
  });

  it('a raised count limit is honoured by the app and a lowered one enforced', async () => {
    const raised = createApp({ limits: { maxCount: 20_000 } });
    expect((await raised.fetch(new Request('http://x/v1/partitions?n=3&count=20000&format=text'))).status).toBe(200);
    const lowered = createApp({ limits: { maxCount: 10 } });
    const problem = await (await lowered.fetch(new Request('http://x/v1/partitions?n=3&count=11'))).json();
    expect(problem.errors).toEqual([{ param: 'count', message: 'must be a whole number from 1 to 10, written with digits only' }]);
  });

  it('the work budget refuses oversized requests with 422 naming count', async () => {
    const small = createApp({ limits: { workBudgetMs: 0.05 } });
    const response = await small.fetch(new Request('http://x/v1/partitions?n=1000&count=10'));
    expect(response.status).toBe(422);
    expect((await response.json()).errors[0].param).toBe('count');
  });
});
