import { describe, expect, it } from 'vitest';
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import { DivideAndConquerSampler } from '../../src/core/partitions/divide-and-conquer.js';
import { SelfSimilarSampler } from '../../src/core/partitions/self-similar.js';
import { RestrictedPartitionTable, TableRecursiveSampler } from '../../src/core/partitions/table-recursive.js';
import { sampleSource } from '../../src/core/seeding.js';
import { PARTITION_NUMBERS as P, UNIFORMITY_ALPHA as ALPHA, UNIFORMITY_SAMPLES as SAMPLES, uniformityPValue } from '../support/partition-checks.js';

const table = new RestrictedPartitionTable();
const logP = new LogPartitionNumbers();

const methods: Array<[string, (n: number) => { sample: (s: ReturnType<typeof sampleSource>) => ReturnType<TableRecursiveSampler['sample']> }]> = [
  ['divide-and-conquer', (n) => new DivideAndConquerSampler(n)],
  // Base threshold 0: every level down to m = 0 goes through the odd-size proposal and the
  // p(m)x^{2m} acceptance, so the recursion itself is what is tested at these small n.
  ['self-similar (no table base)', (n) => new SelfSimilarSampler(n, { baseThreshold: 0, table, logP })],
  ['self-similar (base 4)', (n) => new SelfSimilarSampler(n, { baseThreshold: 4, table, logP })],
];

describe.each(methods)('uniformity of %s', (name, make) => {
  it.each([10, 12, 15])('over all partitions of %i', (n) => {
    const sampler = make(n);
    const source = sampleSource(`chi-${name.replace(/[^a-z]/g, '')}-${n}`, 0, 'test');
    const { pValue, cells } = uniformityPValue(n, SAMPLES, source, (s) => sampler.sample(s));
    expect(cells).toBe(P.get(n));
    expect(pValue).toBeGreaterThan(ALPHA);
  });
});
