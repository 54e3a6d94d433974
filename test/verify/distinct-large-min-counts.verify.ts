import { describe, expect, it } from 'vitest';
import { checkAboveTable } from '../support/distinct-large-min-exact.js';

/**
 * The counts distinct-bounded-self-similar needs for minPart up to MAX_A = 5000 (parts >= b' =
 * ⌈a/2⌉ <= 2500): the saddle-point integral (the parts below b' through the log cosh series)
 * against exact BigInt counts by number of parts, from the default table's end on (~2 min).
 */
describe('distinct parts >= a, a = 1000 and 2500: the integral against exact counts above the table', () => {
  for (const a of [1000, 2500]) {
    it(`a = ${a}`, () => {
      const { worstRatio, worstLog } = checkAboveTable(a, 3000, 173);
      expect(worstRatio).toBeLessThan(1e-14);
      expect(worstLog).toBeLessThan(1e-14);
    }, 600_000);
  }
});
