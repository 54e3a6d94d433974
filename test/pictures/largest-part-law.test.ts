import { describe, expect, it } from 'vitest';
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import {
  EXACT_TABLE_MAX_WORK,
  LARGEST_PART_TAIL,
  largestPartLaw,
  TRUNCATED_LAW_MAX_N,
  truncatedLargestPartLaw,
  truncatedLawWork,
} from '../../src/core/pictures/largest-part.js';

describe('the truncated exact law of the largest part (large n)', () => {
  it.each([false, true])('matches the full exact table where both exist (n = 3000, 5000; distinct = %s)', (distinct) => {
    for (const n of [3000, 5000]) {
      const full = largestPartLaw({ kind: 'partition', n, ...(distinct ? { distinct: true } : {}) }).probabilities;
      const { probabilities, cut } = truncatedLargestPartLaw(n, distinct);
      expect(cut).toBeLessThan(n);
      let tail = 0;
      for (let m = cut + 1; m <= n; m++) tail += full[m];
      expect(tail).toBeLessThan(LARGEST_PART_TAIL);
      for (let m = 0; m <= cut; m++) expect(Math.abs(probabilities[m] - full[m])).toBeLessThan(1e-12);
      expect(probabilities[cut + 1]).toBeLessThan(1e-12);
    }
  });

  it('has the exact mean at n = 8000 and 13600: E[λ1] = Σ_m d(m) p(n − m)/p(n) (conjugation)', () => {
    // λ1 of a partition is the number of parts of its conjugate, Σ_k X_k, and
    // E[X_k] = Σ_{j>=1} P(X_k >= j) = Σ_j p(n − jk)/p(n) (remove j parts k; Andrews 1976, ch. 1).
    const logs = new LogPartitionNumbers();
    for (const n of [8000, TRUNCATED_LAW_MAX_N.unrestricted]) {
      let exact = 0;
      for (let k = 1; k <= n; k++) for (let m = k; m <= n; m += k) exact += Math.exp(logs.logRatio(n - m, n));
      const { probabilities, cut } = truncatedLargestPartLaw(n, false);
      let mean = 0;
      let total = 0;
      for (let m = 0; m <= cut; m++) {
        mean += m * probabilities[m];
        total += probabilities[m];
      }
      expect(Math.abs(total - 1)).toBeLessThan(1e-12);
      expect(Math.abs(mean / exact - 1)).toBeLessThan(1e-12);
    }
  });

  it('stays within the work cap up to the stated n (and is refused beyond)', () => {
    expect(truncatedLawWork(TRUNCATED_LAW_MAX_N.unrestricted, false)).toBeLessThanOrEqual(EXACT_TABLE_MAX_WORK);
    expect(truncatedLawWork(TRUNCATED_LAW_MAX_N.distinct, true)).toBeLessThanOrEqual(EXACT_TABLE_MAX_WORK);
    expect(truncatedLawWork(14_000, false)).toBeGreaterThan(EXACT_TABLE_MAX_WORK);
    expect(truncatedLawWork(12_000, true)).toBeGreaterThan(EXACT_TABLE_MAX_WORK);
    expect(() => truncatedLargestPartLaw(20_000, false)).toThrow(/limit is 4\.0e\+7/);
  });
});
