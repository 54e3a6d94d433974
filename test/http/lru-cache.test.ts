import { describe, expect, it } from 'vitest';
import { LruCache } from '../../src/http/lru-cache.js';

describe('LruCache', () => {
  it('creates once per key and evicts the least recently used', () => {
    const cache = new LruCache<number>(2);
    let made = 0;
    const make = () => ++made;
    expect(cache.getOrCreate('a', make)).toBe(1);
    expect(cache.getOrCreate('a', make)).toBe(1);
    cache.getOrCreate('b', make);
    cache.getOrCreate('a', make); // a is now the most recent
    cache.getOrCreate('c', make); // evicts b
    expect(cache.size).toBe(2);
    expect(cache.getOrCreate('a', make)).toBe(1);
    expect(cache.getOrCreate('b', make)).toBe(4);
  });
  it('get and set: get refreshes, set replaces and evicts the least recently used', () => {
    const cache = new LruCache<string>(2);
    expect(cache.get('a')).toBeUndefined();
    expect(cache.set('a', 'A')).toBe('A');
    cache.set('b', 'B');
    expect(cache.get('a')).toBe('A'); // a is now the most recent
    cache.set('c', 'C'); // evicts b
    expect(cache.get('b')).toBeUndefined();
    cache.set('a', 'A2'); // replaces, no eviction
    expect(cache.size).toBe(2);
    expect([cache.get('a'), cache.get('c')]).toEqual(['A2', 'C']);
  });
  it('rejects a non-positive capacity', () => {
    expect(() => new LruCache(0)).toThrow(RangeError);
  });
});
