import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import {
  constrainedPartitionSampler,
  NOMINAL_SAMPLES,
  planCandidates,
  SAMPLE_WORK_LIMIT,
  TABLE_CELL_LIMIT,
  type PlanCandidate,
} from '../../src/core/partitions/constrained/plan.js';

const cost = (c: PlanCandidate): number => c.setupWork + NOMINAL_SAMPLES * c.sampleWork;
const family = (n: number, extra: Partial<PartitionFamily> = {}): PartitionFamily => ({ kind: 'partition', n, distinct: true, ...extra });

describe('planning plain distinct parts', () => {
  it('distinct-self-similar costs less than distinct-boltzmann wherever both are listed (so the latter is skipped)', () => {
    for (const n of [2000, 2600, 5000, 20_000, 300_000, 1e6, 1e7]) {
      const all = planCandidates(family(n), true);
      const self = all.find((c) => c.method === 'distinct-self-similar/1')!;
      const db = all.find((c) => c.method === 'distinct-boltzmann/1')!;
      expect(self.fits).toBe(true);
      expect(cost(self), `n = ${n}`).toBeLessThan(cost(db));
    }
  });

  it('chooses distinct-self-similar from n ~ 2500 to 1e9, within the work limits', () => {
    expect(constrainedPartitionSampler(family(2000)).method).toBe('table-lengths/1');
    for (const n of [3000, 1e5, 1e8, 1e9]) {
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
});
