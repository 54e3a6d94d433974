import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

/**
 * Exact uniformity of the planner's choice (the counting-table methods at these sizes) over
 * every family member, enumerated by brute force. Pearson chi-square, fixed seeds, each test
 * rejects a correct sampler with probability alpha = 1e-4 (project convention).
 */
const ALPHA = 1e-4;

const families: Array<[string, PartitionFamily]> = [
  ['distinct parts', { kind: 'partition', n: 30, distinct: true }],
  ['parts <= 4', { kind: 'partition', n: 22, maxPart: 4 }],
  ['parts >= 3', { kind: 'partition', n: 30, minPart: 3 }],
  ['exactly 4 parts', { kind: 'partition', n: 24, length: 4 }],
  ['at most 3 parts', { kind: 'partition', n: 25, maxLength: 3 }],
  ['parts in {1, 2, 5, 10}', { kind: 'partition', n: 30, allowed: [1, 2, 5, 10] }],
  // Combinations.
  ['distinct with maxPart', { kind: 'partition', n: 30, distinct: true, maxPart: 10 }],
  ['length with minPart', { kind: 'partition', n: 35, length: 4, minPart: 3 }],
  ['allowed with maxLength', { kind: 'partition', n: 30, allowed: [1, 3, 4, 7], maxLength: 10 }],
  ['distinct, exactly 3 parts, minPart 2', { kind: 'partition', n: 30, distinct: true, length: 3, minPart: 2 }],
  ['distinct, at most 3 parts', { kind: 'partition', n: 28, distinct: true, maxLength: 3 }],
  ['minPart, maxPart, maxLength', { kind: 'partition', n: 30, minPart: 2, maxPart: 9, maxLength: 5 }],
  ['distinct, allowed, exactly 4 parts', { kind: 'partition', n: 40, distinct: true, allowed: [1, 2, 4, 6, 7, 9, 11, 12, 15, 17, 20, 23], length: 4 }],
];

describe('constrained sampling is uniform (planner choice)', () => {
  for (const [name, family] of families) {
    it(name, () => {
      const sampler = constrainedPartitionSampler(family);
      const result = chiSquareUniform(family, sampler, `uniform-${name.replace(/[^a-z0-9]/gi, '-')}`);
      expect(result.members).toBeGreaterThan(5);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});
