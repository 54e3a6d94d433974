import { describe, expect, it } from 'vitest';
import { LogDistinctBoundedCounts } from '../../src/core/counting/log-distinct-bounded-count.js';
import { LogDistinctPartitionNumbers } from '../../src/core/counting/log-distinct-partition-number.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { DistinctBoundedSelfSimilarSampler } from '../../src/core/partitions/distinct-bounded-self-similar.js';
import { maximiserGuess } from '../../src/core/partitions/distinct-bounded-tables.js';
import { DistinctSelfSimilarTables, type DistinctSelfSimilarStats } from '../../src/core/partitions/distinct-self-similar.js';
import { DistinctPartitionTable } from '../../src/core/partitions/distinct-table.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { exactLargestPartLaw, exactPartCountLaw, pooled } from '../support/distinct-part-count-law.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';
import { assertValidPartition } from '../support/partition-checks.js';

const ALPHA = 1e-4; // false-alarm probability per statistical check (project convention)
const tables = new DistinctSelfSimilarTables(new DistinctPartitionTable(60), new LogDistinctPartitionNumbers());

describe('distinct-bounded-self-similar internals', () => {
  it('finds the exact argmax of Q(m)·x^{2m} over 0 <= m <= n/2', () => {
    for (const b of [2, 3, 7, 50]) {
      const counts = tables.bounded.countsFor(b);
      for (const n of [3, 10, 57, 300, 1200, 4001, 9000]) {
        const logX = -tables.bounded.saddle(2 * b, n);
        let brute = 0;
        for (let m = 1; m <= Math.floor(n / 2); m++) if (counts.logRatio(m, brute) + 2 * (m - brute) * logX > 0) brute = m;
        expect(tables.bounded.maximiser(counts, n, logX), `b=${b} n=${n}`).toBe(brute);
        // From the engine's guess, and from wrong guesses (galloping both ways): the same argmax.
        for (const guess of [maximiserGuess(b, Infinity, -logX), 0, n / 2, brute + 3, brute - 5]) {
          expect(tables.bounded.maximiser(counts, n, logX, guess), `b=${b} n=${n} guess=${guess}`).toBe(brute);
        }
      }
      for (const n of [1e5, 1e7, 1e9]) {
        const logX = -tables.bounded.saddle(2 * b, n);
        const m = tables.bounded.maximiser(counts, n, logX);
        expect(tables.bounded.maximiser(counts, n, logX, maximiserGuess(b, Infinity, -logX))).toBe(m);
        expect(tables.bounded.maximiser(counts, n, logX, 0.9 * m)).toBe(m);
        const f = (k: number) => counts.logRatio(k, m) + 2 * (k - m) * logX;
        expect(f(m - 1)).toBeLessThanOrEqual(0);
        expect(f(m + 1)).toBeLessThanOrEqual(0);
      }
    }
  });

  it('returns valid partitions into distinct parts >= a at large n', () => {
    for (const [n, a] of [[1001, 2], [65_537, 7], [1e6 + 3, 50], [1e8, 3], [1e9, 7], [1e9, 200]]) {
      const sampler = new DistinctBoundedSelfSimilarSampler(n, a);
      for (let i = 0; i < 2; i++) {
        const p = sampler.sample(sampleSource('distinct-bounded-valid', i, `${n}-${a}`));
        assertValidPartition(p, n);
        expect(p.multiplicities.every((m) => m === 1)).toBe(true);
        expect(Math.min(...p.sizes)).toBeGreaterThanOrEqual(a);
      }
    }
  });

  it('the count class serves every m for b = ∞', () => {
    expect(new LogDistinctBoundedCounts(7).servable(1e9)).toBe(true);
  });
});

describe('distinct-bounded-self-similar is exactly uniform (chi-square over the enumerated family)', () => {
  // Base thresholds 0, 3 and 9 put the table's hand-over at different levels, so every level's
  // rejection step (with its smallest odd size s and the parity choice), the switch to the
  // plain levels once the smallest part reaches 1, and the merge are exercised.
  const cases: Array<[number, number, number]> = [
    [34, 2, 0],
    [40, 3, 3],
    [44, 5, 0],
    [46, 4, 9],
    [50, 9, 3],
  ];
  for (const [n, a, base] of cases) {
    it(`n = ${n}, parts >= ${a}, base threshold ${base}`, () => {
      const family: PartitionFamily = { kind: 'partition', n, distinct: true, minPart: a };
      const sampler = new DistinctBoundedSelfSimilarSampler(n, a, tables, base);
      const result = chiSquareUniform(family, sampler, `dbss-${n}-${a}-${base}`);
      expect(result.members).toBeGreaterThan(30);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
  it('through the planner (method forced)', () => {
    const family: PartitionFamily = { kind: 'partition', n: 42, distinct: true, minPart: 3 };
    const sampler = constrainedPartitionSampler(family, { method: 'distinct-bounded-self-similar' });
    expect(sampler.method).toBe('distinct-bounded-self-similar/1');
    const result = chiSquareUniform(family, sampler, 'dbss-plan');
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(ALPHA);
  });
});

describe('distinct-bounded-self-similar: the exact law of the number of parts', () => {
  // n = 10,000 with parts >= 4: the planner's choice there (table-lengths would fit too); the
  // top level's counts Q_2(m) come from the saddle-point integral for m > 2101 (its peak is near
  // n/4). Pearson chi-square on the pooled law; false-alarm probability 1e-4.
  it('n = 10,000, parts >= 4', () => {
    const n = 10_000;
    const a = 4;
    const family: PartitionFamily = { kind: 'partition', n, distinct: true, minPart: a };
    const planned = constrainedPartitionSampler(family);
    expect(planned.method).toBe('distinct-bounded-self-similar/1');
    const law = exactPartCountLaw(n, a);
    const samples = 6000;
    const observed = new Array<number>(law.length).fill(0);
    const source = sampleSource('dbss-parts-law', 0, 'test');
    const stats: DistinctSelfSimilarStats = { topProposals: 0, proposals: 0, visited: 0 };
    const sampler = new DistinctBoundedSelfSimilarSampler(n, a);
    for (let i = 0; i < samples; i++) observed[sampler.sample(source, stats).sizes.length]++;
    const p = pooled(observed, law, samples);
    expect(p.observed.length).toBeGreaterThan(15);
    expect(chiSquareTest(p.observed, p.probabilities).pValue).toBeGreaterThan(ALPHA);
  });
});

describe('distinct-bounded-self-similar with a largest part c (maxPart)', () => {
  // Chi-square over the enumerated family, levels exercised by low base thresholds; the cases
  // cover c alone (a = 1), both bounds, a range past its middle at the top level (n > S/2: the
  // proposal's x > 1), exactly at it (n = S/2: x = 1), c near 1.5√n, 2√n and 3√n (with and
  // without minPart = 7; the levels below land on either side of their middles) and a level
  // whose odd range is empty.
  const cases: Array<[number, number, number, number]> = [
    // n, a, c, base threshold
    [40, 1, 12, 0],
    [44, 2, 15, 3],
    [50, 3, 20, 0],
    [40, 1, 10, 0],
    [42, 4, 14, 9],
    [30, 1, 30, 3],
    [36, 1, 9, 0], // 1.5√n, S = 45 < 2n
    [36, 1, 12, 0], // 2√n
    [36, 1, 18, 3], // 3√n
    [52, 2, 14, 0], // n = S/2
    [60, 7, 16, 0], // minPart 7, c ≈ 2√n, n ≈ S/2
    [58, 7, 16, 3], // minPart 7, just past the middle (S = 115)
  ];
  for (const [n, a, c, base] of cases) {
    it(`n = ${n}, parts in [${a}, ${c}], base threshold ${base}`, () => {
      const family: PartitionFamily = { kind: 'partition', n, distinct: true, minPart: a, maxPart: c };
      const sampler = new DistinctBoundedSelfSimilarSampler(n, a, tables, base, c);
      expect(sampler.servable).toBe(true);
      const result = chiSquareUniform(family, sampler, `dbss-cap-${n}-${a}-${c}-${base}`);
      expect(result.members).toBeGreaterThan(5);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }

  it('through the planner (method forced): maxPart = 2√n, and minPart = 7 with a maxPart past the middle', () => {
    for (const family of [
      { kind: 'partition', n: 42, distinct: true, maxPart: 13 },
      { kind: 'partition', n: 59, distinct: true, minPart: 7, maxPart: 16 },
    ] satisfies PartitionFamily[]) {
      // (At these n the planner's sampler hands the whole of n to its base table.)
      const sampler = constrainedPartitionSampler(family, { method: 'distinct-bounded-self-similar' });
      expect(sampler.method).toBe('distinct-bounded-self-similar/1');
      const result = chiSquareUniform(family, sampler, `dbss-plan-cap-${family.n}`);
      expect(result.members).toBeGreaterThan(20);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    }
  });

  it('the exact law of the sum of the odd parts at n = 160,000 with maxPart = 800 = 2√n (middle-regime counts)', () => {
    // The top level's accept step decides exactly this statistic: T = |odd parts| has
    // P(T = s) ∝ O(s)·E((n − s)/2), O counting sets of distinct odd sizes <= c with sum s and E
    // sets of distinct sizes <= c/2 with sum m (the even parts halved): two double knapsacks.
    // The level's counts Q_{[1,400]}(m), m ≈ n/4 ≈ S'/2, come from the power series. 2500
    // samples in 20 bins of about equal probability; false-alarm probability 1e-4.
    const [n, c] = [160_000, 800];
    const sampler = new DistinctBoundedSelfSimilarSampler(n, 1, undefined, undefined, c);
    expect(sampler.servable).toBe(true);
    const counts = new LogDistinctBoundedCounts(1, c / 2);
    expect(counts.regime(n / 4)).toBe('middle');
    const odd = new Float64Array(n + 1);
    odd[0] = 1;
    for (let k = 1; k <= c; k += 2) for (let m = n; m >= k; m--) odd[m] += odd[m - k];
    const even = new Float64Array(n / 2 + 1);
    even[0] = 1;
    for (let k = 1; k <= c / 2; k++) for (let m = n / 2; m >= k; m--) even[m] += even[m - k];
    const weights = new Float64Array(n + 1);
    let total = 0;
    for (let s = n % 2; s <= n; s += 2) {
      weights[s] = odd[s] * even[(n - s) / 2];
      total += weights[s];
    }
    // 20 bins of about equal probability.
    const BINS = 20;
    const edges: number[] = [];
    const probabilities: number[] = [];
    let acc = 0;
    let taken = 0;
    for (let s = 0; s <= n; s++) {
      acc += weights[s] / total;
      if (acc >= (probabilities.length + 1) / BINS - 1e-12 || s === n) {
        edges.push(s);
        probabilities.push(acc - taken);
        taken = acc;
      }
    }
    const samples = 2500;
    const observed = new Array<number>(probabilities.length).fill(0);
    const source = sampleSource('dbss-cap-odd-sum', 0, 'test');
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(source);
      if (i < 5) assertValidPartition(p, n);
      let T = 0;
      for (const size of p.sizes) if (size % 2 === 1) T += size;
      let bin = 0;
      while (edges[bin] < T) bin++;
      observed[bin]++;
    }
    expect(probabilities.length).toBeGreaterThanOrEqual(BINS - 1);
    expect(chiSquareTest(observed, probabilities).pValue).toBeGreaterThan(ALPHA);
  });

  it('the exact law of the largest part at n = 20,000 with parts in [10, 600] (counts from the integral)', () => {
    // √n ≈ 141, so the bound binds (the largest part of a distinct partition is ~ √n·log n).
    const [n, a, c] = [20_000, 10, 600];
    const sampler = new DistinctBoundedSelfSimilarSampler(n, a, undefined, undefined, c);
    expect(sampler.servable).toBe(true);
    const law = exactLargestPartLaw(n, a, c);
    const samples = 4000;
    const observed = new Array<number>(law.length).fill(0);
    const source = sampleSource('dbss-cap-largest', 0, 'test');
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(source);
      if (i < 20) assertValidPartition(p, n);
      observed[p.sizes[0] - a]++;
    }
    const pooledLaw = pooled(observed, law, samples);
    expect(pooledLaw.observed.length).toBeGreaterThan(15);
    expect(chiSquareTest(pooledLaw.observed, pooledLaw.probabilities).pValue).toBeGreaterThan(ALPHA);
  });
});
