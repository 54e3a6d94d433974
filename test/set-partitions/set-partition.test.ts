import { describe, expect, it } from 'vitest';
import { blocksOf, blockSizesOf, fromBlocks, relabelInPlace, rgsProblem } from '../../src/core/set-partitions/set-partition.js';
import type { SetPartitionFamily } from '../../src/core/family.js';
import { forcedEqualBlocks, planSetPartitionSampler } from '../../src/core/set-partitions/plan.js';
import { resolveSetPartitions } from '../../src/core/set-partitions/resolve.js';
import { sampleSource } from '../../src/core/seeding.js';
import { setPartitionAsBlocks, setPartitionAsRgs } from '../../src/http/set-partition-encode.js';

describe('restricted growth strings and blocks', () => {
  it('labels are renumbered by first appearance; blocks are increasing and ordered by smallest item', () => {
    const p = relabelInPlace(Int32Array.from([7, 3, 7, 0, 3, 5]), 8);
    expect(Array.from(p.rgs)).toEqual([0, 1, 0, 2, 1, 3]);
    expect(p.blocks).toBe(4);
    expect(blocksOf(p)).toEqual([[1, 3], [2, 5], [4], [6]]);
    expect(Array.from(blockSizesOf(p))).toEqual([2, 2, 1, 1]);
    expect(Array.from(fromBlocks(6, [[6], [5, 2], [3, 1], [4]]).rgs)).toEqual([0, 1, 0, 2, 1, 3]);
  });

  it('refuses lists that are not a partition of 1..n, and strings that do not grow by one at most', () => {
    expect(() => fromBlocks(3, [[1, 2], [2, 3]])).toThrow(/two blocks/);
    expect(() => fromBlocks(3, [[1, 2]])).toThrow(/item 3 is in no block/);
    expect(() => fromBlocks(3, [[1, 2, 3], []])).toThrow(/empty/);
    expect(rgsProblem([0, 1, 0, 2])).toBeNull();
    expect(rgsProblem([1, 0])).toMatch(/entry 0/);
    expect(rgsProblem([0, 2])).toMatch(/at most one more/);
  });
});

describe('encoders', () => {
  // Both writing paths: plain strings below 256 items, ASCII bytes above.
  for (const n of [0, 1, 5, 255, 256, 3000, 200_000]) {
    it(`write exactly JSON.stringify of the blocks and of the RGS, and the text forms, n = ${n}`, () => {
      const sampler = planSetPartitionSampler({ kind: 'set-partition', n });
      for (let i = 0; i < 3; i++) {
        const p = sampler.sample(sampleSource('enc', i, `n-${n}`));
        const blocks = blocksOf(p);
        expect(setPartitionAsBlocks.json(p)).toBe(JSON.stringify(blocks));
        expect(setPartitionAsRgs.json(p)).toBe(JSON.stringify(Array.from(p.rgs)));
        expect(setPartitionAsRgs.text(p)).toBe(Array.from(p.rgs).join(' '));
        expect(setPartitionAsBlocks.text(p)).toBe(blocks.map((b) => b.join(' ')).join(' | '));
      }
    });
  }
});

describe('families that force equal blocks (equal-blocks/1)', () => {
  it('is planned exactly when one number of blocks fits and every block must hold n/k items', () => {
    const forced = (shape: Omit<SetPartitionFamily, 'kind'>) => forcedEqualBlocks(resolveSetPartitions({ kind: 'set-partition', ...shape }));
    expect(forced({ n: 1000, blocks: 1000 })).toBe(1000);
    expect(forced({ n: 1000, blocks: 1 })).toBe(1);
    expect(forced({ n: 1000, maxBlockSize: 1 })).toBe(1000);
    expect(forced({ n: 1000, blocks: 10, minBlockSize: 100 })).toBe(10);
    expect(forced({ n: 12, maxBlockSize: 4, maxBlocks: 3 })).toBe(3);
    expect(forced({ n: 12, minBlockSize: 4, maxBlocks: 3 })).toBe(null); // 1, 2 or 3 blocks
    expect(forced({ n: 12, blocks: 3 })).toBe(null);
    expect(forced({ n: 12, blocks: 3, minBlockSize: 3 })).toBe(null);
    expect(forced({ n: 12 })).toBe(null);
  });

  it('writes the one member of n singletons and of one block without drawing', () => {
    const silent = { nextDouble: () => { throw new Error('drew'); }, nextUint32: () => { throw new Error('drew'); } };
    const singletons = planSetPartitionSampler({ kind: 'set-partition', n: 1000, blocks: 1000 });
    expect(singletons.method).toBe('equal-blocks/1');
    const p = singletons.sample(silent);
    expect(p.blocks).toBe(1000);
    expect(Array.from(p.rgs)).toEqual(Array.from({ length: 1000 }, (_, i) => i));
    const whole = planSetPartitionSampler({ kind: 'set-partition', n: 50, maxBlocks: 1 }).sample(silent);
    expect(whole.blocks).toBe(1);
    expect(whole.rgs.every((v) => v === 0)).toBe(true);
  });

  it('gives every block n/k items', () => {
    const sampler = planSetPartitionSampler({ kind: 'set-partition', n: 1000, blocks: 10, minBlockSize: 100 });
    const p = sampler.sample(sampleSource('equal', 0, 'equal-blocks'));
    expect(Array.from(blockSizesOf(p))).toEqual(new Array(10).fill(100));
  });
});
