import { describe, expect, it } from 'vitest';
import { sortedQuery, strongEtag } from '../../src/http/caching.js';

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
  it('canonicalises the query: keys in code-point order, undefined values dropped, "__proto__" kept as data', () => {
    const query = JSON.parse('{"seed":"x","n":5,"__proto__":"p","as":"parts","start":0}') as Record<string, unknown>;
    query.count = undefined;
    const sorted = sortedQuery(query);
    // Expected text written by hand from the rule (ECMA-262 JSON.stringify on own keys, in order).
    expect(JSON.stringify(sorted)).toBe('{"__proto__":"p","as":"parts","n":5,"seed":"x","start":0}');
    expect(Object.getPrototypeOf(sorted)).toBe(Object.prototype);
  });
});
