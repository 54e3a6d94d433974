import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PartsmithError, rgsOfBlocks, setPartitionFamily } from 'partsmith';
import { setPartitionArb, simplerSetPartition, type FamilyArbitrary } from 'partsmith/fast-check';
import { chiSquareTest } from '../support/chi-square.js';
import { enumerateSetPartitions, isMember, type SetPartitionConstraints } from '../support/enumerate-set-partitions.js';
import { valuesAndShrinks } from '../support/shrink-tree.js';

/**
 * setPartitionArb: every value and every shrink candidate is a set partition of its family
 * (checked against the brute-force definition of test/support, not the library's contains);
 * values are uniform at fixed n (chi-square over enumerated families, α = 1e-4 each, fixed
 * fast-check seeds); n across a range is weighted as asked; shrinking reaches the known
 * minimal counterexamples of planted failures (the minimum found by brute force).
 */

type Blocks = number[][];
const items = (blocks: Blocks) => blocks.reduce((n, block) => n + block.length, 0);

/** The written form (blocks increasing, ordered by smallest item) and the constraints, from the definitions. */
function isSetPartitionOf(constraints: Omit<SetPartitionConstraints, 'n'>, blocks: Blocks): boolean {
  const n = items(blocks);
  const written = blocks.every((b, i) => b.length > 0 && b.every((item, j) => j === 0 || item > b[j - 1]) && (i === 0 || b[0] > blocks[i - 1][0]));
  const all = blocks.flat().sort((a, b) => a - b);
  if (!written || !all.every((item, i) => item === i + 1)) return false;
  const rgs: number[] = [];
  blocks.forEach((b, k) => b.forEach((item) => (rgs[item - 1] = k)));
  return isMember(rgs, { n, ...constraints });
}

const constraintsArb = fc
  .record({ blocks: fc.integer({ min: 0, max: 5 }), maxBlocks: fc.integer({ min: 0, max: 5 }), minBlockSize: fc.integer({ min: 1, max: 3 }), maxBlockSize: fc.integer({ min: 1, max: 5 }) }, { requiredKeys: [] })
  .filter((c) => c.blocks === undefined || c.maxBlocks === undefined);

describe('every value and every shrink candidate is a member of its family', () => {
  it('over random families and ranges of n (fast-check seed 17, 60 families)', () => {
    let checked = 0;
    fc.assert(
      fc.property(constraintsArb, fc.integer({ min: 0, max: 8 }), fc.integer({ min: 0, max: 5 }), (constraints, min, span) => {
        let arb: FamilyArbitrary<Blocks>;
        try {
          arb = setPartitionArb({ ...constraints, n: { min, max: min + span } });
          valuesAndShrinks(arb, 1, 1, 0);
        } catch (error) {
          if (error instanceof PartsmithError && error.status === 422) return; // contradictory, or no n of the range has a member
          throw error;
        }
        const { values, shrinks } = valuesAndShrinks(arb, 7, 8);
        for (const v of values) {
          expect(isSetPartitionOf(constraints, v), JSON.stringify(v)).toBe(true);
          expect(items(v)).toBeGreaterThanOrEqual(min);
          expect(items(v)).toBeLessThanOrEqual(min + span);
        }
        for (const [from, to] of shrinks) {
          expect(isSetPartitionOf(constraints, to), `${JSON.stringify(from)} -> ${JSON.stringify(to)} in ${JSON.stringify(constraints)}`).toBe(true);
          expect(simplerSetPartition(to, from)).toBe(true);
          expect(items(to)).toBeGreaterThanOrEqual(min);
        }
        checked += values.length + shrinks.length;
      }),
      { seed: 17, numRuns: 60 },
    );
    expect(checked).toBeGreaterThan(1000);
  });

  it('corners (edgeCases) are members: one block, singletons, runs and round-robin deals of the fewest and most blocks', () => {
    for (const constraints of [{ n: 12 }, { n: 12, blocks: 3 }, { n: 13, maxBlockSize: 4 }, { n: 14, minBlockSize: 3 }, { n: 10, maxBlocks: 4, minBlockSize: 2 }]) {
      const { n, ...rest } = constraints;
      const corners = new Set(fc.sample(setPartitionArb(constraints, { edgeCases: 1 }), { seed: 3, numRuns: 80 }).map((v) => JSON.stringify(v)));
      expect(corners.size, JSON.stringify(constraints)).toBeGreaterThanOrEqual(2);
      for (const corner of corners) {
        const blocks = JSON.parse(corner) as Blocks;
        expect(isSetPartitionOf(rest, blocks), corner).toBe(true);
        expect(items(blocks)).toBe(n);
      }
    }
    const free = new Set(fc.sample(setPartitionArb({ n: 6 }, { edgeCases: true }), { seed: 4, numRuns: 200 }).map((v) => JSON.stringify(v)));
    for (const corner of ['[[1,2,3,4,5,6]]', '[[1],[2],[3],[4],[5],[6]]']) expect(free.has(corner), corner).toBe(true);
  });
});

describe('uniformity at fixed n (chi-square over the enumerated family, alpha = 1e-4)', () => {
  function uniformity(arb: FamilyArbitrary<Blocks>, members: number[][], perMember: number, seed: number): { pValue: number; strangers: number } {
    const index = new Map(members.map((rgs, i) => [rgs.join(','), i]));
    const observed = new Array<number>(members.length).fill(0);
    let strangers = 0;
    for (const v of fc.sample(arb, { seed, numRuns: perMember * members.length })) {
      const i = index.get(rgsOfBlocks(v).join(','));
      if (i === undefined) strangers++;
      else observed[i]++;
    }
    return { pValue: chiSquareTest(observed, members.map(() => 1 / members.length)).pValue, strangers };
  }

  it.each([
    // B_6 = 203 (OEIS A000110); S(8, 3) = 966 (OEIS A008277); the rest by brute force.
    [{ n: 6 }, 203, 30, 201],
    [{ n: 8, blocks: 3 }, 966, 10, 202],
    [{ n: 9, minBlockSize: 2, maxBlockSize: 4 }, undefined, 10, 203],
    [{ n: 8, maxBlocks: 3, maxBlockSize: 4 }, undefined, 10, 204],
  ] as const)('%j', (constraints, known, perMember, seed) => {
    const members = enumerateSetPartitions(constraints);
    if (known !== undefined) expect(members).toHaveLength(known);
    expect(BigInt(members.length)).toBe(setPartitionFamily(constraints).count);
    const result = uniformity(setPartitionArb(constraints), members, perMember, seed);
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(1e-4);
  });

  it('nWeights "count": every member of the union of n = 0..6 equally likely (279 members, OEIS A000110 summed; chi-square, alpha = 1e-4)', () => {
    const members = [0, 1, 2, 3, 4, 5, 6].flatMap((n) => enumerateSetPartitions({ n }));
    // B_0 + ... + B_6 = 1 + 1 + 2 + 5 + 15 + 52 + 203 = 279.
    expect(members).toHaveLength(279);
    const index = new Map(members.map((rgs, i) => [`${rgs.length}:${rgs.join(',')}`, i]));
    const observed = new Array<number>(279).fill(0);
    for (const v of fc.sample(setPartitionArb({ n: { min: 0, max: 6 } }, { nWeights: 'count' }), { seed: 205, numRuns: 279 * 20 })) {
      const rgs = rgsOfBlocks(v);
      observed[index.get(`${rgs.length}:${rgs.join(',')}`)!]++;
    }
    expect(chiSquareTest(observed, members.map(() => 1 / 279)).pValue).toBeGreaterThan(1e-4);
  });
});

describe('shrinking reaches the known minimal counterexample of a planted failure', () => {
  /** The simplest member failing `property` over the families of n = 0..maxN (brute force). */
  function bruteMinimum(constraints: Omit<SetPartitionConstraints, 'n'>, maxN: number, property: (blocks: Blocks) => boolean): Blocks {
    const failing: Blocks[] = [];
    for (let n = 0; n <= maxN; n++) {
      for (const rgs of enumerateSetPartitions({ n, ...constraints })) {
        const blocks: Blocks = [];
        rgs.forEach((b, i) => (blocks[b] ??= []).push(i + 1));
        if (!property(blocks)) failing.push(blocks);
      }
    }
    return failing.reduce((a, b) => (simplerSetPartition(b, a) ? b : a));
  }
  const noTwoEqual = (blocks: Blocks) => {
    const sizes = blocks.map((b) => b.length).filter((s) => s >= 2);
    return new Set(sizes).size === sizes.length;
  };

  it('"no two blocks of the same size >= 2" over n in 0..12 shrinks to [[1, 2], [3, 4]] (fast-check seeds 1..10)', () => {
    // Fewer items come first, so the minimum over n <= 6 is the minimum over the range.
    expect(bruteMinimum({}, 6, noTwoEqual)).toEqual([[1, 2], [3, 4]]);
    for (let seed = 1; seed <= 10; seed++) {
      const result = fc.check(fc.property(setPartitionArb({ n: { min: 0, max: 12 } }), noTwoEqual), { seed });
      expect(result.failed).toBe(true);
      expect(result.counterexample![0]).toEqual([[1, 2], [3, 4]]);
    }
  });

  it('constraints are kept while shrinking: blocks of 2 or 3 items, "at most two blocks" shrinks to [[1, 2], [3, 4], [5, 6]]', () => {
    const property = (blocks: Blocks) => blocks.length <= 2;
    expect(bruteMinimum({ minBlockSize: 2, maxBlockSize: 3 }, 8, property)).toEqual([[1, 2], [3, 4], [5, 6]]);
    for (let seed = 1; seed <= 10; seed++) {
      const result = fc.check(fc.property(setPartitionArb({ n: { min: 0, max: 15 }, minBlockSize: 2, maxBlockSize: 3 }), property), { seed });
      const found = result.counterexample![0];
      expect(found.every((b) => b.length >= 2 && b.length <= 3)).toBe(true);
      expect(found).toEqual([[1, 2], [3, 4], [5, 6]]);
    }
  });

  it('at fixed n, towards rank 0 of the order: three blocks of 10 items, "the first block has fewer than 6 items" shrinks to the first member', () => {
    const property = (blocks: Blocks) => blocks[0].length < 6;
    const first = [[1, 2, 3, 4, 5, 6, 7, 8], [9], [10]];
    expect(setPartitionFamily({ n: 10, blocks: 3 }).unrank(0)).toEqual(first);
    for (let seed = 1; seed <= 10; seed++) {
      const result = fc.check(fc.property(setPartitionArb({ n: 10, blocks: 3 }), property), { seed });
      expect(result.counterexample![0]).toEqual(first);
    }
  });

  it('at large n: "fewer than 5 blocks" over n up to 2000 shrinks to five singletons', () => {
    const result = fc.check(fc.property(setPartitionArb({ n: { min: 0, max: 2000 } }), (blocks) => blocks.length < 5), { seed: 8 });
    expect(result.counterexample![0]).toEqual([[1], [2], [3], [4], [5]]);
  });
});

describe('reporting', () => {
  it("the report names partsmith's (seed, index) and the member's rank in its family", () => {
    const result = fc.check(fc.property(setPartitionArb({ n: { min: 10, max: 30 }, blocks: 3 }), (blocks) => blocks[0].length < 6), { seed: 3 });
    const report = fc.stringify(result.counterexample![0]);
    expect(report).toMatch(/^\[\[1,2,3,4,5,6,7,8\],\[9\],\[10\]\] \/\* set partition of 10 items \(rank 0 of \{"kind":"set-partition","n":10,"blocks":3\}\); shrunk from sample \d+ of seed "fast-check" of \{"kind":"set-partition","n":\d+,"blocks":3\} \*\/$/);
    for (const value of fc.sample(setPartitionArb({ n: 12, maxBlockSize: 4 }, { seed: 'mine' }), { seed: 9, numRuns: 10 })) {
      const match = /^.* \/\* set partition of 12 items \(rank (\d+) of .*\); sample (\d+) of seed "mine" of .* \*\/$/.exec(fc.stringify(value))!;
      const family = setPartitionFamily({ n: 12, maxBlockSize: 4 });
      expect(family.sample('mine', Number(match[2]))).toEqual(value);
      expect(family.rank(value)).toBe(BigInt(match[1]));
      expect(family.unrank(BigInt(match[1]))).toEqual(value);
    }
  });

  it('refuses what the API refuses', () => {
    expect(() => setPartitionArb({ n: 4, blocks: 5 })).toThrow('blocks = 5 is more than the n = 4 items');
    expect(() => setPartitionArb({ n: { min: 0, max: 20_000_000 } })).toThrow(/n.max must be a whole number from 0 to 10000000/);
    expect(() => setPartitionArb({ n: 10, blocks: 3, minBlockSize: 4 })).toThrow(/no set partition of 10 items/);
  });
});
