import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import {
  constrainedPartitionSampler,
  planCandidates,
  planCostNs,
  SAMPLE_WORK_LIMIT,
  TABLE_CELL_LIMIT,
} from '../../src/core/partitions/constrained/plan.js';

const family = (n: number, extra: Partial<PartitionFamily> = {}): PartitionFamily => ({ kind: 'partition', n, distinct: true, ...extra });

describe('planning plain distinct parts', () => {
  it('distinct-self-similar costs less than distinct-boltzmann wherever both are listed (so the latter is skipped)', () => {
    for (const n of [2000, 2600, 5000, 20_000, 300_000, 1e6, 1e7]) {
      const all = planCandidates(family(n), true);
      const self = all.find((c) => c.method === 'distinct-self-similar/1')!;
      const db = all.find((c) => c.method === 'distinct-boltzmann/1')!;
      expect(self.fits).toBe(true);
      expect(planCostNs(self), `n = ${n}`).toBeLessThan(planCostNs(db));
    }
  });

  // Below n ~ 7000 the table is estimated faster for a request (its cells ~12 ns each against
  // distinct-self-similar's per-process tables, ~10 ms estimated; 31 ms measured cold at n = 3000).
  it('chooses distinct-self-similar from n ~ 7000 to 1e9, within the work limits', () => {
    for (const n of [2000, 3000, 5000]) expect(constrainedPartitionSampler(family(n)).method, `n = ${n}`).toBe('table-lengths/1');
    for (const n of [1e4, 1e5, 1e8, 1e9]) {
      const candidates = planCandidates(family(n));
      const chosen = constrainedPartitionSampler(family(n));
      expect(chosen.method).toBe('distinct-self-similar/1');
      const self = candidates.find((c) => c.method === 'distinct-self-similar/1')!;
      expect(self.sampleWork).toBeLessThan(SAMPLE_WORK_LIMIT);
      expect(self.setupWork).toBeLessThan(TABLE_CELL_LIMIT);
    }
  });

  it('keeps bounded distinct families on their own methods', () => {
    expect(planCandidates(family(1e6, { maxPart: 1e5 })).some((c) => c.method === 'distinct-self-similar/1')).toBe(false);
    expect(planCandidates(family(1e6, { minPart: 2 })).some((c) => c.method === 'distinct-self-similar/1')).toBe(false);
    expect(planCandidates(family(1e6, { maxLength: 100 }), true).some((c) => c.method === 'distinct-self-similar/1')).toBe(false);
  });

  it('refuses distinct minPart above 5000 at n = 1e9 with what would fit, naming no method', () => {
    let message = '';
    try {
      constrainedPartitionSampler(family(1e9, { minPart: 8000 }));
    } catch (error) {
      message = (error as Error).message;
    }
    expect(message).toContain('minPart up to 5000 fits');
    expect(message).not.toMatch(/self-similar|boltzmann|mixture|\/1/);
  });

  it('leaves distinct-boltzmann out from n = 1e7 where the bounded self-similar method serves (estimated >= 8x dearer)', () => {
    for (const [n, minPart] of [[1e7, 30], [1e8, 300], [1e9, 3000]]) {
      const all = planCandidates(family(n, { minPart }), true);
      const selfSimilar = all.find((c) => c.method.startsWith('distinct-bounded-self-similar'))!;
      const boltzmann = all.find((c) => c.method.startsWith('distinct-boltzmann'))!;
      expect(planCostNs(boltzmann), `n=${n}`).toBeGreaterThan(8 * planCostNs(selfSimilar));
      expect(planCandidates(family(n, { minPart })).some((c) => c.method.startsWith('distinct-boltzmann'))).toBe(false);
    }
  });
});
