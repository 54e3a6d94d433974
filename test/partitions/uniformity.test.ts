import { describe, expect, it } from 'vitest';
import { RestrictedPartitionTable, TableRecursiveSampler } from '../../src/core/partitions/table-recursive.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';
import { enumeratePartitions } from '../support/enumerate-partitions.js';
import { PARTITION_NUMBERS as P, UNIFORMITY_ALPHA as ALPHA, UNIFORMITY_SAMPLES as SAMPLES, uniformityPValue } from '../support/partition-checks.js';

const table = new RestrictedPartitionTable();

const methods: Array<[string, (n: number) => { sample: (s: ReturnType<typeof sampleSource>) => ReturnType<TableRecursiveSampler['sample']> }]> = [
  ['planner', (n) => unrestrictedPartitionSampler(n)],
  ['table-recursive', (n) => new TableRecursiveSampler(n, table)],
];

describe('enumeration helper', () => {
  it('lists p(n) distinct partitions (OEIS A000041)', () => {
    for (const [n, count] of P) {
      const all = enumeratePartitions(n);
      expect(all.length).toBe(count);
      expect(new Set(all.map((p) => p.join(','))).size).toBe(count);
    }
  });
});

describe.each(methods)('uniformity of %s', (name, make) => {
  it.each([10, 12, 15])('over all partitions of %i', (n) => {
    const sampler = make(n);
    const source = sampleSource(`chi-${name.replace(/[^a-z]/g, '')}-${n}`, 0, 'test');
    const { pValue, cells } = uniformityPValue(n, SAMPLES, source, (s) => sampler.sample(s));
    expect(cells).toBe(P.get(n));
    expect(pValue).toBeGreaterThan(ALPHA);
  });
});

describe('uniformity of table-recursive with multiplicities up to 10 (n = 20)', () => {
  // The table method draws each distinct size's multiplicity at once; n = 20 has 1^20, 2^10, 3^6, ...
  it('over all 627 partitions of 20 (about 160 samples per partition)', () => {
    const sampler = new TableRecursiveSampler(20, table);
    const { pValue, cells } = uniformityPValue(20, SAMPLES, sampleSource('chi-table-20', 0, 'test'), (s) => sampler.sample(s));
    expect(cells).toBe(P.get(20));
    expect(pValue).toBeGreaterThan(ALPHA);
  });
});
