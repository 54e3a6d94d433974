import { describe, expect, it } from 'vitest';
import { strongEtag } from '../../src/http/caching.js';
import { parseQuery } from '../../src/http/query.js';
import { partitionsCountQuery, partitionsQuery } from '../../src/http/schemas/partitions.js';

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
    // Schema order, defaults filled in (see the schema in src/http/schemas).
    expect(spellings[0]).toBe('{"n":30,"count":3,"seed":"spell","start":0,"format":"json","as":"parts"}');
    expect(new Set(spellings).size).toBe(1);
    const countSpellings = ['/v1/partitions/count?n=9&distinct=true&maxPart=5', '/v1/partitions/count?maxPart=5&distinct=true&n=9'];
    expect(new Set(countSpellings.map((url) => JSON.stringify(parseQuery(url, partitionsCountQuery)))).size).toBe(1);
  });
});
