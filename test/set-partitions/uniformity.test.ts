import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import type { SetPartitionFamily } from '../../src/core/family.js';
import { freeTuning, planSetPartitionSampler, setPartitionCandidates, type SetPartitionMethod } from '../../src/core/set-partitions/plan.js';
import { resolveSetPartitions } from '../../src/core/set-partitions/resolve.js';
import type { SetPartitionSampler } from '../../src/core/set-partitions/sampler.js';
import { sampleSource } from '../../src/core/seeding.js';
import { enumerateSetPartitions } from '../support/enumerate-set-partitions.js';

/**
 * Exact uniformity over every member of small families, enumerated by brute force: Pearson
 * chi-square with |family| − 1 degrees of freedom, 25 expected hits per member (common practice:
 * >= 5 per cell), fixed seeds. Each test rejects an exactly uniform sampler with probability
 * alpha = 1e-4 (project convention). Every constraint shape, and every method that applies to it
 * forced through the planner (the planner's own choice is among them).
 */
const ALPHA = 1e-4;
const PER_MEMBER = 25;

function chiSquare(family: SetPartitionFamily, sampler: SetPartitionSampler, seed: string): { members: number; strangers: number; pValue: number } {
  const members = enumerateSetPartitions(family);
  const index = new Map(members.map((rgs, i) => [rgs.join(','), i]));
  const hits = new Float64Array(members.length);
  let strangers = 0;
  const draws = PER_MEMBER * members.length;
  for (let i = 0; i < draws; i++) {
    const sample = sampler.sample(sampleSource(seed, i, 'set-partition-chi-square'));
    const at = index.get(Array.from(sample.rgs).join(','));
    if (at === undefined || sample.blocks !== new Set(sample.rgs).size) strangers++;
    else hits[at]++;
  }
  let statistic = 0;
  for (const h of hits) statistic += (h - PER_MEMBER) ** 2 / PER_MEMBER;
  return { members: members.length, strangers, pValue: members.length > 1 ? 1 - chisquareCdf(statistic, members.length - 1) : 1 };
}

const SHAPES: [string, Omit<SetPartitionFamily, 'kind'>][] = [
  ['every set partition of 7 (877)', { n: 7 }],
  ['exactly 3 blocks, n = 7 (301)', { n: 7, blocks: 3 }],
  ['at most 2 blocks, n = 8 (128)', { n: 8, maxBlocks: 2 }],
  ['at most 4 blocks, n = 7 (715)', { n: 7, maxBlocks: 4 }],
  ['no singletons, n = 8 (715)', { n: 8, minBlockSize: 2 }],
  ['blocks of at most 2 items, n = 7 (232)', { n: 7, maxBlockSize: 2 }],
  ['blocks of 2 to 3 items, n = 8 (385)', { n: 8, minBlockSize: 2, maxBlockSize: 3 }],
  ['exactly 3 blocks of >= 2 items, n = 8 (490)', { n: 8, blocks: 3, minBlockSize: 2 }],
  ['exactly 3 blocks of <= 3 items, n = 7 (175)', { n: 7, blocks: 3, maxBlockSize: 3 }],
  ['exactly 2 blocks of 2 to 4 items, n = 7 (35)', { n: 7, blocks: 2, minBlockSize: 2, maxBlockSize: 4 }],
  ['at most 3 blocks of 2 to 4 items, n = 8 (525)', { n: 8, maxBlocks: 3, minBlockSize: 2, maxBlockSize: 4 }],
  ['at most 4 blocks of <= 3 items, n = 7', { n: 7, maxBlocks: 4, maxBlockSize: 3 }],
  ['blocks of >= 3 items, n = 9 (491)', { n: 9, minBlockSize: 3 }],
  // 9!/((3!)^3·3!) = 280 members, every block forced to 3 items.
  ['exactly 3 blocks of >= 3 items, n = 9 (280)', { n: 9, blocks: 3, minBlockSize: 3 }],
];

describe('set-partition samplers are uniform (chi-square over enumerated families, alpha = 1e-4 each)', () => {
  for (const [name, shape] of SHAPES) {
    const family: SetPartitionFamily = { kind: 'set-partition', ...shape };
    const methods = setPartitionCandidates(family).map((c) => c.method.split('/')[0] as SetPartitionMethod);
    for (const method of methods) {
      it(`${name}: ${method}`, () => {
        const sampler = planSetPartitionSampler(family, { method });
        const result = chiSquare(family, sampler, `chi-${method}-${name.replace(/[^a-z0-9]/gi, '')}`);
        expect(result.members).toBeGreaterThan(20);
        expect(result.strangers).toBe(0);
        expect(result.pValue).toBeGreaterThan(ALPHA);
      });
    }
  }

  it('every method is reached by some shape above', () => {
    const reached = new Set(SHAPES.flatMap(([, shape]) => setPartitionCandidates({ kind: 'set-partition', ...shape }).map((c) => c.method)));
    expect([...reached].sort()).toEqual(['equal-blocks/1', 'poisson-sizes/1', 'poisson-urns/1', 'stam/1', 'table/1', 'uniform-maps/1']);
  });

  it('the y-tuned bound on the number of blocks is exercised by "at most 2 blocks, n = 8" (below the free model\'s mean)', () => {
    // With K below the free model's mean number of blocks the planner tunes y < 1 and keeps a
    // draw with probability y^(K − k); the chi-square tests above then cover that step.
    expect(freeTuning(resolveSetPartitions({ kind: 'set-partition', n: 8, maxBlocks: 2 })).logY).toBeLessThan(0);
    expect(freeTuning(resolveSetPartitions({ kind: 'set-partition', n: 7, maxBlocks: 4 })).logY).toBe(0);
  });
});
