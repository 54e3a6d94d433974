import type { PartitionFamily } from '../../src/core/family.js';
import { mostParts } from '../../src/core/partitions/constrained/plan-length.js';
import { toSpec } from '../../src/core/partitions/constrained/spec.js';

/**
 * Coverage of the exactness tests of the partition samplers, by (method, constraint shape).
 *
 * Shapes: D distinct, a minPart >= 2, b maxPart < n, k length (exactly k parts), K maxLength that
 * binds (below the most parts a member can have; a looser one is planned as no length
 * constraint), L allowed list; "none" is the plain family. Methods are the planner's ids without
 * versions; "X+conjugate", "X+box-filter", "X+length-filter" are wrappers planned as their own
 * methods (plan-length.ts).
 *
 * SMALL n: a chi-square against uniform over the enumerated family, the method forced through
 * constrainedPartitionSampler(family, { method }) ("f"), or the planner's own choice ("p", the
 * tables), or the sampler built directly ("d", not counted as forced). "+" marks the pairs added by
 * test/constrained/method-coverage.test.ts (all forced).
 *
 * | method                                 | small n: before (file)                                                 | added (+)            |
 * |----------------------------------------|------------------------------------------------------------------------|----------------------|
 * | allowed-boltzmann                      | L f (uniformity-boltzmann)                                             | aL bL abL            |
 * | allowed-length-boltzmann               | kL KL akL f (uniformity-length); kL KL d (allowed-length-triple)       | aKL abKL abkL bKL bkL|
 * | allowed-subset                         | DkL f (uniformity-length)                                              | DakL DbkL DabkL      |
 * | bounded-boltzmann                      | a b ab f (uniformity-boltzmann)                                        | none                 |
 * | bounded-boltzmann+conjugate            | K ak Dk f (uniformity-boltzmann)                                       | k Dak                |
 * | bounded-boltzmann+box-filter           | bK f (uniformity-length)                                               | bk abk               |
 * | bounded-boltzmann+conjugate+box-filter | bK f (uniformity-length)                                               | bk abk Dbk Dabk      |
 * | bounded-self-similar                   | b ab f, d (partitions/bounded-self-similar)                            |                      |
 * | bounded-self-similar+conjugate         | K k ak f (partitions/bounded-self-similar)                             | Dk Dak               |
 * | box-mixture                            | DK DbK aK abK DabK Da a f (uniformity-length); Db abK d (walk)         | D Db Dab ab DaK      |
 * | box-rotation                           | bk abk Dbk bK f (box-rotation)                                         | Dabk                 |
 * | box-subset                             | k bk abk Dbk Dak bK f (uniformity-length)                              | K ak Dk Dabk         |
 * | conjugate-mixture                      | aK abK f (conjugate-mixture)                                           |                      |
 * | distinct-boltzmann                     | Da f (uniformity-boltzmann); DL f (distinct-allowed); D Db Dab DL d    | D Db Dab DaL DbL DabL|
 * | distinct-bounded-self-similar          | Da Db Dab f (partitions/distinct-bounded-self-similar)                 |                      |
 * | distinct-self-similar                  | D f (partitions/distinct-self-similar)                                 |                      |
 * | minpart-self-similar                   | a f (partitions/min-part-self-similar)                                 |                      |
 * | narrow-range-mixture                   | ab f (narrow-range-mixture)                                            |                      |
 * | table-sizes                            | D Db a b L p (uniformity-tables)                                       | 11 shapes (CASES)    |
 * | table-lengths                          | k ak Dak p (uniformity-tables)                                         | 8 shapes             |
 * | table-sizes-lengths                    | K DK abK KL DkL p (uniformity-tables)                                  | 27 shapes (with DKL) |
 * | table-sizes+length-filter              | DK f (uniformity-length)                                               | 16 shapes            |
 * | table-recursive+box-filter             | k f (uniformity-length)                                                | 9 shapes             |
 * | single-member, trivial                 | one member (n = 0, one size, edge subsets): nothing to test by chi-square                |
 * | unrestricted planner: table-recursive  | p (partitions/uniformity); self-similar: d with table bases 0, 4 (uniformity-recursive)  |
 *
 * MID-SIZE (exact law of a statistic from counts, sizes where tables still fit or counting
 * works but the planner takes the method; "v" test/verify/*.verify.ts, "t" an npm-test file):
 * before: box-subset bk bK, box-rotation bK, box-mixture DK aK abK DabK, table-lengths aK,
 * conjugate-mixture aK (v length, t conjugate-mixture), distinct-self-similar+length-filter DK,
 * allowed-length-boltzmann kL KL, allowed-subset DkL (v length, allowed-length); bounded-boltzmann b,
 * distinct-boltzmann D (mean only) (v constrained); distinct-boltzmann DL (t distinct-allowed);
 * bounded-self-similar b ab, +conjugate K (v bounded-laws); distinct-bounded-self-similar Da Db Dab
 * (t and v distinct-bounded*, distinct-large-min*); distinct-self-similar D (v distinct-laws);
 * minpart-self-similar a (v min-part-laws, sampler built directly); narrow-range-mixture ab
 * (t narrow-range-mixture); unrestricted table-recursive and self-similar (t exact-laws,
 * v unrestricted-laws).
 * added by test/verify/method-laws.verify.ts: see its header.
 */

export type Case = [method: string, shape: string, family: Omit<PartitionFamily, 'kind'>];

/** Allowed lists of the cases: consecutive sizes, and sizes with gaps (so that bounds cut them). */
export const ONE_TO_14: readonly number[] = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14];
export const GAPPY: readonly number[] = [1, 2, 4, 5, 7, 9, 10, 12, 13, 15, 16, 18, 20];

/** The (method, shape) pairs forced at small n by the other test files (the table above, "f" and "p"). */
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
