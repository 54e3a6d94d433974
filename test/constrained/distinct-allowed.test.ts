import { describe, expect, it } from 'vitest';
import { EmptyFamilyError, LimitExceededError } from '../../src/core/errors.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { DistinctBoltzmann } from '../../src/core/partitions/constrained/distinct-boltzmann.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { subsetSumReachable } from '../../src/core/partitions/constrained/subset-sum-reach.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { chiSquareUniform } from '../support/chi-square-uniform.js';
import { pooled } from '../support/distinct-part-count-law.js';

/**
 * Distinct parts from an allowed list: reachability (who decides emptiness), the refusal, and
 * distinct-boltzmann's exactness on lists. Statistical tests: fixed seeds, false-alarm
 * probability alpha = 1e-4 each (project convention).
 */
const ALPHA = 1e-4;

/** Reachable subset sums of a short list by a byte table (the reference). */
function reachableSums(values: readonly number[]): Uint8Array {
  const total = values.reduce((a, b) => a + b, 0);
  const reach = new Uint8Array(total + 1);
  reach[0] = 1;
  for (const a of values) for (let m = total; m >= a; m--) if (reach[m - a]) reach[m] = 1;
  return reach;
}

/** A fixed pseudo-random stream for building test lists (Park–Miller minimal standard). */
function lcg(seed: number): () => number {
  let s = seed;
  return () => {
    s = (s * 48271) % 2147483647;
    return s / 2147483647;
  };
}

describe('subsetSumReachable', () => {
  it('agrees with the byte table on random short lists, under every work bound (or leaves it undecided)', () => {
    const rnd = lcg(7);
    let decided = 0;
    for (let trial = 0; trial < 300; trial++) {
      const r = 1 + Math.floor(rnd() * 40);
      const maxv = 1 + Math.floor(rnd() * 300);
      const set = new Set<number>();
      for (let i = 0; i < r; i++) set.add(1 + Math.floor(rnd() * maxv));
      const values = [...set].sort((a, b) => a - b);
      const reach = reachableSums(values);
      for (let k = 0; k < 10; k++) {
        const n = Math.floor(rnd() * (reach.length + 2));
        const expected = n < reach.length && reach[n] === 1;
        for (const limit of [1e9, 50, 5]) {
          const got = subsetSumReachable(values, n, limit);
          if (got === undefined) continue;
          decided++;
          expect(got, `${JSON.stringify(values)} n = ${n} limit ${limit}`).toBe(expected);
        }
      }
    }
    expect(decided).toBeGreaterThan(8000);
  });

  it('decides the long lists of the issue by the run argument', () => {
    const spaced = Array.from({ length: 1000 }, (_, k) => 1000 + 7 * k);
    const first = Array.from({ length: 1000 }, (_, k) => k + 1);
    expect(subsetSumReachable(spaced, 1e6)).toBe(true);
    expect(subsetSumReachable(first, 3e5)).toBe(true);
    // 1000 + 7k >= 1000: n = 999 takes no size; 1001..1006 neither (one size is 1000 or >= 1007).
    expect(subsetSumReachable(spaced, 1003)).toBe(false);
  });

  it('decides short sparse lists by meet in the middle (powers of 3: n is a sum iff its base-3 digits are 0 or 1)', () => {
    const powers = Array.from({ length: 19 }, (_, k) => 3 ** k);
    expect(subsetSumReachable(powers, (3 ** 19 - 1) / 2)).toBe(true);
    expect(subsetSumReachable(powers, 3 ** 18 + 2 * 3 ** 5)).toBe(false);
  });
});

describe('distinct parts from a list: empty families and refusals', () => {
  it('an odd n from even sizes is empty (gcd), and so is n above the sum of the sizes', () => {
    const evens = Array.from({ length: 500 }, (_, k) => 2 * (k + 1));
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 100001, distinct: true, allowed: evens })).toThrow(EmptyFamilyError);
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 250501, distinct: true, allowed: evens.map((e) => e - 1) })).toThrow(EmptyFamilyError);
  });

  it('n = 1e6 from 1 to 999 odd is empty (the odd numbers sum to 250000)', () => {
    const odd = Array.from({ length: 500 }, (_, k) => 2 * k + 1);
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 1e6, distinct: true, allowed: odd })).toThrow(EmptyFamilyError);
  });

  it('the long lists of the issue are planned (not refused)', () => {
    const spaced = Array.from({ length: 1000 }, (_, k) => 1000 + 7 * k);
    const first = Array.from({ length: 1000 }, (_, k) => k + 1);
    expect(constrainedPartitionSampler({ kind: 'partition', n: 1e6, distinct: true, allowed: spaced }).method).toBe('distinct-boltzmann/1');
    expect(constrainedPartitionSampler({ kind: 'partition', n: 3e5, distinct: true, allowed: first }).method).toBe('distinct-boltzmann/1');
  });

  it('when reachability stays undecided the refusal says which n fit, in the family terms', () => {
    // 1000 sizes within 3000 of 1e6: the sums of j sizes never meet those of j + 1, so no run forms.
    const near = Array.from({ length: 1000 }, (_, k) => 1e6 - 3 * k);
    let error: unknown;
    try {
      constrainedPartitionSampler({ kind: 'partition', n: 5e8, distinct: true, allowed: near });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(LimitExceededError);
    const message = (error as Error).message;
    expect(message).toContain('distinct parts');
    expect(message).toContain('sum to n');
    expect(message).toMatch(/n up to about \d+/);
    expect(message).not.toMatch(/boltzmann|table|cell/i);
  });
});

function check(family: PartitionFamily, sampler: { method: string; sample: DistinctBoltzmann['sample'] }, seed: string): void {
  expect(sampler.method).toBe('distinct-boltzmann/1');
  const result = chiSquareUniform(family, sampler as never, seed);
  expect(result.members).toBeGreaterThan(5);
  expect(result.strangers).toBe(0);
  expect(result.pValue).toBeGreaterThan(ALPHA);
}

describe('distinct-boltzmann over allowed lists is exact (chi-square over the enumerated family)', () => {
  it('sizes with gcd 1 but even small sizes (only a large odd size makes n odd)', () => {
    const values = [2, 4, 6, 8, 10, 12, 14, 17];
    const f: PartitionFamily = { kind: 'partition', n: 37, distinct: true, allowed: values };
    // Block cell limit 40: the block holds the smallest even sizes; 17 is drawn from the law.
    check(f, new DistinctBoltzmann({ kind: 'list', values }, 37, 40), 'dal-parity');
  });
  it('above half the sum of the sizes (tilt x > 1)', () => {
    // The sizes sum to 78.
    const values = [1, 3, 4, 7, 9, 11, 12, 15, 16];
    const f: PartitionFamily = { kind: 'partition', n: 50, distinct: true, allowed: values };
    check(f, new DistinctBoltzmann({ kind: 'list', values }, 50, 20), 'dal-heavy');
  });
  it('through the planner with the method forced', () => {
    const values = [3, 5, 6, 9, 10, 13, 14, 18, 21];
    const f: PartitionFamily = { kind: 'partition', n: 44, distinct: true, allowed: values };
    check(f, constrainedPartitionSampler(f, { method: 'distinct-boltzmann' }) as never, 'dal-plan');
  });
});

describe('distinct-boltzmann over a list follows the exact law of the number of parts', () => {
  it('n = 3000, odd sizes below 400, method forced: chi-square against the counted law', () => {
    // Counts by (number of parts, sum) over the list, as doubles (additions of positives only).
    const values = Array.from({ length: 200 }, (_, k) => 2 * k + 1);
    const n = 3000;
    const kMax = 60;
    const table = Array.from({ length: kMax + 1 }, () => new Float64Array(n + 1));
    table[0][0] = 1;
    for (const a of values) for (let k = kMax; k >= 1; k--) for (let m = n; m >= a; m--) table[k][m] += table[k - 1][m - a];
    const counts = table.map((row) => row[n]);
    expect(counts[kMax]).toBe(0); // kMax is past the largest number of parts
    const total = counts.reduce((a, b) => a + b, 0);
    const law = counts.map((c) => c / total);
    const family: PartitionFamily = { kind: 'partition', n, distinct: true, allowed: values };
    const sampler = constrainedPartitionSampler(family, { method: 'distinct-boltzmann' });
    expect(sampler.method).toBe('distinct-boltzmann/1');
    const samples = 4000;
    const observed = new Array<number>(kMax + 1).fill(0);
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('dal-law', i, 'parts'));
      expect(p.sizes.reduce((a, b) => a + b, 0)).toBe(n);
      observed[p.sizes.length]++;
    }
    const pooledBins = pooled(observed, law, samples);
    const { pValue } = chiSquareTest(pooledBins.observed, pooledBins.probabilities);
    expect(pValue).toBeGreaterThan(ALPHA);
  });
});
