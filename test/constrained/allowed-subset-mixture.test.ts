import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { AllowedSubsetMixture } from '../../src/core/partitions/constrained/allowed-subset-mixture.js';
import { listLengthFeasible } from '../../src/core/partitions/constrained/length-feasibility.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';
import { pooled } from '../support/distinct-part-count-law.js';

/**
 * At most K distinct parts from an allowed list (allowed-subset-mixture: one subset design for
 * every number of parts, the last part determined). Statistical tests: fixed seeds, false-alarm
 * probability alpha = 1e-4 each (project convention); the references are full enumeration
 * (test/support/enumerate-constrained.ts) and counts by (number of parts, sum) computed here.
 */
const ALPHA = 1e-4;

type Case = [name: string, family: Omit<PartitionFamily, 'kind'>];

describe('allowed-subset-mixture is exact (chi-square over the enumerated family, method forced)', () => {
  const cases: Case[] = [
    ['below the middle of the sums (x < 1)', { n: 25, distinct: true, allowed: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14], maxLength: 4 }],
    ['above the middle (complements)', { n: 55, distinct: true, allowed: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15], maxLength: 5 }],
    ['a list with gaps', { n: 45, distinct: true, allowed: [1, 2, 3, 4, 6, 7, 8, 10, 11, 12, 14, 15, 17, 19, 20], maxLength: 4 }],
    ['even sizes (span 2)', { n: 50, distinct: true, allowed: [2, 4, 6, 8, 10, 12, 14, 16, 18, 20, 22], maxLength: 4 }],
    // Sizes = 1 mod 3: k parts sum to k mod 3, so only k = 2 mod 3 reach n = 53 (k = 2, 5; 6 parts fit).
    ['sizes in one residue class (numbers of parts restricted)', { n: 53, distinct: true, allowed: [1, 4, 7, 10, 13, 16, 19, 22, 25, 28, 31], maxLength: 5 }],
    ['binding hard (few parts of large sizes)', { n: 40, distinct: true, allowed: [1, 2, 3, 5, 6, 8, 9, 11, 13, 14, 17], maxLength: 4 }],
  ];
  for (const [name, spec] of cases) {
    it(`${name}: ${JSON.stringify(spec)}`, () => {
      const family = { kind: 'partition', ...spec } as PartitionFamily;
      const sampler = constrainedPartitionSampler(family, { method: 'allowed-subset-mixture' });
      expect(sampler.method).toBe('allowed-subset-mixture/1');
      const result = chiSquareUniform(family, sampler, `asm-${name.replace(/[^A-Za-z0-9]+/g, '-')}`.slice(0, 64));
      expect(result.members).toBeGreaterThan(5);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});

describe('allowed-subset-mixture follows the exact laws of the number of parts and the largest part', () => {
  it('n = 3000, odd sizes below 400, at most 26 parts (binding: ~30 parts without the bound): chi-square against the counted laws', () => {
    const values = Array.from({ length: 200 }, (_, k) => 2 * k + 1);
    const n = 3000;
    const K = 26;
    // table[k][m]: k-subsets of the sizes seen so far with sum m; before adding a, the subsets
    // with largest part a and k parts number table[k - 1][n - a].
    const table = Array.from({ length: K + 1 }, () => new Float64Array(n + 1));
    table[0][0] = 1;
    const largest = new Map<number, number>();
    for (const a of values) {
      if (a > n) break;
      let withA = 0;
      for (let k = 1; k <= K; k++) withA += table[k - 1][n - a];
      if (withA > 0) largest.set(a, withA);
      for (let k = K; k >= 1; k--) for (let m = n; m >= a; m--) table[k][m] += table[k - 1][m - a];
    }
    const counts = table.map((row) => row[n]);
    const total = counts.reduce((a, b) => a + b, 0);
    expect(counts[K] / total).toBeGreaterThan(0.5); // the bound binds: most members have K parts
    const family: PartitionFamily = { kind: 'partition', n, distinct: true, allowed: values, maxLength: K };
    const sampler = constrainedPartitionSampler(family, { method: 'allowed-subset-mixture' });
    const samples = 4000;
    const byParts = new Array<number>(K + 1).fill(0);
    const tops = [...largest.keys()];
    const byTop = new Array<number>(tops.length).fill(0);
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('asm-law', i, 'parts'));
      expect(p.sizes.reduce((a, b) => a + b, 0)).toBe(n);
      byParts[p.sizes.length]++;
      byTop[tops.indexOf(p.sizes[0])]++;
    }
    const partsBins = pooled(byParts, counts.map((c) => c / total), samples);
    expect(chiSquareTest(partsBins.observed, partsBins.probabilities).pValue).toBeGreaterThan(ALPHA);
    const topBins = pooled(byTop, tops.map((a) => largest.get(a)! / total), samples);
    expect(chiSquareTest(topBins.observed, topBins.probabilities).pValue).toBeGreaterThan(ALPHA);
  });
});

describe('at most K distinct sizes of a list: feasibility with the witness search', () => {
  /** Whether some subset with kMin..kMax elements sums to n (byte table per count, the reference). */
  function reference(values: readonly number[], n: number, kMin: number, kMax: number): boolean {
    const rows = Array.from({ length: kMax + 1 }, () => new Uint8Array(n + 1));
    rows[0][0] = 1;
    for (const a of values) for (let k = kMax; k >= 1; k--) for (let m = n; m >= a; m--) if (rows[k - 1][m - a]) rows[k][m] = 1;
    for (let k = kMin; k <= kMax; k++) if (rows[k][n]) return true;
    return false;
  }

  it('agrees with the byte table on random lists when the bit sets are out of budget (or leaves it undecided)', () => {
    let s = 12345;
    const rnd = () => {
      s = (s * 48271) % 2147483647;
      return s / 2147483647;
    };
    let decided = 0;
    for (let trial = 0; trial < 200; trial++) {
      const r = 6 + Math.floor(rnd() * 14);
      const set = new Set<number>();
      const spread = 20 + Math.floor(rnd() * 130);
      while (set.size < r) set.add(1 + Math.floor(rnd() * spread));
      const values = [...set].sort((a, b) => a - b);
      const K = 1 + Math.floor(rnd() * (r - 1));
      const n = 1 + Math.floor(rnd() * values.slice(-K).reduce((a, b) => a + b, 0));
      const expected = reference(values, n, 1, K);
      // Work limit 1e4: below the bit sets' need for most of these lists, above the witness's table.
      const got = listLengthFeasible(values, n, 1, K, true, 1e4);
      if (got === undefined) continue;
      decided++;
      expect(got, `${JSON.stringify(values)} n = ${n} K = ${K}`).toBe(expected);
    }
    expect(decided).toBeGreaterThan(100);
  });

  it('a list whose k-subset sums miss n by residue is empty for every k (gcd of the differences)', () => {
    // Sizes = 1 mod 3: k parts sum to k mod 3; n = 3 mod 3 = 0 needs k = 0 mod 3, and K = 2.
    const values = [1, 4, 7, 10, 13, 16, 19];
    expect(() => new AllowedSubsetMixture(values, 30, 1, 2)).toThrow(RangeError);
    expect(listLengthFeasible(values, 30, 1, 2, true, 10)).toBe(false);
  });
});
