import { describe, expect, it } from 'vitest';
import { PartsmithError } from '../../src/client/errors.js';
import { LimitExceededError } from '../../src/core/errors.js';
import { emptyRanker } from '../../src/core/ranks/ranker.js';
import { RankerCache } from '../../src/http/ranking.js';

describe('RankerCache', () => {
  const ranker = emptyRanker('none');

  it('keeps rankers within its byte budget, least recently used out, but always the newest', () => {
    const cache = new RankerCache<typeof ranker>(100, 8);
    let made = 0;
    const make = (bytes: number) => () => {
      made++;
      return { value: ranker, bytes };
    };
    cache.getOrCreate('a', make(40));
    cache.getOrCreate('b', make(40));
    cache.getOrCreate('a', make(40)); // a is now the most recent
    expect(made).toBe(2);
    cache.getOrCreate('c', make(40)); // 120 > 100: b goes
    expect(cache.size).toBe(2);
    cache.getOrCreate('a', make(40));
    expect(made).toBe(3);
    cache.getOrCreate('b', make(40));
    expect(made).toBe(4);
    cache.getOrCreate('huge', make(1000)); // over the budget alone: kept, everything else goes
    expect(cache.size).toBe(1);
  });

  it('bounds the number of entries too', () => {
    const cache = new RankerCache<typeof ranker>(1e9, 3);
    for (const key of ['a', 'b', 'c', 'd']) cache.getOrCreate(key, () => ({ value: ranker, bytes: 1 }));
    expect(cache.size).toBe(3);
  });

  it('remembers a family refused for its size and refuses it again without retrying', () => {
    const cache = new RankerCache();
    let tries = 0;
    const refuse = () => {
      tries++;
      throw new LimitExceededError('too big', 'rank table <= 32 MiB');
    };
    expect(() => cache.getOrCreate('big', refuse)).toThrow('too big');
    expect(() => cache.getOrCreate('big', refuse)).toThrow(LimitExceededError);
    expect(tries).toBe(1);
    // The library's refusal of the same (a 422 PartsmithError) likewise.
    let refusals = 0;
    const library = () => {
      refusals++;
      throw new PartsmithError({ status: 422, detail: 'too big' }, '/v1/partitions/list');
    };
    expect(() => cache.getOrCreate('big-family', library)).toThrow(PartsmithError);
    expect(() => cache.getOrCreate('big-family', library)).toThrow('too big');
    expect(refusals).toBe(1);
    // Other errors (malformed families) are not remembered.
    let bad = 0;
    const malformed = () => {
      bad++;
      throw new RangeError('n must be an integer');
    };
    expect(() => cache.getOrCreate('bad', malformed)).toThrow(RangeError);
    expect(() => cache.getOrCreate('bad', malformed)).toThrow(RangeError);
    expect(bad).toBe(2);
  });
});
