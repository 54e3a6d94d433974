import { describe, expect, it } from 'vitest';
import { hash128, sortedQuery, strongEtag } from '../../src/http/caching.js';

describe('ETag hash', () => {
  it('is 32 hex digits, deterministic, and sensitive to every character', () => {
    const base = 'n=1000&seed=demo';
    expect(hash128(base)).toMatch(/^[0-9a-f]{32}$/);
    expect(hash128(base)).toBe(hash128(base));
    const seen = new Set<string>();
    for (let i = 0; i < base.length; i++) {
      const changed = base.slice(0, i) + String.fromCharCode(base.charCodeAt(i) ^ 1) + base.slice(i + 1);
      seen.add(hash128(changed));
    }
    expect(seen.size).toBe(base.length);
    expect(seen.has(hash128(base))).toBe(false);
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
