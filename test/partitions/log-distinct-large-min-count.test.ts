import { describe, expect, it } from 'vitest';
import { LogDistinctBoundedCounts } from '../../src/core/counting/log-distinct-bounded-count.js';
import { checkAboveTable, exactLargeMinCounts } from '../support/distinct-large-min-exact.js';

describe('distinct parts >= a, a in 201..400: the integral against exact counts above the table', () => {
  for (const a of [201, 268, 400]) {
    it(`a = ${a}`, () => {
      const { worstRatio, worstLog } = checkAboveTable(a, 3000, 173);
      expect(worstRatio).toBeLessThan(1e-14);
      expect(worstLog).toBeLessThan(1e-14);
    });
  }
});

describe('distinct parts >= a, a > 400: log-concave above the table end (what the maximiser takes without building the table)', () => {
  // logConcaveFrom() returns exactUpTo + 1 for tables longer than LAZY_TABLE_ABOVE: the exact
  // counts around and above the table end are log-concave (BigInt, exact), and so are the
  // integral's values on a grid up to 1e9 (second differences of the log-ratios negative).
  for (const a of [401, 700]) {
    it(`a = ${a}`, () => {
      const c = new LogDistinctBoundedCounts(a);
      expect(c.exactUpTo).toBeGreaterThan(LogDistinctBoundedCounts.LAZY_TABLE_ABOVE);
      expect(c.logConcaveFrom()).toBe(c.exactUpTo + 1);
      const exact = exactLargeMinCounts(a, c.exactUpTo + 2000);
      for (let m = c.exactUpTo - 2000; m < c.exactUpTo + 2000; m++) {
        expect(exact[m] * exact[m] >= exact[m - 1] * exact[m + 1], `m=${m}`).toBe(true);
      }
      for (let m = c.exactUpTo + 2; m < 1e9; m = Math.round(m * 1.7)) {
        expect(c.logRatio(m + 1, m) - c.logRatio(m, m - 1), `a=${a} m=${m}`).toBeLessThan(0);
      }
    });
  }
});
