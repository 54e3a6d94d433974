import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { LengthFamilyTable } from './length-table.js';
import { SizeLengthTable } from './size-length-table.js';
import { countsToPartition, SizeTable } from './size-table.js';

/**
 * PartitionSamplers over the three counting tables (exact recursive method, Nijenhuis & Wilf
 * 1978, ch. 10). Each exposes `total`, the family's size as a double (0: empty family), and
 * `setupWork`, the table cells it filled.
 */
export interface TableSampler extends PartitionSampler {
  readonly total: number;
  readonly setupWork: number;
}

interface Shape {
  readonly expectedLength: number;
  readonly expectedDistinct: number;
}

/** "table-sizes/1": product-form families (allowed sizes or bounds, distinct or not), no length. */
export function sizeTableSampler(sizes: readonly number[], n: number, distinct: boolean, shape: Shape): TableSampler {
  const table = new SizeTable(sizes, n, distinct);
  return {
    method: 'table-sizes/1',
    total: table.total,
    setupWork: (sizes.length + 1) * (n + 1),
    expectedLength: shape.expectedLength,
    expectedDistinct: shape.expectedDistinct,
    expectedWork: sizes.length + shape.expectedLength,
    sample: (source: RandomSource): Partition => countsToPartition(table.sampleCounts(source)),
  };
}

/** "table-lengths/1": parts >= lo with no upper bound; distinct and/or length constraints. */
export function lengthTableSampler(
  n: number,
  lo: number,
  distinct: boolean,
  kMin: number,
  kMax: number,
  shape: Shape,
): TableSampler {
  const table = new LengthFamilyTable(n, lo, distinct, kMin, kMax);
  const k = Math.max(1, shape.expectedLength);
  return {
    method: 'table-lengths/1',
    total: table.total,
    setupWork: LengthFamilyTable.cells(n, lo, distinct, kMin, kMax),
    expectedLength: shape.expectedLength,
    expectedDistinct: shape.expectedDistinct,
    // k parts plus one step per unit of the largest reduced part (at most n / k on average).
    expectedWork: kMax - kMin + 1 + k + n / k,
    sample: (source) => table.sample(source),
  };
}

/** "table-sizes-lengths/1": the general table, for any combination with a length constraint. */
export function sizeLengthTableSampler(
  sizes: readonly number[],
  n: number,
  distinct: boolean,
  minLength: number,
  maxLength: number,
  shape: Shape,
): TableSampler {
  const table = new SizeLengthTable(sizes, n, distinct, minLength, maxLength);
  return {
    method: 'table-sizes-lengths/1',
    total: table.total,
    setupWork: SizeLengthTable.cells(sizes.length, n, maxLength),
    expectedLength: shape.expectedLength,
    expectedDistinct: shape.expectedDistinct,
    expectedWork: maxLength + sizes.length + shape.expectedLength,
    sample: (source) => table.sample(source),
  };
}
