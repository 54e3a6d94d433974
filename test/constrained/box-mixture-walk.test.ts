import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { BinomialWalk } from '../../src/core/partitions/constrained/binomial-walk.js';
import { logBinomialAt } from '../../src/core/partitions/constrained/box-mixture.js';
import { logSuccessFromBinomial } from '../../src/core/partitions/constrained/box-subset.js';
import { mixtureSampler } from '../../src/core/partitions/constrained/plan-length.js';
import { designMoments, logGaussianBinomial } from '../../src/core/partitions/constrained/subset-design.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

/**
 * The bounded boxes of box-mixture walk one tilt across consecutive numbers of parts
 * (binomial-walk.ts). Deterministic checks that the walked normalisers and moments equal the
 * direct sums, then Pearson chi-square over the enumerated family with the walk forced
 * (keepWithin = Infinity: one tilt for all k) and with the default tuning: 25 samples per member,
 * fixed seeds, false-alarm probability alpha = 1e-4 per test (6 tests: <= 6e-4 together).
 */
const ALPHA = 1e-4;

describe('BinomialWalk', () => {
  it('walked ln [N choose j]_x and size moments equal the direct sums (logGaussianBinomial, designMoments)', () => {
    const source = sampleSource('binomial-walk', 0, 'test');
    for (const s of [0, 1e-5, 3e-3, 0.2, 2]) {
      let N = 40;
      let j = 12;
      const start = designMoments(j, N - j, s);
      const walk = new BinomialWalk(s, N, j, logGaussianBinomial(N, j, s), start.mean, start.variance);
      for (let step = 0; step < 300; step++) {
        // Moves of up to two unit steps each way, staying inside 1 <= j < N <= 200.
        const dN = Math.floor(source.nextDouble() * 5) - 2;
        const dj = Math.floor(source.nextDouble() * 5) - 2;
        const N2 = Math.min(200, Math.max(3, N + dN + 1));
        const j2 = Math.min(N2 - 1, Math.max(1, j + dj));
        expect(walk.moveTo(N2, j2, 8)).toBe(true);
        N = N2;
        j = j2;
        const log = logGaussianBinomial(N, j, s);
        expect(Math.abs(walk.log - log), `s ${s} [${N} choose ${j}]`).toBeLessThan(1e-11 * Math.max(1, Math.abs(log)));
        const { mean, variance } = designMoments(j, N - j, s);
        expect(Math.abs(walk.mean - mean)).toBeLessThan(1e-8 * Math.max(1, mean));
        expect(Math.abs(walk.variance - variance)).toBeLessThan(1e-7 * Math.max(1, variance));
      }
    }
  });

  it('refuses moves longer than its step limit without moving', () => {
    const walk = new BinomialWalk(0.1, 30, 10, logGaussianBinomial(30, 10, 0.1), 0, 0);
    expect(walk.moveTo(36, 10, 4)).toBe(false);
    expect([walk.N, walk.j, walk.log]).toEqual([30, 10, logGaussianBinomial(30, 10, 0.1)]);
    expect(walk.moveTo(33, 14, 3)).toBe(false); // three diagonal steps and one more
    expect(walk.moveTo(33, 13, 3)).toBe(true);
    expect(Math.abs(walk.log - logGaussianBinomial(33, 13, 0.1))).toBeLessThan(1e-12);
  });
});

describe('box-mixture over bounded boxes: walked normalisers', () => {
  it('the O(1) normaliser at s >= 0.01 equals the direct product', () => {
    for (const [N, j, s] of [
      [500, 120, 0.01],
      [5000, 999, 0.02],
      [120, 100, 0.5],
      [100_000, 2500, 0.013],
    ]) {
      const direct = logGaussianBinomial(N, j, s);
      expect(Math.abs(logBinomialAt(N, j, s) - direct), `[${N} choose ${j}] at ${s}`).toBeLessThan(1e-12 * Math.max(1, Math.abs(direct)));
    }
  });

  for (const [name, n, lo, hi, distinct, K] of [
    ['parts in [2, 10368], n = 1.5e7, up to 2948 parts', 15_395_764, 2, 10_368, false, 2948],
    ['parts in [4226, 105077], n = 2.7e7, up to 2835 parts', 26_977_122, 4226, 105_077, false, 2835],
    ['distinct parts in [3, 2000], n = 4e5', 400_000, 3, 2000, true, 1000],
    ['parts in [2, 60], n = 6000 (boxes conjugated past k = 58)', 6000, 2, 60, false, 400],
  ] as const) {
    it(`${name}: every design's ln(success per member) equals the direct formula at its tilt; most k keep the tilt`, () => {
      const mixture = mixtureSampler(n, lo, hi, distinct, K);
      let kept = 0;
      let checked = 0;
      mixture.designs.forEach((d, i) => {
        if (d.single) return;
        checked++;
        if (i > 0 && mixture.designs[i - 1].s === d.s) kept++;
        const direct = logSuccessFromBinomial(d.k, d.m, d.s, logGaussianBinomial(d.k + d.b, d.k - 1, d.s));
        expect(Math.abs(d.logSuccessPerMember() - direct), `design ${i}`).toBeLessThan(1e-9 * Math.max(1, Math.abs(direct)));
      });
      expect(checked).toBeGreaterThan(50);
      expect(kept).toBeGreaterThan(checked / 2);
    });
  }
});

describe('box-mixture over bounded boxes is exact (chi-square over the enumerated family)', () => {
  // keepWithin: Infinity keeps the first bounded box's tilt for every k (forced walk), 3 keeps it
  // while within 3 sd (walks and re-solves), both without re-solving the heaviest boxes (polish:
  // false); undefined is the default tuning (walk, then the heaviest boxes solved exactly).
  const cases: Array<[string, Omit<PartitionFamily, 'kind'> & { minPart: number; maxPart: number; maxLength: number }, number]> = [
    ['parts in [2, 11], at most 6', { n: 38, minPart: 2, maxPart: 11, maxLength: 6 }, Infinity],
    ['parts in [2, 5], at most 12 (conjugated boxes, complement switching)', { n: 30, minPart: 2, maxPart: 5, maxLength: 12 }, Infinity],
    ['distinct parts in [1, 12], at most 8 (staircase; conjugated past k = 6)', { n: 40, distinct: true, minPart: 1, maxPart: 12, maxLength: 8 }, 3],
  ];
  for (const [name, spec, forced] of cases) {
    for (const keepWithin of [forced, undefined]) {
      it(`${name}: ${JSON.stringify(spec)}, keepWithin ${keepWithin ?? 'default'}`, () => {
        const family = { kind: 'partition', ...spec } as PartitionFamily;
        const sampler = mixtureSampler(spec.n, spec.minPart, spec.maxPart, spec.distinct === true, spec.maxLength, keepWithin === undefined ? {} : { keepWithin, polish: false });
        const bounded = sampler.designs.filter((d) => !d.single && d.b !== Infinity);
        expect(bounded.length).toBeGreaterThan(2);
        if (keepWithin === Infinity) expect(new Set(bounded.map((d) => d.s)).size).toBe(1);
        if (keepWithin !== undefined) expect(bounded.some((d, i) => i > 0 && bounded[i - 1].s === d.s)).toBe(true);
        const result = chiSquareUniform(family, sampler, `walk-${name.replace(/[^A-Za-z0-9]+/g, '-')}-${keepWithin ?? 'd'}`.slice(0, 64));
        expect(result.members).toBeGreaterThan(20);
        expect(result.strangers).toBe(0);
        expect(result.pValue).toBeGreaterThan(ALPHA);
      });
    }
  }
});
