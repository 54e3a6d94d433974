import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compositionFamily, partitionFamily, PartsmithError } from 'partsmith';
import { compositionArb, partitionArb, simpler, type FamilyArbitrary } from 'partsmith/fast-check';
import type { CompositionFamily, PartitionFamily } from '../../src/core/family.js';
import { chiSquareTest } from '../support/chi-square.js';
import { enumerateCompositions } from '../support/enumerate-compositions.js';
import { enumeratePartitions } from '../support/enumerate-partitions.js';
import { satisfies } from '../support/enumerate-constrained.js';
import { valuesAndShrinks } from '../support/shrink-tree.js';

/**
 * The arbitraries of partsmith/fast-check: every value and every shrink candidate is a member
 * of its family (checked against brute-force definitions, not the library's own contains);
 * values are uniform at fixed n (chi-square over enumerated families, α = 1e-4 each, fixed
 * fast-check seeds); n across a range is uniform, or weighted by count so that the union is
 * uniform; shrinking reaches known minimal counterexamples of planted failures.
 */

const sum = (parts: readonly number[]) => parts.reduce((a, b) => a + b, 0);

/** A brute-force membership test of the family of `parts`'s own n (src/core/family.ts's definitions). */
function isPartitionOf(constraints: Omit<PartitionFamily, 'kind' | 'n'>, parts: readonly number[]): boolean {
  const sortedDesc = parts.every((p, i) => i === 0 || p <= parts[i - 1]);
  return sortedDesc && parts.every((p) => Number.isInteger(p) && p >= 1) && satisfies(parts, { kind: 'partition', n: sum(parts), ...constraints });
}

function isCompositionOf(constraints: Omit<CompositionFamily, 'kind' | 'n'>, parts: readonly number[]): boolean {
  const family: CompositionFamily = { kind: 'composition', n: sum(parts), ...constraints };
  return enumerateCompositions(family).some((c) => c.length === parts.length && c.every((v, i) => v === parts[i]));
}

/** Random constraint sets of small families (n up to 24, so brute force stays cheap). */
const partitionConstraintsArb = fc.record(
  {
    distinct: fc.boolean(),
    minPart: fc.integer({ min: 1, max: 4 }),
    maxPart: fc.integer({ min: 1, max: 12 }),
    length: fc.integer({ min: 0, max: 6 }),
    maxLength: fc.integer({ min: 0, max: 8 }),
    allowed: fc.uniqueArray(fc.integer({ min: 1, max: 9 }), { minLength: 1, maxLength: 4 }),
  },
  { requiredKeys: [] },
).filter((c) => c.length === undefined || c.maxLength === undefined);

const compositionConstraintsArb = fc
  .record({ minPart: fc.integer({ min: 0, max: 3 }), maxPart: fc.integer({ min: 1, max: 8 }), length: fc.integer({ min: 0, max: 5 }), allowed: fc.uniqueArray(fc.integer({ min: 1, max: 7 }), { minLength: 1, maxLength: 3 }) }, { requiredKeys: [] })
  .filter((c) => c.minPart !== 0 || c.length !== undefined);

/** The arbitrary over n in [min, max] with the constraints, or undefined when every family is empty or contradictory. */
function tryArb<T>(make: () => T): T | undefined {
  try {
    return make();
  } catch (error) {
    if (error instanceof PartsmithError && error.status === 422) return undefined;
    throw error;
  }
}

describe('every value and every shrink candidate is a member of its family', () => {
  it('partitions, over random families and ranges of n (fast-check seed 15, 60 families)', () => {
    let checked = 0;
    fc.assert(
      fc.property(partitionConstraintsArb, fc.integer({ min: 0, max: 16 }), fc.integer({ min: 0, max: 8 }), (constraints, min, span) => {
        const arb = tryArb(() => partitionArb({ ...constraints, n: { min, max: min + span } }));
        if (arb === undefined) return;
        let values: number[][];
        try {
          ({ values } = valuesAndShrinks(arb, 1, 1, 0));
        } catch (error) {
          if (error instanceof PartsmithError && error.status === 422) return; // no n of the range has a member
          throw error;
        }
        void values;
        const { values: drawn, shrinks } = valuesAndShrinks(arb, 7, 8);
        for (const v of drawn) {
          expect(isPartitionOf(constraints, v), JSON.stringify(v)).toBe(true);
          expect(sum(v)).toBeGreaterThanOrEqual(min);
          expect(sum(v)).toBeLessThanOrEqual(min + span);
        }
        for (const [from, to] of shrinks) {
          expect(isPartitionOf(constraints, to), `${JSON.stringify(from)} -> ${JSON.stringify(to)} in ${JSON.stringify(constraints)}`).toBe(true);
          expect(simpler(to, from)).toBe(true);
          expect(sum(to)).toBeGreaterThanOrEqual(min);
        }
        checked += drawn.length + shrinks.length;
      }),
      { seed: 15, numRuns: 60 },
    );
    expect(checked).toBeGreaterThan(1000);
  });

  it('compositions, over random families and ranges of n (fast-check seed 16, 40 families)', () => {
    let checked = 0;
    fc.assert(
      fc.property(compositionConstraintsArb, fc.integer({ min: 0, max: 10 }), fc.integer({ min: 0, max: 4 }), (constraints, min, span) => {
        const arb = tryArb(() => compositionArb({ ...constraints, n: { min, max: min + span } }));
        if (arb === undefined) return;
        try {
          valuesAndShrinks(arb, 1, 1, 0);
        } catch (error) {
          if (error instanceof PartsmithError && error.status === 422) return;
          throw error;
        }
        const { values, shrinks } = valuesAndShrinks(arb, 8, 6);
        for (const v of values) expect(isCompositionOf(constraints, v), JSON.stringify(v)).toBe(true);
        for (const [from, to] of shrinks) {
          expect(isCompositionOf(constraints, to), `${JSON.stringify(from)} -> ${JSON.stringify(to)} in ${JSON.stringify(constraints)}`).toBe(true);
          expect(simpler(to, from)).toBe(true);
        }
        checked += values.length + shrinks.length;
      }),
      { seed: 16, numRuns: 40 },
    );
    expect(checked).toBeGreaterThan(300);
  });

  it('corners (edgeCases) are members too', () => {
    const cases: [Record<string, unknown>, 'partition' | 'composition'][] = [
      [{ n: 12 }, 'partition'],
      [{ n: 30, distinct: true }, 'partition'],
      [{ n: 20, length: 4, maxPart: 9 }, 'partition'],
      [{ n: 24, allowed: [3, 5, 8] }, 'partition'],
      [{ n: 12, length: 3, minPart: 0 }, 'composition'],
      [{ n: 15, allowed: [2, 3] }, 'composition'],
    ];
    for (const [constraints, kind] of cases) {
      const { n, ...rest } = constraints as { n: number };
      const arb = kind === 'partition' ? partitionArb(constraints as never, { edgeCases: 1 }) : compositionArb(constraints as never, { edgeCases: 1 });
      const corners = new Set(fc.sample(arb, { seed: 3, numRuns: 60 }).map((v) => JSON.stringify(v)));
      expect(corners.size, JSON.stringify(constraints)).toBeGreaterThanOrEqual(2);
      for (const corner of corners) {
        const parts = JSON.parse(corner) as number[];
        expect(kind === 'partition' ? isPartitionOf(rest, parts) : isCompositionOf(rest, parts), corner).toBe(true);
        expect(sum(parts)).toBe(n);
      }
    }
    // Unrestricted partitions of 12: one part, all ones, and all parts equal to 2 or to 6.
    const corners = new Set(fc.sample(partitionArb({ n: 12 }, { edgeCases: true }), { seed: 4, numRuns: 200 }).map((v) => JSON.stringify(v)));
    for (const corner of ['[12]', '[1,1,1,1,1,1,1,1,1,1,1,1]', '[2,2,2,2,2,2]', '[6,6]']) expect(corners.has(corner), corner).toBe(true);
  });
});

describe('uniformity at fixed n (chi-square over the enumerated family, alpha = 1e-4)', () => {
  function uniformity(arb: FamilyArbitrary, members: number[][], perMember: number, seed: number): { pValue: number; strangers: number } {
    const index = new Map(members.map((m, i) => [m.join(','), i]));
    const observed = new Array<number>(members.length).fill(0);
    let strangers = 0;
    for (const v of fc.sample(arb, { seed, numRuns: perMember * members.length })) {
      const i = index.get(v.join(','));
      if (i === undefined) strangers++;
      else observed[i]++;
    }
    return { pValue: chiSquareTest(observed, members.map(() => 1 / members.length)).pValue, strangers };
  }

  it('unrestricted partitions of 9 (p(9) = 30, OEIS A000041)', () => {
    const members = enumeratePartitions(9);
    expect(members).toHaveLength(30);
    const result = uniformity(partitionArb({ n: 9 }), members, 40, 101);
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(1e-4);
  });

  it('partitions of 20 into distinct parts of at most 9 (brute force)', () => {
    const family: PartitionFamily = { kind: 'partition', n: 20, distinct: true, maxPart: 9 };
    const members = enumeratePartitions(20).filter((p) => satisfies(p, family));
    const result = uniformity(partitionArb({ n: 20, distinct: true, maxPart: 9 }), members, 40, 102);
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(1e-4);
  });

  it('compositions of 6 (2^5 = 32, OEIS A011782) and weak compositions of 5 into 3 parts (C(7, 2) = 21)', () => {
    const all = enumerateCompositions({ kind: 'composition', n: 6 });
    expect(all).toHaveLength(32);
    const a = uniformity(compositionArb({ n: 6 }), all, 40, 103);
    const weak = enumerateCompositions({ kind: 'composition', n: 5, length: 3, minPart: 0 });
    expect(weak).toHaveLength(21);
    const b = uniformity(compositionArb({ n: 5, length: 3, minPart: 0 }), weak, 40, 104);
    expect([a.strangers, b.strangers]).toEqual([0, 0]);
    expect(a.pValue).toBeGreaterThan(1e-4);
    expect(b.pValue).toBeGreaterThan(1e-4);
  });
});

describe('n across a range', () => {
  it('nWeights "uniform": every n with members equally often (chi-square over n, alpha = 1e-4)', () => {
    // Partitions into parts 2 and 4 exist for even n only: n in 0..12 gives 7 cells.
    const values = fc.sample(partitionArb({ n: { min: 0, max: 12 }, allowed: [2, 4] }), { seed: 105, numRuns: 3500 });
    const sizes = [0, 2, 4, 6, 8, 10, 12];
    const observed = sizes.map((n) => values.filter((v) => sum(v) === n).length);
    expect(observed.reduce((a, b) => a + b, 0)).toBe(3500); // no odd n: their families are empty
    expect(chiSquareTest(observed, sizes.map(() => 1 / sizes.length)).pValue).toBeGreaterThan(1e-4);
  });

  it('nWeights "count": every member of the union equally likely (67 partitions of 0..8, chi-square, alpha = 1e-4)', () => {
    const members = [0, 1, 2, 3, 4, 5, 6, 7, 8].flatMap((n) => enumeratePartitions(n));
    // p(0) + ... + p(8) = 1 + 1 + 2 + 3 + 5 + 7 + 11 + 15 + 22 = 67 (OEIS A000070).
    expect(members).toHaveLength(67);
    const index = new Map(members.map((m, i) => [m.join(','), i]));
    const observed = new Array<number>(67).fill(0);
    for (const v of fc.sample(partitionArb({ n: { min: 0, max: 8 } }, { nWeights: 'count' }), { seed: 106, numRuns: 67 * 40 })) observed[index.get(v.join(','))!]++;
    expect(chiSquareTest(observed, members.map(() => 1 / 67)).pValue).toBeGreaterThan(1e-4);
  });

  it('nWeights "count" refuses ranges whose counts it cannot take', () => {
    expect(() => partitionArb({ n: { min: 0, max: 5000 } }, { nWeights: 'count' })).toThrow(/at most 1000 values of n/);
    const beyond = partitionArb({ n: { min: 999_999_500, max: 1_000_000_000 } }, { nWeights: 'count' });
    expect(() => fc.sample(beyond, { seed: 1, numRuns: 1 })).toThrow(/limit/);
  });
});

describe('shrinking reaches the known minimal counterexample of a planted failure', () => {
  const twoThrees = (parts: number[]) => parts.filter((p) => p === 3).length < 2;

  it('"no partition has two parts of size 3": [3, 3] over n in 0..60, [34, 3, 3] at n = 40 (fast-check seeds 1..10)', () => {
    for (let seed = 1; seed <= 10; seed++) {
      const range = fc.check(fc.property(partitionArb({ n: { min: 0, max: 60 } }), twoThrees), { seed });
      expect(range.failed).toBe(true);
      // The only partition of the smallest n with two 3s (n = 6).
      expect(range.counterexample![0]).toEqual([3, 3]);
      const fixed = fc.check(fc.property(partitionArb({ n: 40 }), twoThrees), { seed });
      // Fewest parts with two 3s (three), then the rest is forced: 40 - 6 = 34.
      expect(fixed.counterexample![0]).toEqual([34, 3, 3]);
    }
  });

  it('constraints are kept while shrinking: parts from 2 to 10, at least 4 of them with two 3s: the minimum is [3, 3, 2, 2] (brute force)', () => {
    const property = (parts: number[]) => parts.length < 4 || twoThrees(parts);
    const arb = partitionArb({ n: { min: 0, max: 40 }, minPart: 2, maxPart: 10 });
    // Brute force: the simplest member failing the property, over every n of the range.
    const members = Array.from({ length: 41 }, (_, n) => enumeratePartitions(n).filter((p) => p.every((part) => part >= 2 && part <= 10))).flat();
    const minimal = members.filter((p) => !property(p)).reduce((a, b) => (simpler(b, a) ? b : a));
    expect(minimal).toEqual([3, 3, 2, 2]);
    let reached = 0;
    for (let seed = 1; seed <= 10; seed++) {
      const result = fc.check(fc.property(arb, property), { seed });
      expect(result.failed).toBe(true);
      const found = result.counterexample![0];
      expect(found.every((p) => p >= 2 && p <= 10)).toBe(true);
      if (JSON.stringify(found) === JSON.stringify(minimal)) reached++;
    }
    expect(reached).toBe(10);
  });

  it('compositions: "no composition of 3 or more parts contains a 3" shrinks to [3, 1, 1] (fast-check seeds 1..10)', () => {
    for (let seed = 1; seed <= 10; seed++) {
      const result = fc.check(fc.property(compositionArb({ n: { min: 0, max: 100 } }), (c) => c.length < 3 || !c.includes(3)), { seed });
      expect(result.counterexample![0]).toEqual([3, 1, 1]);
    }
  });
});

describe('replay and reporting', () => {
  it("fast-check's seed and path replay a failure; the report names partsmith's (seed, index)", () => {
    const property = fc.property(partitionArb({ n: { min: 10, max: 200 }, maxPart: 30 }), (parts) => parts.length < 12);
    const first = fc.check(property, { seed: 42 });
    expect(first.failed).toBe(true);
    const again = fc.check(property, { seed: 42, path: first.counterexamplePath! });
    expect(again.counterexample).toEqual(first.counterexample);
    const report = fc.stringify(first.counterexample![0]);
    expect(report).toMatch(/^\[[0-9,]+\] \/\* partition of \d+ \(rank \d+ of \{"kind":"partition","n":\d+,"maxPart":30\}\); shrunk from sample \d+ of seed "fast-check" of \{"kind":"partition","n":\d+,"maxPart":30\} \*\/$/);
  });

  it("the report shows the member's rank in its family where the family is rankable, and none past the ranking limits", () => {
    // [1 x 12] is the last partition of 12 with parts of at most 30 (all of them): rank p(12) - 1 = 76 (p(12) = 77, OEIS A000041).
    const property = fc.property(partitionArb({ n: { min: 10, max: 200 }, maxPart: 30 }), (parts) => parts.length < 12);
    const shrunk = fc.check(property, { seed: 42 }).counterexample![0];
    expect(shrunk).toEqual(new Array(12).fill(1));
    expect(fc.stringify(shrunk)).toContain('(rank 76 of {"kind":"partition","n":12,"maxPart":30})');
    for (const value of fc.sample(compositionArb({ n: 12, allowed: [1, 2, 3] }), { seed: 11, numRuns: 10 })) {
      const rank = BigInt(/\(rank (\d+) of /.exec(fc.stringify(value))![1]);
      const family = compositionFamily({ n: 12, allowed: [1, 2, 3] });
      expect(family.rank(value)).toBe(rank);
      expect(family.unrank(rank)).toEqual(value);
    }
    // Partitions of 10^6 are past the rank tables (n <= 1,670 unrestricted): the report has no rank.
    const [large] = fc.sample(partitionArb({ n: 1_000_000 }), { seed: 12, numRuns: 1 });
    expect(fc.stringify(large)).toMatch(/\/\* partition of 1000000; sample \d+ of seed "fast-check" of \{"kind":"partition","n":1000000\} \*\/$/);
  });

  it('an unshrunk value is sample (seed, index) of its family, as the library and the API give it', () => {
    for (const value of fc.sample(partitionArb({ n: { min: 5, max: 80 }, distinct: true }, { seed: 'mine' }), { seed: 9, numRuns: 20 })) {
      const match = /sample (\d+) of seed "mine" of (\{.*\}) \*\/$/.exec(fc.stringify(value))!;
      const { kind: _kind, ...constraints } = JSON.parse(match[2]) as PartitionFamily;
      expect(partitionFamily(constraints as never).sample('mine', Number(match[1]))).toEqual(value);
    }
    const composition = fc.sample(compositionArb({ n: 30, maxPart: 4 }), { seed: 10, numRuns: 1 })[0];
    const index = Number(/sample (\d+)/.exec(fc.stringify(composition))![1]);
    expect(compositionFamily({ n: 30, maxPart: 4 }).sample('fast-check', index)).toEqual(composition);
  });

  it('values compare equal to plain arrays (the report is a non-enumerable property)', () => {
    const [value] = fc.sample(partitionArb({ n: 10 }), { seed: 1, numRuns: 1 });
    expect(value).toEqual([...value]);
    expect(JSON.stringify(value)).toBe(JSON.stringify([...value]));
  });
});

describe('refusals', () => {
  it('bad constraints and options are refused like the API refuses them', () => {
    expect(() => partitionArb({ n: { min: 5, max: 2 } })).toThrow('Invalid query: n.max must be at least n.min (5).');
    expect(() => partitionArb({ n: -1 })).toThrow(PartsmithError);
    expect(() => partitionArb({ n: 10, maxpart: 3 } as never)).toThrow('maxpart is not a parameter of this endpoint');
    expect(() => partitionArb({ n: 10 }, { seed: 'white space' })).toThrow(/seed must be 1 to 64 characters/);
    expect(() => partitionArb({ n: 10 }, { nWeights: 'members' as never })).toThrow(/nWeights must be one of: uniform, count/);
    expect(() => partitionArb({ n: 7, allowed: [2, 4] })).toThrow('no partition of 7 has all parts in {2, 4}');
    const allEmpty = partitionArb({ n: { min: 1, max: 9 }, allowed: [10] });
    expect(() => fc.sample(allEmpty, { seed: 1, numRuns: 1 })).toThrow(PartsmithError);
  });
});
