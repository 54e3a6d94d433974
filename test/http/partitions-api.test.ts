import { describe, expect, it } from 'vitest';
import { familyKey, type PartitionFamily } from '../../src/core/family.js';
import { partsOf } from '../../src/core/partition.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { appClient } from './helpers.js';

const { get } = appClient();

async function json(path: string) {
  const response = await get(path);
  return { response, body: await response.json() };
}

describe('GET /v1/partitions', () => {
  it('returns the documented JSON document', async () => {
    const { response, body } = await json('/v1/partitions?n=12&count=2&seed=demo');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^application\/json/);
    expect(Object.keys(body)).toEqual(['family', 'seed', 'start', 'method', 'samples']);
    expect(body.family).toEqual({ kind: 'partition', n: 12 });
    expect(body.seed).toBe('demo');
    expect(body.start).toBe(0);
    expect(typeof body.method).toBe('string');
    expect(body.samples).toHaveLength(2);
    for (const parts of body.samples as number[][]) {
      expect(parts.reduce((a, b) => a + b, 0)).toBe(12);
      expect([...parts].sort((a, b) => b - a)).toEqual(parts);
    }
  });

  it('gives sample i of a seed whatever start and count frame it', async () => {
    const whole = (await json('/v1/partitions?n=40&count=10&seed=slice')).body.samples;
    const tail = (await json('/v1/partitions?n=40&start=5&count=5&seed=slice')).body.samples;
    const one = (await json('/v1/partitions?n=40&start=7&seed=slice')).body.samples;
    expect(tail).toEqual(whole.slice(5));
    expect(one).toEqual([whole[7]]);
  });

  it('serves sample i of the core stream (seed, i, familyKey(family)), however the family is spelled', async () => {
    const family: PartitionFamily = { kind: 'partition', n: 40, minPart: 2, allowed: [2, 3, 7, 11] };
    const sampler = planPartitionSampler(family);
    const expected = [3, 4, 5].map((i) => partsOf(sampler.sample(sampleSource('core', i, familyKey(family)))));
    const { body } = await json('/v1/partitions?allowed=11,3,7,2,3&n=40&minPart=2&seed=core&start=3&count=3');
    expect(body.samples).toEqual(expected);
    expect(JSON.stringify(body.family)).toBe(familyKey(family));
  });

  it('answers the same URL twice with byte-identical bodies and the same strong ETag', async () => {
    const url = '/v1/partitions?n=300&count=20&seed=twice&as=multiplicities';
    const [a, b] = [await get(url), await get(url)];
    expect(await a.text()).toBe(await b.text());
    expect(a.headers.get('etag')).toMatch(/^"[0-9a-f]{32}"$/);
    expect(a.headers.get('etag')).toBe(b.headers.get('etag'));
    expect(a.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
  });

  it('gives the same samples and ETag however the query is spelled', async () => {
    const a = await get('/v1/partitions?n=30&count=3&seed=spell');
    const b = await get('/v1/partitions?seed=spell&count=3&n=030&format=json&as=parts&start=0');
    expect(await a.text()).toBe(await b.text());
    expect(a.headers.get('etag')).toBe(b.headers.get('etag'));
  });

  it('answers If-None-Match with 304', async () => {
    const url = '/v1/partitions?n=25&seed=etag';
    const etag = (await get(url)).headers.get('etag')!;
    const again = await get(url, { headers: { 'if-none-match': etag } });
    expect(again.status).toBe(304);
    expect(again.headers.get('etag')).toBe(etag);
    expect(await again.text()).toBe('');
  });

  it('draws a seed when none is given, returns it, and forbids caching', async () => {
    const response = await get('/v1/partitions?n=10&count=2');
    const body = await response.json();
    expect(body.seed).toBe('drawn-seed');
    expect(response.headers.get('partsmith-seed')).toBe('drawn-seed');
    expect(response.headers.get('cache-control')).toBe('no-store');
    expect(response.headers.get('etag')).toBeNull();
    const replay = await (await get('/v1/partitions?n=10&count=2&seed=drawn-seed')).json();
    expect(replay.samples).toEqual(body.samples);
  });

  it('draws different seeds by default (Web Crypto)', async () => {
    const { app } = appClient({ drawSeed: undefined });
    const seeds = new Set<string>();
    for (let i = 0; i < 5; i++) seeds.add((await (await app.fetch(new Request('http://x/v1/partitions?n=5'))).json()).seed);
    expect(seeds.size).toBe(5);
    for (const seed of seeds) expect(seed).toMatch(/^[A-Za-z0-9]{16}$/);
  });

  it('writes the multiplicity form as [part, multiplicity] pairs, largest part first', async () => {
    const parts = (await json('/v1/partitions?n=60&count=5&seed=forms')).body.samples as number[][];
    const pairs = (await json('/v1/partitions?n=60&count=5&seed=forms&as=multiplicities')).body.samples as number[][][];
    pairs.forEach((sample, i) => {
      const expanded = sample.flatMap(([part, m]) => new Array(m).fill(part));
      expect(expanded).toEqual(parts[i]);
      for (let j = 1; j < sample.length; j++) expect(sample[j][0]).toBeLessThan(sample[j - 1][0]);
    });
  });

  it('streams NDJSON, one line per sample with its index', async () => {
    const response = await get('/v1/partitions?n=50&count=4&start=3&seed=nd&format=ndjson');
    expect(response.headers.get('content-type')).toMatch(/^application\/x-ndjson/);
    const lines = (await response.text()).trimEnd().split('\n').map((l) => JSON.parse(l));
    const reference = (await json('/v1/partitions?n=50&count=4&start=3&seed=nd')).body.samples;
    expect(lines.map((l) => l.index)).toEqual([3, 4, 5, 6]);
    expect(lines.map((l) => l.parts)).toEqual(reference);
    const pairs = (await (await get('/v1/partitions?n=50&count=1&seed=nd&format=ndjson&as=multiplicities')).text()).trim();
    expect(Object.keys(JSON.parse(pairs))).toEqual(['index', 'multiplicities']);
  });

  it('writes text: parts separated by spaces, part^multiplicity in the multiplicity form', async () => {
    const text = await (await get('/v1/partitions?n=50&count=3&seed=tx&format=text')).text();
    const reference = (await json('/v1/partitions?n=50&count=3&seed=tx')).body.samples as number[][];
    expect(text).toBe(reference.map((p) => p.join(' ')).join('\n') + '\n');
    const compact = await (await get('/v1/partitions?n=50&count=3&seed=tx&format=text&as=multiplicities')).text();
    const expanded = compact
      .trimEnd()
      .split('\n')
      .map((line) => line.split(' ').flatMap((token) => {
        const [part, m] = token.split('^').map(Number);
        return new Array(m ?? 1).fill(part);
      }));
    expect(expanded).toEqual(reference);
    expect(compact).toMatch(/\^/);
  });

  it('returns the empty partition for n = 0', async () => {
    expect((await json('/v1/partitions?n=0&seed=zero')).body.samples).toEqual([[]]);
    expect(await (await get('/v1/partitions?n=0&seed=zero&format=text')).text()).toBe('\n');
  });
});

describe('GET /v1/partitions/count', () => {
  it.each([
    // OEIS A000041.
    [0, '1'],
    [12, '77'],
    [100, '190569292'],
    [1000, '24061467864032622473692149727991'],
  ])('p(%i) = %s (OEIS A000041)', async (n, count) => {
    const { response, body } = await json(`/v1/partitions/count?n=${n}`);
    expect(response.status).toBe(200);
    expect(body).toEqual({ family: { kind: 'partition', n }, count });
  });
});

describe('meta endpoints', () => {
  it('GET /healthz', async () => {
    const { body } = await json('/healthz');
    expect(body.status).toBe('ok');
    expect(body.version).toMatch(/^\d+\.\d+\.\d+$/);
  });
  it('GET /openapi.json is OpenAPI 3.1 generated from the schemas', async () => {
    const { body } = await json('/openapi.json');
    expect(body.openapi).toBe('3.1.0');
    const params = body.paths['/v1/partitions'].get.parameters as { name: string; required: boolean; schema: Record<string, unknown> }[];
    const byName = Object.fromEntries(params.map((p) => [p.name, p]));
    expect(byName.n.required).toBe(true);
    expect(byName.n.schema).toMatchObject({ type: 'integer', minimum: 0, maximum: 1_000_000_000 });
    expect(byName.count.required).toBe(false);
    expect(byName.format.schema.enum).toEqual(['json', 'ndjson', 'text']);
    expect(byName.seed.schema.pattern).toBeDefined();
    expect(Object.keys(body.paths)).toEqual(expect.arrayContaining(['/v1/partitions', '/v1/partitions/count', '/healthz', '/openapi.json']));
  });
});
