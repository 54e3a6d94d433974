import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { minPartSaddle } from '../../src/core/counting/log-min-part-count.js';
import { MinPartTable } from '../../src/core/partitions/min-part-table.js';
import {
  MinPartSelfSimilarEngine,
  MinPartSelfSimilarSampler,
  MinPartSelfSimilarTables,
} from '../../src/core/partitions/min-part-self-similar.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';
import { assertValidPartition } from '../support/partition-checks.js';

const ALPHA = 1e-4; // false-alarm probability per statistical check (project convention)
const tables = new MinPartSelfSimilarTables(60);

describe('min-part table', () => {
  it('counts partitions into parts >= k (OEIS A002865 for k = 2)', () => {
    const t = new MinPartTable(12);
    expect([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10].map((m) => t.count(2, m))).toEqual([1, 0, 1, 1, 2, 2, 4, 4, 7, 8, 12]);
    expect(t.count(1, 12)).toBe(77); // p(12), A000041
    expect(t.count(13, 0)).toBe(1);
    expect(t.count(13, 5)).toBe(0);
  });
});

describe('min-part-self-similar internals', () => {
  it('finds the exact argmax of c(m)·x^{2m} over 0 <= m <= n/2', () => {
    const engine = new MinPartSelfSimilarEngine({ baseThreshold: 0, tables });
    for (const b of [2, 3, 4, 7, 20]) {
      const counts = tables.countsFor(Math.ceil(b / 2));
      for (let n = 1; n <= 3000; n += n < 200 ? 1 : 53) {
        const logX = -minPartSaddle(b, n);
        let best = 0;
        for (let m = 1; m <= Math.floor(n / 2); m++) if (counts.logRatio(m, best) + 2 * (m - best) * logX > 0) best = m;
        expect(engine.maximiser(counts, n, logX), `b ${b} n ${n}`).toBe(best);
      }
      for (const n of [1e5, 1e7, 1e9]) {
        const logX = -minPartSaddle(b, n);
        const m = engine.maximiser(counts, n, logX);
        const f = (k: number) => counts.logRatio(k, m) + 2 * (k - m) * logX;
        expect(f(m - 1)).toBeLessThanOrEqual(0);
        expect(f(m + 1)).toBeLessThanOrEqual(0);
      }
    }
  });

  it('returns valid partitions into parts >= a at large n', () => {
    for (const [n, a] of [
      [1e6, 2],
      [1e6, 7],
      [3e6, 100],
      [95_488_108, 481],
    ]) {
      const sampler = new MinPartSelfSimilarSampler(n, a);
      for (let i = 0; i < 2; i++) {
        const p = sampler.sample(sampleSource('mpss-valid', i, `${n}-${a}`));
        assertValidPartition(p, n);
        expect(Math.min(...p.sizes)).toBeGreaterThanOrEqual(a);
      }
    }
  });
});

describe('min-part-self-similar is exactly uniform (chi-square over the enumerated family)', () => {
  // Base thresholds put the table's hand-over at different levels (0: down to m = 0 or b = 1).
  const cases: Array<[number, number, number]> = [
    [32, 2, 0],
    [40, 3, 0],
    [44, 4, 3],
    [50, 5, 5],
    [56, 7, 0],
    [48, 9, 2],
    [36, 3, 60],
  ];
  for (const [n, a, base] of cases) {
    it(`n = ${n}, minPart ${a}, base threshold ${base}`, () => {
      const family: PartitionFamily = { kind: 'partition', n, minPart: a };
      const sampler = new MinPartSelfSimilarSampler(n, a, tables, base);
      const result = chiSquareUniform(family, sampler, `mpss-${n}-${a}-${base}`);
      expect(result.members).toBeGreaterThan(100);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});

describe('min-part-self-similar through the planner', () => {
  it('is exactly uniform with the method forced (chi-square)', async () => {
    const { constrainedPartitionSampler } = await import('../../src/core/partitions/constrained/plan.js');
    const family: PartitionFamily = { kind: 'partition', n: 46, minPart: 3 };
    const sampler = constrainedPartitionSampler(family, { method: 'minpart-self-similar' });
    expect(sampler.method).toBe('minpart-self-similar/1');
    const result = chiSquareUniform(family, sampler, 'mpss-plan');
    expect(result.strangers).toBe(0);
    expect(result.pValue).toBeGreaterThan(ALPHA);
  });

  it('serves the families the other methods refused (n = 1e9 with minPart 2 and 100; 95,488,108 with 481)', async () => {
    const { constrainedPartitionSampler } = await import('../../src/core/partitions/constrained/plan.js');
    for (const [n, a] of [
      [1e9, 2],
      [1e9, 100],
      [95_488_108, 481],
    ]) {
      const sampler = constrainedPartitionSampler({ kind: 'partition', n, minPart: a });
      expect(sampler.method).toBe('minpart-self-similar/1');
    }
  });
});
