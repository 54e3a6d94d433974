import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { blocksOfRgs, compositionFamily, partitionFamily, setPartitionFamily } from 'partsmith';
import { enumerateSetPartitions } from '../support/enumerate-set-partitions.js';
import { CONSTRAINT_SHAPES } from '../set-partitions/support.js';
import type { CompositionFamily, PartitionFamily } from '../../src/core/family.js';
import { samplingFields } from '../../src/schemas/common.js';
import { withThousands } from '../../src/schemas/params.js';
import { enumerateCompositions } from '../support/enumerate-compositions.js';
import { enumeratePartitions } from '../support/enumerate-partitions.js';
import { satisfies } from '../support/enumerate-constrained.js';

/** contains() against brute force from the definitions (test/support), and the library's shortcuts against the schema. */
describe('contains() is membership as defined', () => {
  it('partitions: for 150 random families (fixed seed), contains(p) for every partition p of n is the brute-force test', () => {
    const rng = seedrandom('membership');
    const below = (k: number) => Math.floor(rng() * k);
    for (let i = 0; i < 150; i++) {
      const c: Record<string, unknown> & { n: number } = { n: below(16) };
      if (rng() < 0.4) c.distinct = true;
      if (rng() < 0.3) c.minPart = 1 + below(3);
      if (rng() < 0.3) c.maxPart = 1 + below(8);
      if (rng() < 0.3) c.length = below(6);
      else if (rng() < 0.3) c.maxLength = below(6);
      if (rng() < 0.3) c.allowed = [...new Set([1 + below(7), 1 + below(7)])].sort((a, b) => a - b);
      const family = partitionFamily(c as never);
      const definition = { kind: 'partition', ...c } as PartitionFamily;
      let members = 0;
      for (const parts of enumeratePartitions(c.n)) {
        const member = satisfies(parts, definition);
        expect(family.contains(parts), `${JSON.stringify(parts)} in ${JSON.stringify(c)}`).toBe(member);
        if (member) members++;
        if (parts[0] !== parts[parts.length - 1]) expect(family.contains([...parts].reverse())).toBe(false); // not largest first
      }
      expect(BigInt(members), JSON.stringify(c)).toBe(family.count);
    }
  });

  it('compositions: contains(c) holds exactly for the brute-force members (and counts agree)', () => {
    const cases: Omit<CompositionFamily, 'kind'>[] = [
      { n: 7 },
      { n: 8, maxPart: 3 },
      { n: 9, allowed: [2, 3] },
      { n: 6, length: 3, minPart: 0 },
      { n: 10, length: 4, minPart: 2 },
      { n: 0 },
    ];
    for (const c of cases) {
      const family = compositionFamily(c as never);
      const members = enumerateCompositions({ kind: 'composition', ...c });
      expect(BigInt(members.length)).toBe(family.count);
      for (const m of members) expect(family.contains(m)).toBe(true);
      // Every sequence of at most 6 parts >= 0 summing to n (weak compositions of each length).
      const all = [0, 1, 2, 3, 4, 5, 6].flatMap((length) => enumerateCompositions({ kind: 'composition', n: c.n, minPart: 0, length }));
      const keys = new Set(members.map((m) => m.join(',')));
      for (const m of all) expect(family.contains(m), `${JSON.stringify(m)} in ${JSON.stringify(c)}`).toBe(keys.has(m.join(',')));
    }
  });
});

describe('set partitions: contains() is membership as defined', () => {
  it('for every shape of constraints at n <= 6, contains(blocks) holds exactly for the brute-force members, and only in the written form', () => {
    for (const shape of CONSTRAINT_SHAPES) {
      for (let n = 0; n <= 6; n++) {
        if (shape.blocks !== undefined && shape.blocks > n) continue;
        const family = setPartitionFamily({ n, ...shape } as never);
        // Every restricted growth string of length n is a set partition of 1..n; the family's are the brute-force members.
        const all = enumerateSetPartitions({ n });
        const members = new Set(enumerateSetPartitions({ n, ...shape }).map((rgs) => rgs.join(',')));
        expect(BigInt(members.size)).toBe(family.count);
        for (const rgs of all) {
          const blocks = blocksOfRgs(rgs);
          expect(family.contains(blocks), `${JSON.stringify(blocks)} in ${JSON.stringify(shape)}`).toBe(members.has(rgs.join(',')));
          if (blocks.length > 1) expect(family.contains([...blocks].reverse())).toBe(false); // not ordered by smallest item
          if (blocks[0]?.length > 1) expect(family.contains([[...blocks[0]].reverse(), ...blocks.slice(1)])).toBe(false); // a block not increasing
        }
        expect(family.contains(enumerateSetPartitions({ n: n + 1 }).map(blocksOfRgs)[0])).toBe(false); // n + 1 items
      }
    }
    const family = setPartitionFamily({ n: 3 });
    for (const bad of [[[1, 2, 2]], [[1], [2], []], [[1], [2], [4]], [[1.5], [2], [3]], [0, 1, 2], '1 2 | 3', [[1, 2], [3], [3]]]) expect(family.contains(bad), JSON.stringify(bad)).toBe(false);
  });
});

describe("the library's shortcuts say what the schema says", () => {
  it('withThousands writes what toLocaleString("en-US") writes', () => {
    for (const v of [0, 7, 999, 1000, 10_000, 123_456, 1_000_000, 10_000_000, 1e9, 1e15]) expect(withThousands(v)).toBe(v.toLocaleString('en-US'));
  });

  it("an index accepted without the schema is one the API's start field accepts", () => {
    const family = partitionFamily({ n: 5 });
    for (const index of [0, 1, 17, 2 ** 31, 2 ** 48, 1e15, -1, 1e15 + 1, 0.5, NaN, Infinity, -0]) {
      let accepted = true;
      try {
        family.sample('s', index);
      } catch {
        accepted = false;
      }
      expect(accepted, String(index)).toBe(samplingFields.start.safeParse(index).success);
    }
  });
});
