import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { NarrowRangeMixture, logPartsAtMostBound } from '../../src/core/partitions/narrow-range-mixture.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';
import { pooled } from '../support/distinct-part-count-law.js';
import { assertValidPartition } from '../support/partition-checks.js';
import { countsByParts, distinctCountsByParts } from '../support/narrow-range-counts.js';

/**
 * narrow-range-mixture (parts in a narrow range [a, b] of large sizes: the union over the number
 * of parts of boxes, box-rotation near half full and box-subset elsewhere) against exact values:
 * Pearson chi-square over the enumerated family at small n (25 samples per member), and the law of
 * the number of parts from exact counts at n = 1e5, where the planner picks it and box-rotation
 * serves the central boxes. Fixed seeds; false-alarm probability alpha = 1e-4 per test.
 */
const ALPHA = 1e-4;

const partition = (spec: Omit<PartitionFamily, 'kind'>) => ({ kind: 'partition', ...spec }) as PartitionFamily;

describe('narrow-range-mixture is exact over enumerated families', () => {
  const cases: Array<[number, number, number]> = [
    [60, 5, 9],
    [56, 6, 11],
    [50, 3, 8],
    [44, 3, 30],
  ];
  for (const [n, a, b] of cases) {
    it(`planner-forced, parts in [${a}, ${b}] at n = ${n}`, () => {
      const family = partition({ n, minPart: a, maxPart: b });
      const sampler = constrainedPartitionSampler(family, { method: 'narrow-range-mixture' });
      expect(sampler.method).toBe('narrow-range-mixture/1');
      const result = chiSquareUniform(family, sampler, `narrow-${n}-${a}-${b}`);
      expect(result.members).toBeGreaterThan(5);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
  for (const [n, a, b] of cases.slice(0, 3)) {
    it(`box-rotation at every k it applies to, parts in [${a}, ${b}] at n = ${n}`, () => {
      const family = partition({ n, minPart: a, maxPart: b });
      const sampler = new NarrowRangeMixture(n, a, b, { rotation: 'always' });
      expect(sampler.rotated.filter(Boolean).length).toBeGreaterThan(1);
      const result = chiSquareUniform(family, sampler, `narrow-rot-${n}-${a}-${b}`);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});

describe('narrow-range-mixture is exact over enumerated families of distinct parts (staircase)', () => {
  // 101-193 members each, 3-4 numbers of parts.
  const cases: Array<[number, number, number]> = [
    [40, 3, 15],
    [45, 4, 16],
    [48, 2, 14],
  ];
  for (const [n, a, b] of cases) {
    it(`planner-forced, distinct parts in [${a}, ${b}] at n = ${n}`, () => {
      const family = partition({ n, distinct: true, minPart: a, maxPart: b });
      const sampler = constrainedPartitionSampler(family, { method: 'narrow-range-mixture' });
      expect(sampler.method).toBe('narrow-range-mixture/1');
      const result = chiSquareUniform(family, sampler, `narrow-distinct-${n}-${a}-${b}`);
      expect(result.members).toBeGreaterThan(100);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
    it(`box-rotation at every k it applies to, distinct parts in [${a}, ${b}] at n = ${n}`, () => {
      const family = partition({ n, distinct: true, minPart: a, maxPart: b });
      const sampler = new NarrowRangeMixture(n, a, b, { distinct: true, rotation: 'always' });
      expect(sampler.rotated.filter(Boolean).length).toBeGreaterThan(1);
      const result = chiSquareUniform(family, sampler, `narrow-distinct-rot-${n}-${a}-${b}`);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }

  it('the numbers of parts of distinct parts in [a, b] are those with k a + C(k, 2) <= n <= k b − C(k, 2)', () => {
    for (const [n, a, b] of [
      [40, 3, 15],
      [20_000, 400, 700],
      [350_000_000, 50_318, 69_965],
    ]) {
      const [first, last] = NarrowRangeMixture.partsRange(n, a, b, true);
      const fits = (k: number) => k >= 1 && k <= b - a + 1 && k * a + (k * (k - 1)) / 2 <= n && n <= k * b - (k * (k - 1)) / 2;
      expect(fits(first) && fits(last)).toBe(true);
      expect(fits(first - 1) || fits(last + 1)).toBe(false);
    }
  });
});

describe('narrow-range-mixture: the number of parts has its exact law', () => {
  it('parts in [601, 637] at n = 1e5 (the planner takes it; box-rotation serves the centre)', () => {
    const n = 100_000;
    const a = 601;
    const b = 637;
    const family = partition({ n, minPart: a, maxPart: b });
    const sampler = constrainedPartitionSampler(family);
    expect(sampler.method).toBe('narrow-range-mixture/1');
    expect((sampler as NarrowRangeMixture).rotated.some(Boolean)).toBe(true);
    const counts = countsByParts(n, a, b);
    const total = counts.reduce((x, y) => x + y, 0);
    const law = counts.map((c) => c / total);
    const samples = 10_000;
    const observed = new Array<number>(law.length).fill(0);
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('narrow-parts-law', i, 'n1e5'));
      if (i < 20) assertValidPartition(p, n);
      let parts = 0;
      for (let j = 0; j < p.sizes.length; j++) {
        expect(p.sizes[j]).toBeGreaterThanOrEqual(a);
        expect(p.sizes[j]).toBeLessThanOrEqual(b);
        parts += p.multiplicities[j];
      }
      observed[parts]++;
    }
    const bins = pooled(observed, law, samples);
    expect(bins.probabilities.length).toBeGreaterThan(3);
    expect(chiSquareTest(bins.observed, bins.probabilities).pValue).toBeGreaterThan(ALPHA);
  });
});

describe('narrow-range-mixture: the number of distinct parts has its exact law', () => {
  it('distinct parts in [400, 700] at n = 2e4 (forced; 18 numbers of parts, box-rotation at the centre)', () => {
    const n = 20_000;
    const a = 400;
    const b = 700;
    const family = partition({ n, distinct: true, minPart: a, maxPart: b });
    const sampler = constrainedPartitionSampler(family, { method: 'narrow-range-mixture' });
    expect((sampler as NarrowRangeMixture).rotated.some(Boolean)).toBe(true);
    const counts = distinctCountsByParts(n, a, b);
    const total = counts.reduce((x, y) => x + y, 0);
    const law = counts.map((c) => c / total);
    const samples = 3000;
    const observed = new Array<number>(law.length).fill(0);
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('narrow-distinct-parts-law', i, 'n2e4'));
      if (i < 20) assertValidPartition(p, n);
      for (let j = 0; j < p.sizes.length; j++) {
        expect(p.multiplicities[j]).toBe(1);
        expect(p.sizes[j]).toBeGreaterThanOrEqual(a);
        expect(p.sizes[j]).toBeLessThanOrEqual(b);
      }
      observed[p.sizes.length]++;
    }
    const bins = pooled(observed, law, samples);
    expect(bins.probabilities.length).toBeGreaterThan(3);
    expect(chiSquareTest(bins.observed, bins.probabilities).pValue).toBeGreaterThan(ALPHA);
  });

  it('serves the distinct narrow range {n: 3.5e8, parts in [50318, 69965]} (refused before)', () => {
    const family = partition({ n: 350_000_000, distinct: true, minPart: 50_318, maxPart: 69_965 });
    const sampler = constrainedPartitionSampler(family);
    expect(sampler.method).toBe('narrow-range-mixture/1');
    const p = sampler.sample(sampleSource('narrow-distinct-huge', 0, 'x'));
    assertValidPartition(p, 350_000_000);
    expect(p.multiplicities.every((m) => m === 1)).toBe(true);
    expect(p.sizes[0]).toBeLessThanOrEqual(69_965);
    expect(p.sizes[p.sizes.length - 1]).toBeGreaterThanOrEqual(50_318);
  });
});

describe('the bound that drops the far numbers of parts', () => {
  it('bounds the partitions of m into parts <= w (exact counts by the knapsack recurrence)', () => {
    for (const w of [3, 10, 40]) {
      const top = 400;
      const p = new Float64Array(top + 1);
      p[0] = 1;
      for (let s = 1; s <= w; s++) for (let m = s; m <= top; m++) p[m] += p[m - s];
      for (const m of [1, 7, 50, 199, 400]) {
        const bound = logPartsAtMostBound(m, w);
        expect(bound).toBeGreaterThanOrEqual(Math.log(p[m]) - 1e-9);
        // Chernoff is tight to within a polynomial factor here.
        expect(bound).toBeLessThan(Math.log(p[m]) + 3 * Math.log(m + 2) + 2);
      }
    }
  });

  it('keeps the numbers of parts that hold the family at n = 8.4e8 (parts in [55093, 58395])', () => {
    const sampler = new NarrowRangeMixture(840_000_000, 55_093, 58_395);
    // 862 numbers of parts fit (14385 .. 15246); those kept surround the centre n / (a + w/2) ~ 14803.
    expect(sampler.rotated.length).toBeGreaterThan(100);
    expect(sampler.rotated.length).toBeLessThan(862);
    expect(sampler.expectedLength).toBeGreaterThan(14790);
    expect(sampler.expectedLength).toBeLessThan(14830);
    const p = sampler.sample(sampleSource('narrow-huge', 0, 'x'));
    assertValidPartition(p, 840_000_000);
    expect(p.sizes[0]).toBeLessThanOrEqual(58_395);
    expect(p.sizes[p.sizes.length - 1]).toBeGreaterThanOrEqual(55_093);
  });
});
