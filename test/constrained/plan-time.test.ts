import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler, planCandidates, planCostNs } from '../../src/core/partitions/constrained/plan.js';
import { NS_PER_SETUP_UNIT, NS_PER_STEP } from '../../src/core/work-costs.js';

const family = (extra: Omit<PartitionFamily, 'kind'>): PartitionFamily => ({ kind: 'partition', ...extra }) as PartitionFamily;

describe('the constrained planner weighs estimated time, not raw steps', () => {
  it('prices a plan as setup × ns per setup unit + 100 samples × steps × ns per step of its method', () => {
    const c = { method: 'bounded-boltzmann/1+conjugate', setupWork: 10, sampleWork: 1000 };
    expect(planCostNs(c)).toBe(10 * NS_PER_STEP['bounded-boltzmann/1'] + 100 * 1000 * NS_PER_STEP['bounded-boltzmann/1']);
    const t = { method: 'table-sizes/1', setupWork: 1e6, sampleWork: 50 };
    expect(planCostNs(t)).toBe(1e6 * NS_PER_SETUP_UNIT['table-sizes/1'] + 100 * 50 * NS_PER_STEP['table-sizes/1']);
  });

  it('chooses the fitting candidate of least estimated time', () => {
    for (const f of [family({ n: 1e6, minPart: 7 }), family({ n: 1e5, maxLength: 1000 }), family({ n: 3000, allowed: [1, 2, 5, 10, 20, 50] })]) {
      const fitting = planCandidates(f).filter((c) => c.fits);
      const best = fitting.reduce((a, b) => (planCostNs(b) < planCostNs(a) ? b : a));
      expect(constrainedPartitionSampler(f).method).toBe(best.method);
    }
  });

  // Families where counting steps chose a slower method (measured side by side with
  // npm run bench -- shapes): self-similar methods, whose steps are cheap, beat Boltzmann proposals.
  it('picks the self-similar methods where they are faster', () => {
    const root = (n: number) => Math.ceil(Math.sqrt(n));
    expect(constrainedPartitionSampler(family({ n: 1e8, length: Math.ceil(root(1e8) / 4) })).method).toBe('bounded-self-similar/1+conjugate');
    expect(constrainedPartitionSampler(family({ n: 1e8, maxLength: Math.ceil(root(1e8) / 4) })).method).toBe('bounded-self-similar/1+conjugate');
    expect(constrainedPartitionSampler(family({ n: 1e5, minPart: 7 })).method).toBe('minpart-self-similar/1');
    expect(constrainedPartitionSampler(family({ n: 1e6, distinct: true, minPart: 50, maxPart: 5000 })).method).toBe('distinct-bounded-self-similar/1');
  });
});
