import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { SeedEtags, strongEtag } from '../../src/http/caching.js';
import { parseQuery, QueryReader } from '../../src/http/query.js';
import { compositionsQuery } from '../../src/schemas/compositions.js';
import { partitionsCountQuery, partitionsQuery } from '../../src/schemas/partitions.js';

describe('ETag', () => {
  it('is a quoted 32-hex-digit strong tag, deterministic, and changes with every query value', () => {
    const tag = strongEtag('/v1/partitions', { n: 1000, seed: 'demo' });
    expect(tag).toMatch(/^"[0-9a-f]{32}"$/);
    expect(strongEtag('/v1/partitions', { n: 1000, seed: 'demo' })).toBe(tag);
    expect(strongEtag('/v1/partitions', { n: 1001, seed: 'demo' })).not.toBe(tag);
    expect(strongEtag('/v1/partitions', { n: 1000, seed: 'demp' })).not.toBe(tag);
    expect(strongEtag('/v1/compositions', { n: 1000, seed: 'demo' })).not.toBe(tag);
  });
  it('gives 100,000 distinct seeds 100,000 distinct tags', () => {
    const tags = new Set<string>();
    for (let i = 0; i < 100_000; i++) tags.add(strongEtag('/v1/partitions', { n: 1000, seed: `s${i}` }));
    expect(tags.size).toBe(100_000);
  });
  it('hashes the parsed query, which has the same JSON however the URL orders and spells it', () => {
    const spellings = [
      '/v1/partitions?n=30&count=3&seed=spell',
      '/v1/partitions?seed=spell&count=3&n=030&format=json&as=parts&start=0',
      '/v1/partitions?as=parts&start=0&format=json&n=30&seed=spell&count=3',
    ].map((url) => JSON.stringify(parseQuery(url, partitionsQuery)));
    // Schema order, defaults filled in (see the schema in src/schemas).
    expect(spellings[0]).toBe('{"n":30,"count":3,"seed":"spell","start":0,"format":"json","as":"parts"}');
    expect(new Set(spellings).size).toBe(1);
    const countSpellings = ['/v1/partitions/count?n=9&distinct=true&maxPart=5', '/v1/partitions/count?maxPart=5&distinct=true&n=9'];
    expect(new Set(countSpellings.map((url) => JSON.stringify(parseQuery(url, partitionsCountQuery)))).size).toBe(1);
  });

  it('SeedEtags: the tag of a query with any seed, from its fixed part hashed once, equals strongEtag', () => {
    const queries = [
      '/v1/partitions?n=30&seed=x',
      '/v1/partitions?n=30&allowed=5,1,2&maxLength=9&distinct=true&format=ndjson&seed=x',
      '/v1/compositions?n=12&length=3&seed=x',
    ];
    for (const url of queries) {
      const path = url.slice(0, url.indexOf('?'));
      const parsed = parseQuery(url, path === '/v1/partitions' ? partitionsQuery : compositionsQuery) as Record<string, unknown>;
      const etags = new SeedEtags(path, parsed);
      for (const seed of ['x', 'other-seed', 'a.b_c~d:e-f', 'x'.repeat(64)]) expect(etags.etag(seed), `${url} ${seed}`).toBe(strongEtag(path, { ...parsed, seed }));
    }
    expect(() => new SeedEtags('/v1/partitions', { n: 3 })).toThrow(RangeError);
  });

  it('responses carry the strong ETag of their parsed query, first and later requests alike', async () => {
    const app = createApp();
    const reader = new QueryReader(partitionsQuery);
    for (const url of ['/v1/partitions?n=40&seed=e1', '/v1/partitions?n=40&seed=e2', '/v1/partitions?seed=e3&n=40&as=multiplicities', '/v1/partitions?n=41&seed=e1']) {
      const response = await app.fetch(new Request(`http://etag.test${url}`));
      expect(response.headers.get('etag'), url).toBe(strongEtag('/v1/partitions', reader.read(`http://etag.test${url}`).query));
    }
  });

  it('QueryMemo: shared by queries that differ only in their seed, and only by those', () => {
    const reader = new QueryReader(partitionsQuery);
    const memo = (url: string) => reader.read(`http://memo.test${url}`).memo;
    expect(memo('/v1/partitions?n=5&seed=a')).toBe(memo('/v1/partitions?n=5&seed=b'));
    expect(memo('/v1/partitions?n=5&seed=a')).not.toBe(memo('/v1/partitions?n=6&seed=a'));
    expect(memo('/v1/partitions?n=5')).not.toBe(memo('/v1/partitions?n=5')); // no seed: nothing shared
    let made = 0;
    const first = memo('/v1/partitions?n=7&seed=a').get('x', () => ++made);
    expect([first, memo('/v1/partitions?n=7&seed=z').get('x', () => ++made), made]).toEqual([1, 1, 1]);
  });
});
