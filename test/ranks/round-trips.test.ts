import { describe, expect, it } from 'vitest';
import { planCompositionSampler } from '../../src/core/compositions/plan.js';
import { countCompositions } from '../../src/core/counting/composition-counts.js';
import { countPartitions } from '../../src/core/counting/partition-counts.js';
import { NotAMemberError } from '../../src/core/errors.js';
import { familyKey, type CompositionFamily, type PartitionFamily } from '../../src/core/family.js';
import { partsOf } from '../../src/core/partition.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { compositionRanker } from '../../src/core/ranks/composition-ranker.js';
import { partitionRanker } from '../../src/core/ranks/partition-ranker.js';
import type { Ranker } from '../../src/core/ranks/ranker.js';
import { sampleSource } from '../../src/core/seeding.js';
import { compositionProblems, partitionProblems } from '../abuse/support/family-checks.js';
import { listAll, listSome, randomRanks } from './support.js';

/**
 * unrank(rank(x)) = x and rank(unrank(r)) = r beyond brute-force sizes: on members drawn by the
 * (independent) uniform samplers, on seeded random ranks, and on the first and last ranks; each
 * unranked member is checked against the family's definition (test/abuse/support/family-checks),
 * and ranks of consecutive members are consecutive. Counts agree with the counting code.
 */
const PARTITIONS: Omit<PartitionFamily, 'kind'>[] = [
  { n: 100 }, { n: 1000 }, { n: 300, distinct: true }, { n: 400, maxPart: 20 }, { n: 250, length: 7 },
  { n: 300, maxLength: 5, minPart: 3 }, { n: 500, allowed: [1, 2, 5, 10, 20, 50] }, { n: 200, distinct: true, maxLength: 6, allowed: [3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47] },
];
const COMPOSITIONS: Omit<CompositionFamily, 'kind'>[] = [
  { n: 100 }, { n: 5000 }, { n: 300, length: 10 }, { n: 200, length: 30, minPart: 0 }, { n: 400, maxPart: 6 },
  { n: 300, allowed: [1, 3, 4] }, { n: 250, length: 12, minPart: 5, maxPart: 40 }, { n: 600, allowed: [6, 10, 15] },
];

function roundTrips(ranker: Ranker, problems: (parts: number[]) => string[], drawn: number[][], seed: string): void {
  const last = ranker.count - 1n;
  for (const r of [0n, 1n, last - 1n, last, ...randomRanks(seed, ranker.count, 40)]) {
    const member = ranker.unrank(r);
    expect(problems(member), `rank ${r}`).toEqual([]);
    expect(ranker.rank(member)).toBe(r);
  }
  for (const member of drawn) expect(ranker.unrank(ranker.rank(member))).toEqual(member);
  // A few members listed from a random start have consecutive ranks.
  const [start] = randomRanks(`${seed}-start`, ranker.count, 1);
  listSome(ranker, start, 25).forEach((member, i) => expect(ranker.rank(member)).toBe(start + BigInt(i)));
}

describe('round trips on large families', () => {
  it.each(PARTITIONS.map((f) => [JSON.stringify(f), f] as const))('partitions %s', (name, f) => {
    const family: PartitionFamily = { kind: 'partition', ...f };
    const ranker = partitionRanker(family);
    expect(ranker.count).toBe(countPartitions(family));
    const sampler = planPartitionSampler(family);
    const drawn = Array.from({ length: 30 }, (_, i) => partsOf(sampler.sample(sampleSource('ranks', i, familyKey(family)))));
    roundTrips(ranker, (parts) => partitionProblems(parts, family), drawn, name);
  });

  it.each(COMPOSITIONS.map((f) => [JSON.stringify(f), f] as const))('compositions %s', (name, f) => {
    const family: CompositionFamily = { kind: 'composition', ...f };
    const ranker = compositionRanker(family);
    expect(ranker.count).toBe(countCompositions(family));
    const sampler = planCompositionSampler(family);
    const drawn = Array.from({ length: 30 }, (_, i) => sampler.sample(sampleSource('ranks', i, familyKey(family))));
    roundTrips(ranker, (parts) => compositionProblems(parts, family), drawn, name);
  });

  it('first and last members are the extremes of the order', () => {
    const p = partitionRanker({ kind: 'partition', n: 1000 });
    expect(p.unrank(0n)).toEqual([1000]);
    expect(p.unrank(p.count - 1n)).toEqual(new Array(1000).fill(1));
    const c = compositionRanker({ kind: 'composition', n: 5000 });
    expect(c.unrank(0n)).toEqual(new Array(5000).fill(1));
    expect(c.unrank(c.count - 1n)).toEqual([5000]);
    expect(c.count).toBe(1n << 4999n);
  });
});

describe('paging', () => {
  it.each([
    ['partitions of 30', partitionRanker({ kind: 'partition', n: 30 })],
    ['partitions of 40 into at most 5 distinct parts >= 2', partitionRanker({ kind: 'partition', n: 40, distinct: true, maxLength: 5, minPart: 2 })],
    ['compositions of 14', compositionRanker({ kind: 'composition', n: 14 })],
    ['compositions of 25 into 5 parts from {1, 3, 4, 8}', compositionRanker({ kind: 'composition', n: 25, length: 5, allowed: [1, 3, 4, 8] })],
  ])('pages from start give the same members as one long listing: %s', (_name, ranker) => {
    const all = listAll(ranker);
    const total = all.length;
    for (const size of [1, 7, 100]) {
      const paged: number[][] = [];
      for (let start = 0; start < total; start += size) paged.push(...listSome(ranker, BigInt(start), size));
      expect(paged).toEqual(all);
    }
    expect(listAll(ranker, BigInt(total))).toEqual([]);
    expect(() => ranker.list(BigInt(total) + 1n)).toThrow(RangeError);
  });
});

describe('non-members and bad ranks', () => {
  const p = partitionRanker({ kind: 'partition', n: 12, maxPart: 5, distinct: true });
  it.each([
    [[3, 4, 5], 'out-of-order', /listed largest first, but 4 follows 3/],
    [[5, 4, 2], 'wrong-sum', /the parts sum to 11, not n = 12/],
    [[6, 4, 2], 'not-in-family', /part 6 is above maxPart = 5/],
    [[5, 5, 2], 'not-in-family', /part 5 occurs more than once/],
    [[5, 4, 2.5, 0.5], 'malformed', /part 3 \(2.5\) is not a whole number >= 1/],
    [[5, -4, 11], 'malformed', /not a whole number/],
  ] as const)('partition %j: %s', (member, reason, message) => {
    expect(p.rank([5, 4, 3])).toBe(0n); // the first member
    try {
      p.rank(member);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(NotAMemberError);
      expect(error).toBeInstanceOf(RangeError);
      expect((error as NotAMemberError).reason).toBe(reason);
      expect((error as Error).message).toMatch(message);
    }
  });

  it('compositions: sum, length and part sizes are named', () => {
    const c = compositionRanker({ kind: 'composition', n: 9, length: 3, allowed: [1, 2, 5] });
    expect(listAll(c)).toEqual([[2, 2, 5], [2, 5, 2], [5, 2, 2]]);
    expect(c.rank([5, 2, 2])).toBe(2n);
    expect(() => c.rank([5, 2, 1])).toThrow(/the parts sum to 8, not n = 9/);
    expect(() => c.rank([5, 2, 1, 1])).toThrow(/it has 4 parts, but the family has exactly 3/);
    expect(() => c.rank([5, 3, 1])).toThrow(/part 3 is not an allowed size \(1, 2, 5\)/);
    expect(() => compositionRanker({ kind: 'composition', n: 4 }).rank([4, 0])).toThrow(/part 0 is below the smallest part size = 1/);
  });

  it('unrank refuses ranks outside 0 ... count - 1 with a RangeError', () => {
    expect(() => p.unrank(p.count)).toThrow(RangeError);
    expect(() => p.unrank(-1n)).toThrow(/rank must be from 0/);
    expect(p.unrank(p.count - 1n)).toEqual(listAll(p).at(-1));
  });

  it('an empty family has count 0: nothing to list, unrank or rank', () => {
    const empty = partitionRanker({ kind: 'partition', n: 7, allowed: [2, 4] });
    expect(empty.count).toBe(0n);
    expect(listAll(empty)).toEqual([]);
    expect(() => empty.unrank(0n)).toThrow(/no member/);
    expect(() => empty.rank([4, 2, 1])).toThrow(NotAMemberError);
    expect(compositionRanker({ kind: 'composition', n: 7, allowed: [2, 4] }).count).toBe(0n);
  });

  it('a malformed family is a RangeError, as for counting', () => {
    expect(() => partitionRanker({ kind: 'partition', n: -1 })).toThrow(RangeError);
    expect(() => partitionRanker({ kind: 'partition', n: 5, length: 2, maxLength: 3 })).toThrow(/not both/);
    expect(() => compositionRanker({ kind: 'composition', n: 5, minPart: 0 })).toThrow(/need length/);
  });
});
