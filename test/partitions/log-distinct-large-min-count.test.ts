import { describe, expect, it } from 'vitest';
import { checkAboveTable } from '../support/distinct-large-min-exact.js';

describe('distinct parts >= a, a in 201..400: the integral against exact counts above the table', () => {
  for (const a of [201, 268, 400]) {
    it(`a = ${a}`, () => {
      const { worstRatio, worstLog } = checkAboveTable(a, 3000, 173);
      expect(worstRatio).toBeLessThan(1e-14);
      expect(worstLog).toBeLessThan(1e-14);
    });
  }
});
