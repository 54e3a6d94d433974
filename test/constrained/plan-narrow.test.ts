import { describe, expect, it } from 'vitest';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';

// A narrow range of large sizes: bounded-boltzmann's two smallest sizes represent few residuals,
// so most of its proposals are wasted (estimated 1.2e5 and 3.7e6 steps per sample here); the
// union of boxes over the number of parts is estimated far cheaper: box-mixture (now built too
// when every other method's estimate is large, plan.ts) or narrow-range-mixture (one box per
// number of parts, by box-rotation or box-subset), whichever the planner estimates cheaper.
describe('planner: narrow ranges of large parts go to the union of boxes', () => {
  it.each([
    [10_000_000, 10_000, 10_029],
    [100_000_000, 10_000, 10_299],
  ])('n = %d, parts in [%d, %d]: a union of boxes, and its samples are members', (n, minPart, maxPart) => {
    const sampler = constrainedPartitionSampler({ kind: 'partition', n, minPart, maxPart });
    expect(['box-mixture', 'narrow-range-mixture']).toContain(sampler.method.split('/')[0]);
    for (let i = 0; i < 3; i++) {
      const p = sampler.sample(sampleSource('narrow', i, 'test'));
      let total = 0;
      p.sizes.forEach((s, j) => {
        expect(s).toBeGreaterThanOrEqual(minPart);
        expect(s).toBeLessThanOrEqual(maxPart);
        total += s * p.multiplicities[j];
      });
      expect(total).toBe(n);
    }
  });
});
