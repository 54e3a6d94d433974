import type { PartitionFamily } from '../../src/core/family.js';
import { mostParts } from '../../src/core/partitions/constrained/plan-length.js';
import { toSpec } from '../../src/core/partitions/constrained/spec.js';

/**
 * Data of the coverage table at the top of test/constrained/method-coverage.test.ts: the shape
 * letters, the lists of the cases, and the pairs other files force.
 */

export type Case = [method: string, shape: string, family: Omit<PartitionFamily, 'kind'>];

/** Allowed lists of the cases: consecutive sizes, and sizes with gaps (so that bounds cut them). */
export const ONE_TO_14: readonly number[] = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14];
export const GAPPY: readonly number[] = [1, 2, 4, 5, 7, 9, 10, 12, 13, 15, 16, 18, 20];

/** The (method, shape) pairs forced at small n by the other test files (the "f" and "p" entries of the table in method-coverage.test.ts). */
export const COVERED_ELSEWHERE: ReadonlyArray<[string, string]> = [
  ['allowed-boltzmann', 'L'],
  ['allowed-length-boltzmann', 'kL'],
  ['allowed-length-boltzmann', 'KL'],
  ['allowed-length-boltzmann', 'akL'],
  ['allowed-subset', 'DkL'],
  ['bounded-boltzmann', 'a'],
  ['bounded-boltzmann', 'b'],
  ['bounded-boltzmann', 'ab'],
  ['bounded-boltzmann+conjugate', 'K'],
  ['bounded-boltzmann+conjugate', 'ak'],
  ['bounded-boltzmann+conjugate', 'Dk'],
  ['bounded-boltzmann+box-filter', 'bK'],
  ['bounded-boltzmann+conjugate+box-filter', 'bK'],
  ['bounded-self-similar', 'b'],
  ['bounded-self-similar', 'ab'],
  ['bounded-self-similar+conjugate', 'K'],
  ['bounded-self-similar+conjugate', 'k'],
  ['bounded-self-similar+conjugate', 'ak'],
  ...['DK', 'DbK', 'aK', 'abK', 'DabK', 'Da', 'a'].map((s): [string, string] => ['box-mixture', s]),
  ...['bk', 'abk', 'Dbk', 'bK'].map((s): [string, string] => ['box-rotation', s]),
  ...['k', 'bk', 'abk', 'Dbk', 'Dak', 'bK'].map((s): [string, string] => ['box-subset', s]),
  ['conjugate-mixture', 'aK'],
  ['conjugate-mixture', 'abK'],
  ['distinct-boltzmann', 'Da'],
  ['distinct-boltzmann', 'DL'],
  ['distinct-bounded-self-similar', 'Da'],
  ['distinct-bounded-self-similar', 'Db'],
  ['distinct-bounded-self-similar', 'Dab'],
  ['distinct-self-similar', 'D'],
  ['minpart-self-similar', 'a'],
  ['narrow-range-mixture', 'ab'],
  ['narrow-range-mixture', 'Dab'],
  ...['D', 'Db', 'a', 'b', 'L'].map((s): [string, string] => ['table-sizes', s]),
  ...['k', 'ak', 'Dak'].map((s): [string, string] => ['table-lengths', s]),
  ...['K', 'DK', 'abK', 'KL', 'DkL'].map((s): [string, string] => ['table-sizes-lengths', s]),
  ['table-sizes+length-filter', 'DK'],
  ['table-recursive+box-filter', 'k'],
];

/** The shape of a family in the letters above. */
export function shapeOf(family: PartitionFamily): string {
  const s: string[] = [];
  if (family.distinct) s.push('D');
  if (family.minPart !== undefined && family.minPart > 1) s.push('a');
  if (family.maxPart !== undefined && family.maxPart < family.n) s.push('b');
  if (family.length !== undefined) s.push('k');
  if (family.maxLength !== undefined && family.maxLength < mostParts(toSpec(family))) s.push('K');
  if (family.allowed !== undefined) s.push('L');
  return s.join('') || 'none';
}
