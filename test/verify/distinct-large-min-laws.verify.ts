import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { exactPartCountLaw, pooled } from '../support/distinct-part-count-law.js';
import { assertValidPartition } from '../support/partition-checks.js';

// minPart above 200 (the range opened by DistinctBoundedSelfSimilarSampler.serves): the number of
// parts against its exact law (doubles by number of parts, test/support/distinct-part-count-law.ts)
// at sizes where the levels' counts come from the saddle-point integral with the parts below b'
// through the log cosh series (b' = 250, 450: above their tables, m ~ n/4), and for b' = 450 the
// maximiser bounded without building the table (logConcaveFrom = exactUpTo + 1). Pearson
// chi-square on the pooled law; false-alarm probability 1e-4 per test.
const ALPHA = 1e-4;

const cases: Array<[number, number, number]> = [
  [150_000, 500, 20_000],
  [250_000, 900, 20_000],
];

describe('distinct parts >= a, a > 200: the number of parts has its exact law', () => {
  for (const [n, a, samples] of cases) {
    it(`n = ${n}, parts >= ${a} (${samples} samples)`, () => {
      const family: PartitionFamily = { kind: 'partition', n, distinct: true, minPart: a };
      const sampler = constrainedPartitionSampler(family, { method: 'distinct-bounded-self-similar' });
      expect(sampler.method).toBe('distinct-bounded-self-similar/1');
      const law = exactPartCountLaw(n, a);
      const observed = new Array<number>(law.length).fill(0);
      for (let i = 0; i < samples; i++) {
        const p = sampler.sample(sampleSource('dlm-law', i, `${n}-${a}`));
        if (i < 3) assertValidPartition(p, n);
        observed[p.sizes.length]++;
      }
      const pool = pooled(observed, law, samples);
      expect(pool.observed.length).toBeGreaterThan(10);
      expect(chiSquareTest(pool.observed, pool.probabilities).pValue).toBeGreaterThan(ALPHA);
    });
  }
});
