import { expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { chiSquareUniform } from './chi-square-uniform.js';
import { shapeOf, type Case } from './method-coverage-table.js';

/** Each chi-square rejects an exact sampler with probability 1e-4 (project convention). */
export const ALPHA = 1e-4;

/**
 * One test per case: the family has the stated shape, the forced method is built, and Pearson's
 * chi-square against uniform over the enumerated family (25 samples per member, fixed seed) passes.
 */
export function checkForced(cases: readonly Case[]): void {
  for (const [method, shape, spec] of cases) {
    it(`${method}, ${shape}: ${JSON.stringify(spec)}`, () => {
      const family = { kind: 'partition', ...spec } as PartitionFamily;
      expect(shapeOf(family)).toBe(shape);
      const sampler = constrainedPartitionSampler(family, { method });
      expect(sampler.method.replace(/\/\d+/g, '')).toBe(method);
      const result = chiSquareUniform(family, sampler, `cov-${method}-${shape}`.replace(/\+/g, '.'));
      expect(result.members).toBeGreaterThanOrEqual(20);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
}
