import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { BLOCK, BlockSubset, PrefixSubsetCounts } from '../../src/core/partitions/constrained/block-subset.js';
import { BoxRotation } from '../../src/core/partitions/constrained/box-rotation.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

/**
 * box-rotation (uniform k-subsets drawn in blocks, shifted in Z_M onto the box's sum): exactness
 * by Pearson chi-square over the enumerated family (25 samples per member, fixed seeds) and, at a
 * box too large to enumerate, the exact law of the largest part computed by counting. False-alarm
 * probability alpha = 1e-4 per test (project convention).
 */
const ALPHA = 1e-4;

type Case = [name: string, family: Omit<PartitionFamily, 'kind'>];

describe('box-rotation through the planner is exact (chi-square over the enumerated family)', () => {
  const cases: Case[] = [
    ['exactly k parts <= m, half full, gcd(k, N) = 1', { n: 27, length: 4, maxPart: 12 }],
    ['exactly k parts <= m, gcd(k, N) = 5 (padded group)', { n: 30, length: 5, maxPart: 11 }],
    ['exactly k parts in [lo, hi]', { n: 36, length: 4, minPart: 3, maxPart: 14 }],
    ['exactly k distinct parts <= m (staircase)', { n: 40, distinct: true, length: 5, maxPart: 16 }],
    ['at most K parts <= m', { n: 30, maxLength: 6, maxPart: 9 }],
    ['at most K parts <= m with m < K (conjugated box)', { n: 26, maxLength: 9, maxPart: 5 }],
    ['exactly k parts, far from half full', { n: 16, length: 4, maxPart: 9 }],
  ];
  for (const [name, spec] of cases) {
    it(`${name}: ${JSON.stringify(spec)}`, () => {
      const family = { kind: 'partition', ...spec } as PartitionFamily;
      const sampler = constrainedPartitionSampler(family, { method: 'box-rotation' });
      expect(sampler.method).toBe('box-rotation/1');
      const result = chiSquareUniform(family, sampler, `rot-${name.replace(/[^A-Za-z0-9]+/g, '-')}`.slice(0, 64));
      expect(result.members).toBeGreaterThan(5);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});

/** The box sampler alone, as a sampler of "at most rows parts, each <= cols". */
function boxSampler(rows: number, cols: number, size: number, padding?: number): { family: PartitionFamily; sampler: PartitionSampler; rotation: BoxRotation } {
  const rotation = new BoxRotation({ rows, cols, size }, padding);
  const sampler: PartitionSampler = { method: 'box-rotation/1', expectedLength: rows, expectedDistinct: rows, expectedWork: 1, sample: (s) => rotation.sample(s) };
  return { family: { kind: 'partition', n: size, maxLength: rows, maxPart: cols } as PartitionFamily, sampler, rotation };
}

describe('box-rotation paths the planner rarely takes are exact (chi-square)', () => {
  const cases: Array<[string, number, number, number, number | undefined]> = [
    ['d = gcd(k, M) = 5 > 1, no padding', 5, 10, 25, 0],
    ['d = 4, padding 2 (positions [N, M) must stay empty)', 4, 10, 20, 2],
    ['padding 7 with d = 1', 4, 9, 17, 7],
    ['two blocks (N = 73 > 64 positions), k = 3', 3, 70, 45, undefined],
    ['three blocks (N = 132), k = 2', 2, 130, 40, undefined],
  ];
  for (const [name, rows, cols, size, padding] of cases) {
    it(`${name}: ${rows} x ${cols} box, size ${size}`, () => {
      const { family, sampler, rotation } = boxSampler(rows, cols, size, padding);
      if (padding !== undefined) expect(rotation.estimate.M - rotation.estimate.N).toBe(padding);
      const result = chiSquareUniform(family, sampler, `rotd-${name.replace(/[^A-Za-z0-9]+/g, '-')}`.slice(0, 64));
      expect(result.members).toBeGreaterThan(5);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});

describe('box-rotation: exact law of the largest part in a 30 x 60 box of size 900', () => {
  it('matches the counts of partitions with at most 30 parts <= j (chi-square over pooled bins)', () => {
    const rows = 30;
    const cols = 60;
    const size = 900;
    // ways[c][m]: partitions of m into exactly c parts, each <= j (j grows by one each round).
    const ways = Array.from({ length: rows + 1 }, () => new Float64Array(size + 1));
    ways[0][0] = 1;
    const atMost: number[] = [0]; // atMost[j]: members with largest part <= j
    for (let j = 1; j <= cols; j++) {
      // Add parts of size j: ways'[c][m] = sum_t ways[c - t][m - t j] (in place, c and m ascending).
      for (let c = 1; c <= rows; c++) for (let m = j; m <= size; m++) ways[c][m] += ways[c - 1][m - j];
      let total = 0;
      for (let c = 0; c <= rows; c++) total += ways[c][size];
      atMost.push(total);
    }
    const members = atMost[cols];
    const { sampler } = boxSampler(rows, cols, size);
    const samples = 20_000;
    const observed = new Float64Array(cols + 1);
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('rot-largest', i, 'law'));
      observed[p.sizes[0]]++;
    }
    // Pool adjacent values of the largest part until each bin expects >= 5.
    let statistic = 0;
    let bins = 0;
    let expected = 0;
    let seen = 0;
    for (let j = 1; j <= cols; j++) {
      expected += ((atMost[j] - atMost[j - 1]) / members) * samples;
      seen += observed[j];
      if (expected >= 5 || j === cols) {
        statistic += (seen - expected) ** 2 / expected;
        bins++;
        expected = 0;
        seen = 0;
      }
    }
    expect(bins).toBeGreaterThan(10);
    expect(1 - chisquareCdf(statistic, bins - 1)).toBeGreaterThan(ALPHA);
  });
});

describe('block-subset tables', () => {
  it('prefix counts sum to binomial coefficients and match [4 choose 2]_q = 1 + q + 2q^2 + q^3 + q^4', () => {
    const table = PrefixSubsetCounts.shared();
    expect([0, 1, 2, 3, 4].map((s) => table.count(4, 2, s))).toEqual([1, 1, 2, 1, 1]);
    let total = 0;
    for (let s = 0; s <= 10 * (BLOCK - 10); s++) total += table.count(BLOCK, 10, s);
    // C(64, 10) = 151473214816.
    expect(total).toBe(151473214816);
  });

  it('block counts of a draw sum to k and the internal sums stay in range', () => {
    const set = new BlockSubset(1000, 333);
    const source = sampleSource('blocks', 0, 'x');
    for (let t = 0; t < 20; t++) {
      set.draw(source);
      let k = 0;
      for (let g = 0; g < set.blocks; g++) {
        const a = set.counts[g];
        const length = g === set.blocks - 1 ? 1000 - (set.blocks - 1) * BLOCK : BLOCK;
        expect(set.sums[g]).toBeLessThanOrEqual(a * (length - a));
        k += a;
      }
      expect(k).toBe(333);
      expect(set.countRange(source, 0, 1000)).toBe(333);
    }
  });
});

describe('box-rotation serves the half-full boxes of sides near sqrt(n) at n = 1e9', () => {
  it('plans exactly or at most 31623 parts <= 63246 (refused before box-rotation)', () => {
    for (const constraint of [{ length: 31_623 }, { maxLength: 31_623 }]) {
      const family = { kind: 'partition', n: 1e9, maxPart: 63_246, ...constraint } as PartitionFamily;
      const sampler = constrainedPartitionSampler(family);
      expect(sampler.method).toBe('box-rotation/1');
      const p = sampler.sample(sampleSource('rot-1e9', 0, 'plan'));
      let parts = 0;
      let total = 0;
      p.sizes.forEach((s, i) => {
        parts += p.multiplicities[i];
        total += s * p.multiplicities[i];
      });
      expect(total).toBe(1e9);
      expect(p.sizes[0]).toBeLessThanOrEqual(63_246);
      if ('length' in constraint) expect(parts).toBe(31_623);
      else expect(parts).toBeLessThanOrEqual(31_623);
    }
  });
});
