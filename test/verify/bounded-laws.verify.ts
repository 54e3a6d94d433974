import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { boundedPartSaddle } from '../../src/core/counting/log-bounded-part-count.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { exactBoundedCounts, multiplicityLaw, multiplicityOf, multiplicityPValue } from '../support/bounded-laws.js';
import { chiSquareTest } from '../support/chi-square.js';
import { assertValidPartition } from '../support/partition-checks.js';

// Laws of uniform partitions at n = 20,000 against exact counts, for bounded-self-similar/1
// forced through the planner (its recursion runs 5 levels here; the counts of the first levels
// are main-arc integrals above their tables). False-alarm probability alpha = 1e-4 per describe
// block (project convention), Bonferroni-split over its statistics.
const ALPHA = 1e-4;
const n = 20_000;
const samples = 20_000;

describe.each([
  [1, 142],
  [7, 142],
])('parts in [%d, %d] of 20,000: exact multiplicity laws', (a, b) => {
  const c = exactBoundedCounts(a, b, n);
  const sizes = [...new Set([a, a + 1, 2 * a, 4 * a, 8 * a, b - 1, b])];
  const family: PartitionFamily = { kind: 'partition', n, minPart: a, maxPart: b };
  const sampler = constrainedPartitionSampler(family, { method: 'bounded-self-similar' });
  const observed = new Map<number, number[]>(sizes.map((k) => [k, []]));
  for (let i = 0; i < samples; i++) {
    const p = sampler.sample(sampleSource('bounded-laws', i, `${a}-${b}`));
    if (i < 200) {
      assertValidPartition(p, n);
      expect(Math.min(...p.sizes)).toBeGreaterThanOrEqual(a);
      expect(Math.max(...p.sizes)).toBeLessThanOrEqual(b);
    }
    for (const k of sizes) observed.get(k)!.push(multiplicityOf(p, k));
  }
  for (const k of sizes) {
    it(`multiplicity of part ${k} (chi-square)`, () => {
      expect(multiplicityPValue(observed.get(k)!, multiplicityLaw(c, n, k, samples))).toBeGreaterThan(ALPHA / sizes.length);
    });
  }
});

describe('at most 36 parts of 20,000 (conjugated parts <= 36): the exact law of the number of parts', () => {
  const K = 36;
  // P(at most j parts) = c_{[1,j]}(n)/c_{[1,K]}(n) (conjugation), c_{[1,j]}(n) recorded as the
  // factors 1/(1 − q^j) are multiplied in.
  const c = new Array<bigint>(n + 1).fill(0n);
  c[0] = 1n;
  const atMost: bigint[] = [0n];
  for (let j = 1; j <= K; j++) {
    for (let m = j; m <= n; m++) c[m] += c[m - j];
    atMost.push(c[n]);
  }
  const scale = 10n ** 18n;
  const cdf = atMost.map((x) => Number((x * scale) / atMost[K]) / 1e18);
  // Bins: lengths <= first, each length up to K (merged from below until >= 5 expected).
  const probs: number[] = [];
  const edges: number[] = [];
  let below = 0;
  for (let j = 1; j <= K; j++) {
    if ((cdf[j] - below) * samples >= 5 || j === K) {
      probs.push(cdf[j] - below);
      edges.push(j);
      below = cdf[j];
    }
  }
  it('number of parts (chi-square over merged bins)', () => {
    const family: PartitionFamily = { kind: 'partition', n, maxLength: K };
    const sampler = constrainedPartitionSampler(family, { method: 'bounded-self-similar+conjugate' });
    expect(sampler.method).toBe('bounded-self-similar/1+conjugate');
    const bins = new Array<number>(probs.length).fill(0);
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('bounded-laws-length', i, 'at-most-36'));
      const parts = p.multiplicities.reduce((x, y) => x + y, 0);
      bins[edges.findIndex((e) => parts <= e)]++;
    }
    expect(chiSquareTest(bins, probs).pValue).toBeGreaterThan(ALPHA);
  });
});

/**
 * Parts in [1544, 15508] of 653,100 (a ~ 1.9 √n, ~260 parts): the top level's counts (parts in
 * [772, 7754] of sizes ~163,000) are main-arc integrals whose table stays unfilled (the maximiser
 * bounds the weights below it in closed form); the next level's sizes reach its table. The exact
 * law of the number of parts from T(j, n), the partitions of n into exactly j parts in [a, b]:
 * T(j, m) = T(j − 1, m − a) + T(j, m − j) − T(j − 1, m − j − b) (a part a removed; else each part
 * less 1, those with a part b excluded), in doubles (the same recurrence checked against BigInt
 * counts in test/partitions/log-bounded-part-count.test.ts; relative error ~1e-12, far below the
 * test's resolution). alpha = 1e-4.
 */
describe('parts in [1544, 15508] of 653,100: the exact law of the number of parts', () => {
  const [n, a, b] = [653_100, 1544, 15_508];
  const draws = 3000;
  it('number of parts (chi-square over merged bins)', () => {
    // Rows T(j, ·) for m <= n, full (no mirror: the law is read at m = n only), scaled by
    // e^{−θm} (θ the saddle point at n) so that they stay within doubles (c(n) ~ e^{2000}).
    const theta = boundedPartSaddle(a, b, n);
    const byParts: number[] = [0];
    let previous = new Float64Array(n + 1);
    previous[0] = 1;
    const ea = Math.exp(-theta * a);
    for (let j = 1; j * a <= n; j++) {
      const row = new Float64Array(n + 1);
      const ej = Math.exp(-theta * j);
      const ejb = Math.exp(-theta * (j + b));
      for (let m = j * a; m <= Math.min(j * b, n); m++) {
        const rest = m - j;
        row[m] = previous[m - a] * ea + row[rest] * ej - (rest - b >= 0 ? previous[rest - b] * ejb : 0);
      }
      byParts.push(row[n]);
      previous = row;
    }
    const total = byParts.reduce((x, y) => x + y, 0);
    const probs: number[] = [];
    const edges: number[] = [];
    let pending = 0;
    for (let j = 1; j < byParts.length; j++) {
      pending += byParts[j] / total;
      if (pending * draws >= 5 || j === byParts.length - 1) {
        probs.push(pending);
        edges.push(j);
        pending = 0;
      }
    }
    const sampler = constrainedPartitionSampler({ kind: 'partition', n, minPart: a, maxPart: b }, { method: 'bounded-self-similar' });
    const bins = new Array<number>(probs.length).fill(0);
    for (let i = 0; i < draws; i++) {
      const p = sampler.sample(sampleSource('bounded-laws-large-a', i, `${n}`));
      if (i < 50) {
        assertValidPartition(p, n);
        expect(Math.min(...p.sizes)).toBeGreaterThanOrEqual(a);
        expect(Math.max(...p.sizes)).toBeLessThanOrEqual(b);
      }
      const parts = p.multiplicities.reduce((x, y) => x + y, 0);
      bins[edges.findIndex((e) => parts <= e)]++;
    }
    expect(probs.length).toBeGreaterThan(8);
    // Measured: 37 bins, p = 0.11.
    expect(chiSquareTest(bins, probs).pValue).toBeGreaterThan(ALPHA);
  });
});
