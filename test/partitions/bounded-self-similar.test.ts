import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { BoundedSelfSimilarSampler } from '../../src/core/partitions/bounded-self-similar.js';
import { MinPartSelfSimilarTables } from '../../src/core/partitions/min-part-self-similar.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';

const ALPHA = 1e-4; // false-alarm probability per statistical check (project convention)
const tables = new MinPartSelfSimilarTables(60);

describe('bounded-self-similar is exactly uniform (chi-square over the enumerated family)', () => {
  // [n, a, b, base threshold]: base 0 runs every level through the proposals down to m = 0.
  const cases: Array<[number, number, number, number]> = [
    [30, 1, 6, 0],
    [34, 1, 9, 0],
    [40, 1, 7, 3],
    [36, 2, 8, 0],
    [44, 3, 12, 0],
    [50, 7, 20, 0],
    [40, 2, 5, 5],
    [33, 1, 33, 0],
  ];
  for (const [n, a, b, base] of cases) {
    it(`n = ${n}, parts in [${a}, ${b}], base threshold ${base}`, () => {
      const family: PartitionFamily = { kind: 'partition', n, minPart: a, maxPart: b };
      const sampler = new BoundedSelfSimilarSampler(n, a, b, tables, base);
      const result = chiSquareUniform(family, sampler, `bss-${n}-${a}-${b}-${base}`);
      expect(result.members).toBeGreaterThan(50);
      expect(result.strangers).toBe(0);
      expect(result.pValue).toBeGreaterThan(ALPHA);
    });
  }
});
