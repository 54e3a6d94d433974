import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { assertValidPartition } from '../support/partition-checks.js';
import { exactLargestPartLaw, exactPartCountLaw, pooled } from '../support/distinct-part-count-law.js';

// The law of the number of parts of a uniform partition into distinct parts >= a, at sizes
// where exact counts are still cheap but the planner uses distinct-bounded-self-similar (its
// counts from the saddle-point integral above their tables). Pearson chi-square on the pooled
// exact law; each test's false-alarm probability is alpha = 1e-4 (project convention).
const ALPHA = 1e-4;

const cases: Array<[number, number, number, boolean]> = [
  // n, a, samples, method forced (at n = 4e4 with a = 50 the planner estimates distinct-boltzmann cheaper)
  [20_000, 7, 100_000, false],
  [40_000, 50, 50_000, true],
  [60_000, 3, 50_000, false],
  [120_000, 20, 20_000, true], // forced (the planner estimates distinct-boltzmann cheaper here); counts up to ~e^{π√(n/3)}: doubles hold them to n ≈ 1.5e5
];

describe('distinct parts >= a: the number of parts has its exact law', () => {
  for (const [n, a, samples, forced] of cases) {
    it(`n = ${n}, parts >= ${a} (${samples} samples)`, () => {
      const family: PartitionFamily = { kind: 'partition', n, distinct: true, minPart: a };
      const sampler = constrainedPartitionSampler(family, forced ? { method: 'distinct-bounded-self-similar' } : {});
      expect(sampler.method).toBe('distinct-bounded-self-similar/1');
      const law = exactPartCountLaw(n, a);
      const observed = new Array<number>(law.length).fill(0);
      const source = sampleSource('distinct-bounded-laws', n, String(a));
      for (let i = 0; i < samples; i++) {
        const p = sampler.sample(source);
        if (i < 50) {
          assertValidPartition(p, n);
          expect(Math.min(...p.sizes)).toBeGreaterThanOrEqual(a);
        }
        observed[p.sizes.length]++;
      }
      const p = pooled(observed, law, samples);
      expect(p.observed.length).toBeGreaterThan(20);
      expect(chiSquareTest(p.observed, p.probabilities).pValue).toBeGreaterThan(ALPHA);
    });
  }
});

// With a largest part c as well (maxPart): the law of the largest part, from exact counts (c
// lies within the range the unbounded largest part takes, so the bound shapes the law).
// Method forced (the planner may estimate distinct-boltzmann cheaper); alpha = 1e-4 each.
const capped: Array<[number, number, number, number]> = [
  // n, a, c, samples
  [60_000, 5, 1500, 20_000],
  [100_000, 1, 2500, 20_000],
  [40_000, 30, 1200, 20_000],
];

describe('distinct parts in [a, c]: the largest part has its exact law', () => {
  for (const [n, a, c, samples] of capped) {
    it(`n = ${n}, parts in [${a}, ${c}] (${samples} samples)`, () => {
      const family: PartitionFamily = { kind: 'partition', n, distinct: true, minPart: a, maxPart: c };
      const sampler = constrainedPartitionSampler(family, { method: 'distinct-bounded-self-similar' });
      const law = exactLargestPartLaw(n, a, c);
      const observed = new Array<number>(law.length).fill(0);
      const source = sampleSource('distinct-bounded-largest', n, `${a}-${c}`);
      for (let i = 0; i < samples; i++) {
        const p = sampler.sample(source);
        if (i < 50) {
          assertValidPartition(p, n);
          expect(Math.min(...p.sizes)).toBeGreaterThanOrEqual(a);
        }
        observed[p.sizes[0] - a]++;
      }
      const p = pooled(observed, law, samples);
      expect(p.observed.length).toBeGreaterThan(20);
      expect(chiSquareTest(p.observed, p.probabilities).pValue).toBeGreaterThan(ALPHA);
    });
  }
});
