import { describe, expect, it } from 'vitest';
import { canonicalFamily, familyKey } from '../../src/core/family.js';
import { partitionFromParts } from '../../src/core/partition.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { checkPartitionSamples } from '../../src/core/pictures/check.js';
import { onesLaw, onesStatistic } from '../../src/core/pictures/ones.js';
import { sampleSource } from '../../src/core/seeding.js';
import { allPartitions, satisfies } from '../support/enumerate-constrained.js';
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

describe('the ones statistic has an exact law at every n', () => {
  it.each([false, true])('matches enumeration at n = 20 (distinct = %s)', (distinct) => {
    const family = { kind: 'partition' as const, n: 20, ...(distinct ? { distinct: true } : {}) };
    const members = allPartitions(20).filter((p) => satisfies(p, family)).map((p) => partitionFromParts(p));
    const law = onesLaw(20, distinct, 20);
    for (let j = 0; j <= 20; j++) {
      const exact = members.filter((p) => onesStatistic(p, distinct) === j).length / members.length;
      expect(Math.abs(law[j] - exact)).toBeLessThan(1e-13);
    }
  });
});

describe('the check at large n: exact verdict, passes the service sampler, fails a biased one', () => {
  // alpha = 1e-4 per assertion on a uniform sampler (fixed seeds: a false alarm would repeat).
  const samples = 20_000;
  const run = (n: number, distinct: boolean, seed: string, shift: number) => {
    const family = { kind: 'partition' as const, n, ...(distinct ? { distinct: true } : {}) };
    const base = shift > 0 ? { ...family, n: n - shift } : family;
    const sampler = planPartitionSampler(base);
    const key = familyKey(canonicalFamily(base));
    return checkPartitionSamples(family, (function* () {
      for (let i = 0; i < samples; i++) {
        const p = sampler.sample(sampleSource(seed, i, key));
        if (shift === 0) yield p;
        else {
          // The biased sampler: a uniform partition of n − shift plus `shift` parts 1. Its ones law
          // is the exact one conditioned on X >= shift. With shift = 1 that is a total-variation
          // distance of only 1 − p(n−1)/p(n) ≈ 0.004 at n = 1e5, which 20,000 samples do not
          // resolve through a chi-square on ~300 cells (measured p = 0.045); shift = 20 is caught.
          const parts: number[] = [];
          p.sizes.forEach((s, i) => { for (let k = 0; k < p.multiplicities[i]; k++) parts.push(s); });
          for (let k = 0; k < shift; k++) parts.push(1);
          yield partitionFromParts(parts);
        }
      }
    })());
  };

  it('n = 6000: exact largest-part law (truncated table), passes', () => {
    const report = run(6000, false, 'a', 0);
    expect(report.largestPart.law).toBe('exact');
    expect(report.verdict.quantity).toBe('largest part');
    expect(report.verdict.pValue!).toBeGreaterThan(1e-4);
  });

  it('n = 1e5: exact law of the part-1 multiplicity, passes; the n−20 plus 20 parts 1 sampler fails', () => {
    const real = run(100_000, false, 'a', 0);
    expect(real.largestPart.law).toBe('erdos-lehner-gumbel');
    expect(real.largestPart.asymptotic).toBe(true);
    expect(real.verdict.quantity).toBe('multiplicity of the part 1');
    expect(real.verdict.pValue!).toBeGreaterThan(1e-4);
    const biased = run(100_000, false, 'a', 20);
    expect(biased.verdict.pValue!).toBeLessThan(1e-12);
  });
});
