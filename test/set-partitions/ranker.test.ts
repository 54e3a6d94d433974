import { describe, expect, it } from 'vitest';
import { LimitExceededError, NotAMemberError } from '../../src/core/errors.js';
import type { SetPartitionFamily } from '../../src/core/family.js';
import { countSetPartitions } from '../../src/core/set-partitions/counts.js';
import { setPartitionRanker } from '../../src/core/set-partitions/ranker.js';
import { enumerateSetPartitions } from '../support/enumerate-set-partitions.js';
import { listAll } from '../ranks/support.js';
import { CONSTRAINT_SHAPES } from './support.js';

/** The brute-force enumeration visits restricted growth strings in lexicographic order. */

describe('set partitions in restricted-growth-string order', () => {
  for (const shape of CONSTRAINT_SHAPES) {
    it(`rank, unrank and list agree with the enumeration: ${JSON.stringify(shape)}, n <= 8`, () => {
      for (let n = 0; n <= 8; n++) {
        if (shape.blocks !== undefined && shape.blocks > n) continue;
        const family: SetPartitionFamily = { kind: 'set-partition', n, ...shape };
        const members = enumerateSetPartitions(family);
        const ranker = setPartitionRanker(family);
        expect(ranker.count, `n = ${n}`).toBe(BigInt(members.length));
        expect(ranker.count).toBe(countSetPartitions(family));
        members.forEach((member, i) => {
          expect(ranker.rank(member)).toBe(BigInt(i));
          expect(ranker.unrank(BigInt(i))).toEqual(member);
        });
        const start = Math.floor(members.length / 3);
        const listed: number[][] = [];
        const it = ranker.list(BigInt(start));
        for (let next = it.next(); !next.done; next = it.next()) listed.push(next.value);
        expect(listed).toEqual(members.slice(start));
        // From the first member (the successor walk over the whole family), and from the end.
        expect(listAll(ranker)).toEqual(members);
        expect(listAll(ranker, ranker.count)).toEqual([]);
        expect(() => ranker.list(ranker.count + 1n)).toThrow(RangeError);
      }
    });
  }

  it('listing a larger family steps through it in order: every member once, ranks 0, 1, ... (B_9 = 21147, OEIS A000110)', () => {
    const ranker = setPartitionRanker({ kind: 'set-partition', n: 9 });
    expect(ranker.count).toBe(21147n);
    const all = listAll(ranker);
    expect(all).toHaveLength(21147);
    for (const r of [0, 1, 5000, 21146]) expect(all[r]).toEqual(ranker.unrank(BigInt(r)));
    // Entries are single digits (n = 9), so comparing the joined strings is comparing the strings lexicographically.
    for (let i = 1; i < all.length; i++) expect(all[i - 1].join('') < all[i].join('')).toBe(true);
  });

  it('larger families: unrank and rank are inverse, and the count is the exact count', () => {
    for (const f of [{ n: 60 }, { n: 200, blocks: 7 }, { n: 300, maxBlocks: 12 }, { n: 80, minBlockSize: 3 }, { n: 40, maxBlockSize: 3, maxBlocks: 20 }]) {
      const family: SetPartitionFamily = { kind: 'set-partition', ...f };
      const ranker = setPartitionRanker(family);
      expect(ranker.count).toBe(countSetPartitions(family));
      for (const r of [0n, 1n, ranker.count / 3n, ranker.count - 1n]) expect(ranker.rank(ranker.unrank(r))).toBe(r);
    }
  });

  it('refuses non-members with the reason, ranks out of range, and families past the limits', () => {
    const ranker = setPartitionRanker({ kind: 'set-partition', n: 5, blocks: 2, maxBlockSize: 3 });
    expect(() => ranker.rank([0, 1, 0])).toThrow(NotAMemberError);
    // The shared NotAMemberError says which rule fails (src/core/errors.ts).
    const reasonOf = (member: number[]) => {
      try {
        ranker.rank(member);
      } catch (error) {
        return (error as NotAMemberError).reason;
      }
    };
    expect([reasonOf([0, 1, 0]), reasonOf([0, 2, 1, 0, 0]), reasonOf([0, 0.5, 1, 0, 0]), reasonOf([0, 1, 2, 0, 0])]).toEqual(['wrong-sum', 'out-of-order', 'malformed', 'not-in-family']);
    expect(() => ranker.rank([0, 2, 1, 0, 0])).toThrow(/at most one more/);
    expect(() => ranker.rank([0, 1, 2, 0, 0])).toThrow(/3 blocks/);
    expect(() => ranker.rank([0, 0, 0, 0, 1])).toThrow(/block 0 has 4 items/);
    expect(() => ranker.unrank(ranker.count)).toThrow(RangeError);
    expect(() => ranker.unrank(-1n)).toThrow(RangeError);
    expect(() => setPartitionRanker({ kind: 'set-partition', n: 3000 })).toThrow(LimitExceededError);
    expect(() => setPartitionRanker({ kind: 'set-partition', n: 6000, blocks: 2 })).toThrow(/over the limit of n <= 5000 items/);
    // Many block sizes to tell apart: refused by the bound on counting steps (not after minutes of counting).
    expect(() => setPartitionRanker({ kind: 'set-partition', n: 100, maxBlockSize: 50 })).toThrow(/with maxBlockSize = 50 in restricted-growth-string order needs more counting states than the limit allows/);
  });
});
