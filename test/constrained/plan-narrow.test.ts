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

// Distinct parts in a narrow range: the union of k x (b - a - k + 1) boxes (staircase) is offered
// only where nothing else fits, so the families box-mixture served keep it (and their seeds).
describe('planner: distinct parts in a narrow range of large sizes', () => {
  it('keeps box-mixture where it fits (n = 1e7, parts in [8508, 11830])', () => {
    const sampler = constrainedPartitionSampler({ kind: 'partition', n: 10_000_000, distinct: true, minPart: 8508, maxPart: 11_830 });
    expect(sampler.method).toBe('box-mixture/1');
  });
  it('serves n = 1e9, parts in [85066, 118270] (nothing else fits) by narrow-range-mixture', () => {
    const n = 1_000_000_000;
    const sampler = constrainedPartitionSampler({ kind: 'partition', n, distinct: true, minPart: 85_066, maxPart: 118_270 });
    expect(sampler.method).toBe('narrow-range-mixture/1');
    const p = sampler.sample(sampleSource('narrow-distinct', 0, 'test'));
    let total = 0;
    p.sizes.forEach((s, j) => {
      expect(p.multiplicities[j]).toBe(1);
      expect(s).toBeGreaterThanOrEqual(85_066);
      expect(s).toBeLessThanOrEqual(118_270);
      if (j > 0) expect(s).toBeLessThan(p.sizes[j - 1]);
      total += s;
    });
    expect(total).toBe(n);
  });
});
