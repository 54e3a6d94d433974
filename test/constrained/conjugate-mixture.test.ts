import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { ConjugateMixture } from '../../src/core/partitions/constrained/conjugate-mixture.js';
import { SmallPartsBlock } from '../../src/core/partitions/constrained/small-parts-block.js';
import { constrainedPartitionSampler, planCandidates } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

/**
 * conjugate-mixture (at most K parts >= lo through the conjugate (k^lo) ∪ ν, the number of parts
 * drawn under one tilt) forced through the planner's `method` option: Pearson chi-square over the
 * enumerated family at small n (25 samples per member), and above enumeration the exact laws of
 * the largest part and of the number of parts from counts (chi-square over pooled bins). Fixed
 * seeds; false-alarm probability 1e-4 per test (project convention).
 */
const ALPHA = 1e-4;

type Case = [name: string, family: Omit<PartitionFamily, 'kind'>];

describe('conjugate-mixture is exact (chi-square over the enumerated family)', () => {
  const cases: Case[] = [
    ['at most K parts >= lo', { n: 34, minPart: 3, maxLength: 5 }],
    ['at most K parts in [lo, hi] (step 4 rejects)', { n: 38, minPart: 2, maxPart: 11, maxLength: 6 }],
    ['K = n / lo reached', { n: 40, minPart: 6, maxLength: 5 }],
    ['one or two parts (k <= 2: no geometric sizes)', { n: 24, minPart: 5, maxLength: 2 }],
    ["at most K parts >= lo, more parts (sizes 1..4 determined together)", { n: 40, minPart: 2, maxLength: 8 }],
    ['sizes 1..5 determined together, k below and above the block', { n: 44, minPart: 2, maxLength: 10 }],
    ['sizes 1..3 determined together, step 4 rejects', { n: 44, minPart: 2, maxPart: 9, maxLength: 7 }],
  ];
  for (const [name, spec] of cases) {
    it(`${name}: ${JSON.stringify(spec)}`, () => {
      const family = { kind: 'partition', ...spec } as PartitionFamily;
      const sampler = constrainedPartitionSampler(family, { method: 'conjugate-mixture' });
      expect(sampler.method).toBe('conjugate-mixture/2');
      const result = chiSquareUniform(family, sampler, `cmix-${name.replace(/[^A-Za-z0-9]+/g, '-')}`.slice(0, 64));
      expect(result.members).toBeGreaterThan(5);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});

/** Chi-square p-value of observed counts against expected ones, adjacent bins pooled until each expects >= 5. */
function pooledPValue(observed: ArrayLike<number>, expected: ArrayLike<number>): { p: number; bins: number } {
  let statistic = 0;
  let bins = 0;
  let e = 0;
  let o = 0;
  for (let j = 0; j < expected.length; j++) {
    e += expected[j];
    o += observed[j];
    if (e >= 5 || j === expected.length - 1) {
      if (e > 0) {
        statistic += (o - e) ** 2 / e;
        bins++;
      }
      e = 0;
      o = 0;
    }
  }
  return { p: 1 - chisquareCdf(statistic, bins - 1), bins };
}

describe('conjugate-mixture: exact laws of the largest part and the number of parts, n = 400, parts >= 3, at most 30 parts', () => {
  it('matches the counts (partitions into at most 30 parts in [3, j], by adding one size at a time)', () => {
    const n = 400;
    const lo = 3;
    const K = 30;
    // ways[c][m]: partitions of m into exactly c parts in [lo, j] (j grows by one each round).
    const ways = Array.from({ length: K + 1 }, () => new Float64Array(n + 1));
    ways[0][0] = 1;
    const atMost = new Float64Array(n + 1); // atMost[j]: members with largest part <= j
    for (let j = lo; j <= n; j++) {
      for (let c = 1; c <= K; c++) for (let m = j; m <= n; m++) ways[c][m] += ways[c - 1][m - j];
      let total = 0;
      for (let c = 1; c <= K; c++) total += ways[c][n];
      atMost[j] = total;
    }
    const members = atMost[n];
    const family = { kind: 'partition', n, minPart: lo, maxLength: K } as PartitionFamily;
    const sampler = constrainedPartitionSampler(family, { method: 'conjugate-mixture' });
    const samples = 20_000;
    const largest = new Float64Array(n + 1);
    const parts = new Float64Array(K + 1);
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('cmix-laws', i, 'law'));
      largest[p.sizes[0]]++;
      let length = 0;
      for (const m of p.multiplicities) length += m;
      parts[length]++;
    }
    const expectedLargest = new Float64Array(n + 1);
    for (let j = lo; j <= n; j++) expectedLargest[j] = ((atMost[j] - atMost[j - 1]) / members) * samples;
    const expectedParts = new Float64Array(K + 1);
    for (let c = 1; c <= K; c++) expectedParts[c] = (ways[c][n] / members) * samples;
    const a = pooledPValue(largest, expectedLargest);
    const b = pooledPValue(parts, expectedParts);
    expect(a.bins).toBeGreaterThan(20);
    expect(b.bins).toBeGreaterThan(5);
    expect(a.p).toBeGreaterThan(ALPHA);
    expect(b.p).toBeGreaterThan(ALPHA);
  });
});

describe('conjugate-mixture: the block of smallest sizes', () => {
  it('weights p_j(m) x^m match partition counts into parts <= j, in the table and beyond it', () => {
    const j = 5;
    const t = -0.05;
    const block = new SmallPartsBlock(j, t);
    const top = block.limit + 300;
    // p[m]: partitions of m into parts <= j (one size at a time; Andrews 1976, §1.2).
    const p = new Float64Array(top + 1);
    p[0] = 1;
    for (let i = 1; i <= j; i++) for (let m = i; m <= top; m++) p[m] += p[m - i];
    for (const m of [0, 1, 7, 40, block.limit, block.limit + 1, block.limit + 299]) {
      const exact = p[m] * Math.exp(t * m);
      expect(Math.abs(block.weight(m) - exact)).toBeLessThanOrEqual(1e-12 * exact);
      for (const u of [0.001, 0.3, 0.999]) expect(block.accepts(u, m)).toBe(u * block.bound < block.weight(m));
    }
  });

  it('chooses a block only when the mixture has at least twice its sizes', () => {
    expect(new ConjugateMixture(34, 3, 34, 5).j).toBe(0);
    expect(new ConjugateMixture(40, 2, 40, 8).j).toBe(4);
    expect(new ConjugateMixture(400, 3, 400, 30).j).toBe(15);
  });
});

describe('conjugate-mixture: planning', () => {
  it('serves at most 23013 parts >= 187 at n = 904177401 (refused before: box-mixture alone)', () => {
    const family = { kind: 'partition', n: 904177401, minPart: 187, maxLength: 23013 } as PartitionFamily;
    const candidate = planCandidates(family).find((c) => c.method === 'conjugate-mixture/2');
    expect(candidate?.fits).toBe(true);
  });

  it('proposals are members: k <= K parts, all >= lo and <= hi, summing to n', () => {
    const sampler = new ConjugateMixture(5000, 7, 400, 60);
    for (let i = 0; i < 200; i++) {
      const p = sampler.sample(sampleSource('cmix-members', i, 'x'));
      let sum = 0;
      let length = 0;
      p.multiplicities.forEach((m, j) => {
        sum += m * p.sizes[j];
        length += m;
      });
      expect(sum).toBe(5000);
      expect(length).toBeLessThanOrEqual(60);
      expect(p.sizes[p.sizes.length - 1]).toBeGreaterThanOrEqual(7);
      expect(p.sizes[0]).toBeLessThanOrEqual(400);
    }
  });
});
