import { describe, expect, it } from 'vitest';
import { countPartitions } from '../../src/core/counting/partition-counts.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { lengthOf, partsOf, sizeOf, type Partition } from '../../src/core/partition.js';
import { constrainedPartitionSampler, planCandidates } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { satisfies } from '../support/enumerate-constrained.js';
import { exactlyPartsRows, fromSurvival, knapsackLaws, lawPValue, range, type Law } from '../support/recurrence-laws.js';

/**
 * Methods forced through the planner's `method` option at mid sizes, where counting still works
 * (and mostly a table would still fit) but the planner already takes a non-table method: the law
 * of a statistic of the samples (smallest part, largest part, number of parts, multiplicity of
 * one size) against its exact law. The laws are computed here in doubles by additions of
 * positives only, from recurrences independent of the library's code (test/support/recurrence-laws.ts):
 *   p(m, c), partitions of m into exactly c parts: p(m, c) = p(m − 1, c − 1) + p(m − c, c)
 *   (OEIS A008284; exactly c parts >= a: p(m − c(a − 1), c); exactly c distinct parts >= a:
 *   p(m − c(a − 1) − c(c − 1)/2, c), the staircase removed);
 *   bounded parts by the knapsack over the sizes lo..hi, tracking the number of parts (0/1 for
 *   distinct parts), read after each size for the law of the largest part;
 *   allowed lists by the coin-change recurrence.
 * Each law's total is checked against the library's BigInt count (countPartitions, itself checked
 * against OEIS in test/constrained/counts.test.ts) to 1e-9.
 *
 * Pairs added (method, shape; before this file they had no mid-size law, see the table at the top
 * of test/constrained/method-coverage.test.ts): bounded-boltzmann+conjugate k K Dk Dak,
 * bounded-self-similar+conjugate k Dk Dak, box-subset k K Dk Dak (open boxes), box-rotation bk,
 * self-similar+box-filter k, bounded-boltzmann+conjugate+box-filter bk bK, allowed-boltzmann L,
 * minpart-self-similar a (through the planner), bounded-boltzmann a, box-mixture a abK DaK Db Dab Da,
 * conjugate-mixture abK, distinct-boltzmann Db Dab Da, table-recursive+box-filter k,
 * bounded-boltzmann+box-filter bk, allowed-length-boltzmann bKL, allowed-subset DbkL,
 * minpart-self-similar+length-filter aK, distinct-bounded-self-similar+length-filter DaK.
 *
 * Pearson chi-square, cells pooled until each expects >= 20 samples (common practice), fixed
 * seeds; each statistic's test rejects an exact sampler with probability alpha = 1e-4 (project
 * convention), so the file's family-wise false-alarm probability is at most (number of
 * statistic tests, ~80) x 1e-4 (< 1%).
 */
const ALPHA = 1e-4;

type Statistic = [name: string, value: (p: Partition) => number, law: Law];

const partition = (spec: Omit<PartitionFamily, 'kind'>) => ({ kind: 'partition', ...spec }) as PartitionFamily;
const bare = (id: string) => id.replace(/\/\d+/g, '');

/** The library's BigInt count agrees with a law's double total. */
function checkTotal(family: PartitionFamily, total: number): void {
  const exact = Number(countPartitions(family, 1e8));
  expect(Math.abs(total / exact - 1)).toBeLessThan(1e-9);
}

/**
 * Forces `method` on the family (the planner's own choice there is `planned`; `tableFits`: a
 * counting table still fits at this size) and tests each statistic's law.
 */
function check(family: PartitionFamily, methods: readonly string[], planned: string, tableFits: boolean, statistics: readonly Statistic[], samples = 20_000): void {
  describe(`${JSON.stringify(family).replace('"kind":"partition",', '')} (planned: ${planned})`, () => {
    it('the planner takes the named method there', () => {
      expect(bare(constrainedPartitionSampler(family).method)).toBe(planned);
      expect(planCandidates(family).some((c) => c.method.startsWith('table') && c.fits)).toBe(tableFits);
    });
    for (const method of methods) {
      it(`${method}: ${statistics.map(([name]) => name).join(', ')} (${samples} samples)`, () => {
        const sampler = constrainedPartitionSampler(family, { method });
        expect(bare(sampler.method)).toBe(method);
        const seen = statistics.map(() => new Map<number, number>());
        for (let i = 0; i < samples; i++) {
          const p = sampler.sample(sampleSource(`laws-${method}`.replace(/\+/g, '.'), i, JSON.stringify(family)));
          if (i < 200) expect(sizeOf(p) === family.n && satisfies(partsOf(p), family), `${partsOf(p)}`).toBe(true);
          statistics.forEach(([, value], s) => {
            const v = value(p);
            seen[s].set(v, (seen[s].get(v) ?? 0) + 1);
          });
        }
        statistics.forEach(([name, , law], s) => {
          const { pValue, cells } = lawPValue(seen[s], law, samples);
          expect(cells, name).toBeGreaterThan(2);
          expect(pValue, `${method} ${name}: p = ${pValue.toExponential(2)}`).toBeGreaterThan(ALPHA);
        });
      });
    }
  });
}

const smallest = (p: Partition) => p.sizes[p.sizes.length - 1];
const largest = (p: Partition) => p.sizes[0];
const multiplicity = (size: number) => (p: Partition) => {
  const i = p.sizes.indexOf(size);
  return i < 0 ? 0 : p.multiplicities[i];
};

describe('the recurrences of the exact laws', () => {
  it('p(10, c) is row 10 of OEIS A008284, and the knapsack gives the same counts', () => {
    // OEIS A008284 row 10: 1, 5, 8, 9, 7, 5, 3, 2, 1, 1 (as in test/constrained/counts.test.ts).
    const row = [1, 5, 8, 9, 7, 5, 3, 2, 1, 1];
    const rows = exactlyPartsRows(10, 10);
    expect(row.map((_, i) => rows[i + 1][10])).toEqual(row);
    const laws = knapsackLaws(10, range(1, 10), false, 1, 10);
    expect(laws.total).toBe(42); // p(10), OEIS A000041
    expect(row.map((c, i) => laws.parts.get(i + 1)! * 42)).toEqual(row.map((c) => expect.closeTo(c, 9)));
    // Distinct parts of 10 by number of parts: 1, 4, 4, 1 (OEIS A008289 row 10), q(10) = 10 (A000009).
    const distinct = knapsackLaws(10, range(1, 10), true, 1, 4);
    expect(distinct.total).toBe(10);
    expect([1, 2, 3, 4].map((c) => distinct.parts.get(c)! * 10)).toEqual([1, 4, 4, 1].map((c) => expect.closeTo(c, 9)));
  });
});

describe('exactly k parts, no upper bound: conjugation and open boxes', () => {
  {
    // Smallest part of exactly k parts: P(smallest >= s) = p(n − k(s − 1), k) / p(n, k).
    const n = 5000;
    const k = 30;
    const rows = exactlyPartsRows(n, k);
    const family = partition({ n, length: k });
    checkTotal(family, rows[k][n]);
    const law = fromSurvival(1, (s) => (n - k * (s - 1) >= k ? rows[k][n - k * (s - 1)] / rows[k][n] : 0));
    check(family, ['bounded-boltzmann+conjugate', 'bounded-self-similar+conjugate', 'box-subset'], 'bounded-boltzmann+conjugate', true, [['smallest part', smallest, law]]);
  }
  {
    // At most K parts: P(c parts) = p(n, c) / sum, P(smallest >= s) = sum_c p(n − c(s − 1), c) / sum.
    const n = 5000;
    const K = 30;
    const rows = exactlyPartsRows(n, K);
    let total = 0;
    for (let c = 1; c <= K; c++) total += rows[c][n];
    const family = partition({ n, maxLength: K });
    checkTotal(family, total);
    const parts: Law = new Map();
    for (let c = 1; c <= K; c++) parts.set(c, rows[c][n] / total);
    const survival = (s: number) => {
      let sum = 0;
      for (let c = 1; c <= K && n - c * (s - 1) >= c; c++) sum += rows[c][n - c * (s - 1)];
      return sum / total;
    };
    check(family, ['bounded-boltzmann+conjugate', 'bounded-self-similar+conjugate', 'box-subset'], 'bounded-boltzmann+conjugate', true, [
      ['number of parts', lengthOf, parts],
      ['smallest part', smallest, fromSurvival(1, survival)],
    ]);
  }
  {
    // Number of 1s of exactly k parts: P(m_1 >= j) = p(n − j, k − j) / p(n, k) (remove j ones).
    const n = 3000;
    const k = 200;
    const rows = exactlyPartsRows(n, k);
    const family = partition({ n, length: k });
    checkTotal(family, rows[k][n]);
    const law = fromSurvival(0, (j) => (j <= k ? rows[k - j][n - j] / rows[k][n] : 0));
    check(family, ['bounded-self-similar+conjugate', 'self-similar+box-filter', 'bounded-boltzmann+conjugate', 'box-subset'], 'bounded-self-similar+conjugate', true, [
      ['multiplicity of 1', multiplicity(1), law],
    ]);
  }
  {
    // The same law at n = 1000 (the shifted box fits the unrestricted table method, n <= 1000).
    const n = 1000;
    const k = 120;
    const rows = exactlyPartsRows(n, k);
    const family = partition({ n, length: k });
    checkTotal(family, rows[k][n]);
    const law = fromSurvival(0, (j) => (j <= k ? rows[k - j][n - j] / rows[k][n] : 0));
    check(family, ['table-recursive+box-filter', 'bounded-boltzmann+conjugate'], 'table-lengths', true, [['multiplicity of 1', multiplicity(1), law]]);
  }
  for (const a of [1, 3]) {
    // k distinct parts >= s: p(n − k(k − 1)/2 − k(s − 1), k) (staircase and s − 1 removed).
    const n = 8000;
    const k = 25;
    const rows = exactlyPartsRows(n, k);
    const count = (s: number) => {
      const m = n - (k * (k - 1)) / 2 - k * (s - 1);
      return m >= k ? rows[k][m] : 0;
    };
    const family = partition({ n, distinct: true, length: k, ...(a > 1 ? { minPart: a } : {}) });
    checkTotal(family, count(a));
    const law = fromSurvival(a, (s) => count(s) / count(a));
    check(family, ['bounded-boltzmann+conjugate', 'box-subset', 'bounded-self-similar+conjugate'], 'bounded-boltzmann+conjugate', true, [['smallest part', smallest, law]], 10_000);
  }
});

describe('finite boxes: box-subset, box-rotation and the box filters', () => {
  {
    const family = partition({ n: 3000, length: 30, maxPart: 200 });
    const laws = knapsackLaws(3000, range(1, 200), false, 30, 30);
    checkTotal(family, laws.total);
    check(family, ['box-subset', 'box-rotation'], 'box-subset', false, [['largest part', largest, laws.largest]]);
  }
  {
    const family = partition({ n: 2000, length: 15, maxPart: 1500 });
    const laws = knapsackLaws(2000, range(1, 1500), false, 15, 15);
    checkTotal(family, laws.total);
    check(family, ['bounded-boltzmann+conjugate+box-filter', 'box-subset'], 'bounded-boltzmann+conjugate+box-filter', false, [['largest part', largest, laws.largest]]);
  }
  {
    const family = partition({ n: 2000, maxLength: 60, maxPart: 400 });
    const laws = knapsackLaws(2000, range(1, 400), false, 1, 60);
    checkTotal(family, laws.total);
    check(family, ['bounded-boltzmann+conjugate+box-filter', 'box-subset'], 'bounded-boltzmann+conjugate+box-filter', false, [
      ['largest part', largest, laws.largest],
      ['number of parts', lengthOf, laws.parts],
    ]);
  }
});

describe('exactly k parts <= b with the part bound binding: bounded-boltzmann+box-filter', () => {
  // P(m_1 >= j) = ways[k − j][n − j] / ways[k][n] (remove j ones), ways from the knapsack over 1..30.
  const n = 3000;
  const k = 600;
  const family = partition({ n, maxPart: 30, length: k });
  const laws = knapsackLaws(n, range(1, 30), false, k, k);
  checkTotal(family, laws.total);
  const ones = fromSurvival(0, (j) => (j <= k ? laws.ways[k - j][n - j] / laws.total : 0));
  check(family, ['bounded-boltzmann+box-filter', 'box-subset'], 'bounded-boltzmann+box-filter', false, [
    ['largest part', largest, laws.largest],
    ['multiplicity of 1', multiplicity(1), ones],
  ]);
});

describe('allowed lists cut by maxPart, with a length constraint', () => {
  {
    const family = partition({ n: 3000, allowed: [1, 2, 5, 10, 20, 50], maxPart: 20, maxLength: 200 });
    const laws = knapsackLaws(3000, [1, 2, 5, 10, 20], false, 1, 200);
    checkTotal(family, laws.total);
    // The largest part is 20 in nearly every member; the number of 1s instead: P(m_1 >= j) =
    // sum over c <= 200 − j of ways[c][n − j] / total (remove j ones).
    const ones = fromSurvival(0, (j) => {
      let sum = 0;
      for (let c = 0; c <= 200 - j; c++) sum += laws.ways[c][3000 - j];
      return sum / laws.total;
    });
    check(family, ['allowed-length-boltzmann'], 'allowed-length-boltzmann', true, [
      ['number of parts', lengthOf, laws.parts],
      ['multiplicity of 1', multiplicity(1), ones],
    ]);
  }
  {
    const odd = Array.from({ length: 60 }, (_, i) => 2 * i + 1);
    const family = partition({ n: 1500, distinct: true, allowed: odd, maxPart: 101, length: 20 });
    const laws = knapsackLaws(1500, odd.filter((v) => v <= 101), true, 20, 20);
    checkTotal(family, laws.total);
    check(family, ['allowed-subset'], 'allowed-subset', true, [['largest part', largest, laws.largest]]);
  }
});

describe('length filters over self-similar methods', () => {
  for (const [K, tableFits] of [
    [1000, false],
    [400, true],
  ] as const) {
    // c parts >= 3: p(n − 2c, c), c <= K.
    const n = 5000;
    const rows = exactlyPartsRows(n, K);
    let total = 0;
    for (let c = 1; c <= K; c++) total += rows[c][n - 2 * c];
    const parts: Law = new Map();
    for (let c = 1; c <= K; c++) if (rows[c][n - 2 * c] > 0) parts.set(c, rows[c][n - 2 * c] / total);
    const family = partition({ n, minPart: 3, maxLength: K });
    checkTotal(family, total);
    check(family, ['minpart-self-similar+length-filter'], 'minpart-self-similar+length-filter', tableFits, [['number of parts', lengthOf, parts]]);
  }
  {
    // c distinct parts >= 3: p(n − 2c − c(c − 1)/2, c), c <= 70.
    const n = 3000;
    const K = 70;
    const rows = exactlyPartsRows(n, K);
    const at = (c: number) => {
      const m = n - 2 * c - (c * (c - 1)) / 2;
      return m >= c ? rows[c][m] : 0;
    };
    let total = 0;
    for (let c = 1; c <= K; c++) total += at(c);
    const parts: Law = new Map();
    for (let c = 1; c <= K; c++) if (at(c) > 0) parts.set(c, at(c) / total);
    const family = partition({ n, distinct: true, minPart: 3, maxLength: K });
    checkTotal(family, total);
    check(family, ['box-mixture', 'distinct-bounded-self-similar+length-filter'], 'box-mixture', true, [['number of parts', lengthOf, parts]]);
  }
});

describe('allowed list: allowed-boltzmann', () => {
  // Coin change over {1, 2, 5, 10, 20, 50}: P(m_50 = j) = c'(n − 50 j) / c(n) with c' without 50;
  // P(m_1 >= j) = c(n − j) / c(n) (remove j ones).
  const n = 3000;
  const sizes = [1, 2, 5, 10, 20, 50];
  const coins = (list: readonly number[]) => {
    const c = new Float64Array(n + 1);
    c[0] = 1;
    for (const s of list) for (let m = s; m <= n; m++) c[m] += c[m - s];
    return c;
  };
  const all = coins(sizes);
  const without50 = coins(sizes.slice(0, -1));
  const family = partition({ n, allowed: sizes });
  checkTotal(family, all[n]);
  const fifties: Law = new Map();
  for (let j = 0; 50 * j <= n; j++) fifties.set(j, without50[n - 50 * j] / all[n]);
  const ones = fromSurvival(0, (j) => (j <= n ? all[n - j] / all[n] : 0));
  check(family, ['allowed-boltzmann'], 'allowed-boltzmann', true, [
    ['multiplicity of 50', multiplicity(50), fifties],
    ['multiplicity of 1', multiplicity(1), ones],
  ]);
});

describe('parts >= a, no upper bound: minpart-self-similar through the planner, and the methods it is preferred to', () => {
  for (const [n, a, methods, tableFits] of [
    [5000, 3, ['minpart-self-similar', 'bounded-boltzmann', 'box-mixture'], false],
    [20_000, 100, ['minpart-self-similar', 'box-mixture'], true],
  ] as const) {
    // c parts >= a: p(n − c(a − 1), c).
    const kMax = Math.floor(n / a);
    const rows = exactlyPartsRows(n, kMax);
    const parts: Law = new Map();
    let total = 0;
    for (let c = 1; c <= kMax; c++) total += rows[c][n - c * (a - 1)];
    for (let c = 1; c <= kMax; c++) if (rows[c][n - c * (a - 1)] > 0) parts.set(c, rows[c][n - c * (a - 1)] / total);
    const family = partition({ n, minPart: a });
    checkTotal(family, total);
    check(family, methods, 'minpart-self-similar', tableFits, [['number of parts', lengthOf, parts]], n > 10_000 ? 10_000 : 20_000);
  }
});

describe('at most K parts in [lo, hi]: conjugate-mixture and box-mixture', () => {
  for (const [K, planned, other] of [
    [100, 'conjugate-mixture', 'box-mixture'],
    [40, 'box-mixture', 'conjugate-mixture'],
  ] as const) {
    const family = partition({ n: 3000, minPart: 3, maxPart: 200, maxLength: K });
    const laws = knapsackLaws(3000, range(3, 200), false, 1, K);
    checkTotal(family, laws.total);
    check(family, [planned, other], planned, false, [
      ['largest part', largest, laws.largest],
      ['number of parts', lengthOf, laws.parts],
    ]);
  }
});

describe('distinct parts with bounds: distinct-boltzmann and box-mixture against the planned distinct-bounded-self-similar', () => {
  for (const a of [1, 5]) {
    const family = partition({ n: 5000, distinct: true, maxPart: 150, ...(a > 1 ? { minPart: a } : {}) });
    const laws = knapsackLaws(5000, range(a, 150), true, 1, 99);
    checkTotal(family, laws.total);
    check(family, ['distinct-bounded-self-similar', 'distinct-boltzmann', 'box-mixture'], 'distinct-bounded-self-similar', true, [
      ['largest part', largest, laws.largest],
      ['number of parts', lengthOf, laws.parts],
    ]);
  }
  {
    // c distinct parts >= 30: p(n − 29 c − c(c − 1)/2, c).
    const n = 20_000;
    const a = 30;
    const kMax = 200;
    const rows = exactlyPartsRows(n, kMax);
    const at = (c: number) => {
      const m = n - (a - 1) * c - (c * (c - 1)) / 2;
      return m >= c ? rows[c][m] : 0;
    };
    let total = 0;
    for (let c = 1; c <= kMax; c++) total += at(c);
    const parts: Law = new Map();
    for (let c = 1; c <= kMax; c++) if (at(c) > 0) parts.set(c, at(c) / total);
    const family = partition({ n, distinct: true, minPart: a });
    checkTotal(family, total);
    check(family, ['distinct-bounded-self-similar', 'distinct-boltzmann', 'box-mixture'], 'distinct-bounded-self-similar', true, [['number of parts', lengthOf, parts]], 10_000);
  }
});
