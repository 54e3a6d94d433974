import { describe, expect, it } from 'vitest';
import type { PartitionFamily } from '../../src/core/family.js';
import { planCandidates } from '../../src/core/partitions/constrained/plan.js';
import { METHOD_CASES, TABLE_CASES } from '../support/method-coverage-cases.js';
import { checkForced } from '../support/method-coverage-check.js';
import { COVERED_ELSEWHERE, GAPPY, ONE_TO_14, shapeOf } from '../support/method-coverage-table.js';

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
 * | table-sizes                            | D Db a b L p (uniformity-tables)                                       | 11 shapes            |
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
 * added by test/verify/method-laws.verify.ts (forced, at sizes where the planner takes the first
 * method named for that family): bounded-boltzmann+conjugate k K Dk Dak, bounded-self-similar+conjugate
 * k K Dk Dak, box-subset k K Dk Dak bk bK, box-rotation bk, self-similar+box-filter k,
 * table-recursive+box-filter k, bounded-boltzmann+box-filter bk, bounded-boltzmann+conjugate+box-filter
 * bk bK, allowed-boltzmann L, allowed-length-boltzmann bKL, allowed-subset DbkL, minpart-self-similar a
 * (planner), minpart-self-similar+length-filter aK, bounded-boltzmann a, box-mixture a abK DaK Da Db Dab,
 * conjugate-mixture abK, distinct-boltzmann Da Db Dab, distinct-bounded-self-similar Da Db Dab and
 * +length-filter DaK.
 * Still without a mid-size law (their small-n chi-squares are here or in the files above): the
 * table methods (the exact reference at those sizes), table-sizes+length-filter, box-rotation Dbk
 * Dabk, box-mixture D DbK ab, allowed-length-boltzmann aKL abKL abkL bkL, allowed-subset DakL DabkL,
 * allowed-boltzmann aL bL abL, distinct-boltzmann DaL DbL DabL.
 */

/**
 * Exactness of every (method, constraint shape) pair the constrained planner can build, forced
 * through its `method` option at small n: Pearson chi-square against uniform over the family,
 * enumerated by brute force (test/support/enumerate-constrained.ts, independent of the library's
 * counting code), 25 samples per member, fixed seeds.
 *
 * The coverage table below says which file holds the pairs this file does not repeat (their list is
 * COVERED_ELSEWHERE in test/support/method-coverage-table.ts). This file adds the pairs no other
 * file had; the last test checks that every pair the planner offers over a grid of small families
 * is covered, so a new method or shape fails it until it has a case.
 *
 * The cases are in test/support/method-coverage-cases.ts: METHOD_CASES run here (38),
 * TABLE_CASES (counting tables and the filters over them, 71) in method-coverage-tables.test.ts.
 *
 * False alarms: each chi-square rejects an exact sampler with probability alpha = 1e-4 (project
 * convention); with the 109 cases of the two files the family-wise false-alarm probability is at
 * most 109 x 1e-4 (~1%).
 */
const bare = (id: string) => id.replace(/\/\d+/g, '');

describe('each (method, shape) pair the other files did not force is exact (chi-square over the enumerated family)', () => {
  checkForced(METHOD_CASES);
});

describe('coverage table', () => {
  it('every pair the planner offers on a grid of small families has a forced chi-square (here or in another file)', () => {
    const covered = new Set([...COVERED_ELSEWHERE.map(([m, s]) => `${m} ${s}`), ...[...METHOD_CASES, ...TABLE_CASES].map(([m, s]) => `${m} ${s}`)]);
    const offered = new Set<string>();
    const lists = [GAPPY, ONE_TO_14, [1, 2, 5, 10]];
    for (const n of [18, 26, 34]) {
      for (let mask = 0; mask < 64; mask++) {
        const on = (bit: number) => ((mask >> bit) & 1) === 1;
        if (on(3) && on(4)) continue;
        for (const variant of [0, 1]) {
          const f: { -readonly [K in keyof PartitionFamily]: PartitionFamily[K] } = { kind: 'partition', n };
          if (on(0)) f.distinct = true;
          if (on(1)) f.minPart = [2, 4][variant];
          if (on(2)) f.maxPart = [10, n - 6][variant];
          if (on(3)) f.length = [4, 8][variant];
          if (on(4)) f.maxLength = [3, 6][variant];
          if (on(5)) f.allowed = lists[(n + variant) % 3];
          let candidates;
          try {
            candidates = planCandidates(f, true);
          } catch {
            continue; // empty or contradictory
          }
          for (const c of candidates) offered.add(`${bare(c.method)} ${shapeOf(f)}`);
        }
      }
    }
    const missing = [...offered].filter((pair) => !covered.has(pair) && !pair.startsWith('single-member ') && !pair.startsWith('trivial '));
    expect(missing, 'add a forced chi-square case for these (method shape) pairs').toEqual([]);
    expect(offered.size).toBeGreaterThan(150);
  });
});
