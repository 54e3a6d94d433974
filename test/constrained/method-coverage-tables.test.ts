import { describe } from 'vitest';
import { TABLE_CASES } from '../support/method-coverage-cases.js';
import { checkForced } from '../support/method-coverage-check.js';

/**
 * The counting-table methods (table-sizes, table-lengths, table-sizes-lengths) forced through the
 * planner's `method` option on the shapes where the planner picks another method, and the filters
 * over tables (table-sizes+length-filter, table-recursive+box-filter): Pearson chi-square against
 * uniform over the enumerated family, 25 samples per member, fixed seeds, alpha = 1e-4 per test
 * (71 tests: family-wise <= 71 x 1e-4). The coverage table is at the top of method-coverage.test.ts.
 */
describe('counting tables and filters over tables, forced on each shape the other files did not force (chi-square over the enumerated family)', () => {
  checkForced(TABLE_CASES);
});
