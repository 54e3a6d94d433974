import { combinations } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { canonicalFamily, familyKey, type PartitionFamily } from '../../src/core/family.js';
import { partitionFromParts, type Partition } from '../../src/core/partition.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { checkPartitionSamples } from '../../src/core/pictures/check.js';
import { checkCompositionParts, compositionPartsLaw } from '../../src/core/pictures/composition-parts.js';
import { gumbelScaling, largestPartLaw } from '../../src/core/pictures/largest-part.js';
import { DISTINCT_LIMIT_SHAPE, PARTITION_LIMIT_SHAPE } from '../../src/core/pictures/limit-shape.js';
import { nextBelow, type RandomSource } from '../../src/core/random.js';
import { sampleSource } from '../../src/core/seeding.js';
import { allPartitions, satisfies } from '../support/enumerate-constrained.js';

/** An exactly uniform reference sampler: enumerate the family, pick one with an exact uniform integer. */
function enumeratingSampler(family: PartitionFamily): (source: RandomSource) => Partition {
  const members = allPartitions(family.n).filter((p) => satisfies(p, family));
  return (source) => partitionFromParts(members[nextBelow(source, members.length)]);
}

/** The deliberately biased generator: cut n at each of its n−1 gaps with probability 1/2, sort. */
function randomCutPartition(n: number, source: RandomSource): Partition {
  const parts: number[] = [];
  let run = 1;
  for (let gap = 1; gap < n; gap++) {
    if (source.nextDouble() < 0.5) {
      parts.push(run);
      run = 1;
    } else run++;
  }
  parts.push(run);
  return partitionFromParts(parts);
}

function* draws<T>(count: number, seed: string, make: (source: RandomSource) => T): Generator<T> {
  for (let i = 0; i < count; i++) yield make(sampleSource(seed, i, 'test'));
}

// Each statistical assertion below uses alpha = 1e-4 (fixed seeds: a false alarm would repeat,
// and a uniform sampler trips it for at most one seed in 10^4).
const ALPHA = 1e-4;

describe('the exact law of the largest part', () => {
  it('counts agree with OEIS', () => {
    // p(50) = 204226, p(100) = 190569292 (OEIS A000041); q(50) = 3658 (OEIS A000009).
    expect(largestPartLaw({ kind: 'partition', n: 50 }).count).toBe(204226);
    expect(largestPartLaw({ kind: 'partition', n: 100 }).count).toBe(190569292);
    expect(largestPartLaw({ kind: 'partition', n: 50, distinct: true }).count).toBe(3658);
    // Partitions of 10 with largest part m = partitions of 10 into exactly m parts (conjugation):
    // OEIS A008284 row 10 = 1, 5, 8, 9, 7, 5, 3, 2, 1, 1.
    const law = largestPartLaw({ kind: 'partition', n: 10 });
    expect([...law.probabilities].slice(1).map((p) => Math.round(p * 42))).toEqual([1, 5, 8, 9, 7, 5, 3, 2, 1, 1]);
    // Partitions of 10 into exactly 3 parts: A008284 T(10,3) = 8; at most 3 parts: A026820 T(10,3) = 14.
    expect(largestPartLaw({ kind: 'partition', n: 10, length: 3 }).count).toBe(8);
    expect(largestPartLaw({ kind: 'partition', n: 10, maxLength: 3 }).count).toBe(14);
  });

  it('agrees with brute-force enumeration under every kind of constraint', () => {
    const families: PartitionFamily[] = [
      { kind: 'partition', n: 18 },
      { kind: 'partition', n: 18, distinct: true },
      { kind: 'partition', n: 18, minPart: 2, maxPart: 7 },
      { kind: 'partition', n: 18, length: 5 },
      { kind: 'partition', n: 18, maxLength: 4, distinct: true },
      { kind: 'partition', n: 18, allowed: [1, 3, 4, 9] },
      { kind: 'partition', n: 18, allowed: [2, 3, 5], length: 6 },
      { kind: 'partition', n: 0 },
    ];
    for (const family of families) {
      const members = allPartitions(family.n).filter((p) => satisfies(p, family));
      const law = largestPartLaw(family);
      expect(law.count, JSON.stringify(family)).toBe(members.length);
      for (let m = 0; m <= family.n; m++) {
        const exact = members.filter((p) => (p[0] ?? 0) === m).length / members.length;
        expect(law.probabilities[m]).toBeCloseTo(exact, 12);
      }
    }
    expect(() => largestPartLaw({ kind: 'partition', n: 7, allowed: [2, 4] })).toThrow(/no partition of 7/);
  });
});

describe('the check can fail and does not fail a uniform sampler', () => {
  const n = 40;
  const family: PartitionFamily = { kind: 'partition', n };

  it('passes the service sampler (samples 0..3999 of a fixed seed)', () => {
    const sampler = planPartitionSampler(family);
    const key = familyKey(canonicalFamily(family));
    const real = checkPartitionSamples(family, (function* () {
      for (let i = 0; i < 4000; i++) yield sampler.sample(sampleSource('check-real', i, key));
    })());
    expect(real.largestPart.test).toBe('chi-square');
    expect(real.largestPart.degreesOfFreedom).toBeGreaterThan(10);
    expect(real.samples).toBe(4000);
    expect(real.largestPart.pValue!).toBeGreaterThan(ALPHA);
  });

  it('fails the random-cut generator with a tiny p-value, through the same code', () => {
    const biased = checkPartitionSamples(family, draws(4000, 'check-biased', (s) => randomCutPartition(n, s)));
    expect(biased.largestPart.pValue!).toBeLessThan(1e-12);
  });

  it('passes exactly uniform samplers of constrained families (enumeration) and fails biased ones', () => {
    const families: PartitionFamily[] = [
      { kind: 'partition', n: 24, distinct: true },
      { kind: 'partition', n: 24, minPart: 2, maxLength: 6 },
      { kind: 'partition', n: 24, allowed: [1, 2, 5, 10] },
    ];
    for (const [index, f] of families.entries()) {
      const sample = enumeratingSampler(f);
      const report = checkPartitionSamples(f, draws(3000, `constrained-${index}`, sample));
      expect(report.largestPart.pValue!, JSON.stringify(f)).toBeGreaterThan(ALPHA);
    }
    // Uniform over the unconstrained family is not uniform over the distinct one: out-of-family
    // members have probability 0 under the distinct law, so the test fails outright.
    const wrong = checkPartitionSamples(families[0], draws(3000, 'wrong-family', enumeratingSampler({ kind: 'partition', n: 24 })));
    expect(wrong.largestPart.pValue!).toBeLessThan(1e-12);
  });

  it('compares the mean boundary with the limit shape: the real sampler is closer than the biased one', () => {
    const big: PartitionFamily = { kind: 'partition', n: 400 };
    const sampler = planPartitionSampler(big);
    const key = familyKey(big);
    const real = checkPartitionSamples(big, (function* () {
      for (let i = 0; i < 300; i++) yield sampler.sample(sampleSource('boundary', i, key));
    })());
    const biased = checkPartitionSamples(big, draws(300, 'boundary-biased', (s) => randomCutPartition(400, s)));
    expect(real.boundary!.curve).toBe('partitions');
    expect(real.boundary!.maxDeviation).toBeLessThan(biased.boundary!.maxDeviation / 2);
  });
});

describe('limit shapes and the Gumbel law', () => {
  it('has the published shapes', () => {
    // The partitions curve e^{-cx} + e^{-cy} = 1 is symmetric: y(y(x)) = x.
    for (const x of [0.2, 0.7, 1.5, 3]) expect(PARTITION_LIMIT_SHAPE.y(PARTITION_LIMIT_SHAPE.y(x))).toBeCloseTo(x, 10);
    expect(PARTITION_LIMIT_SHAPE.c).toBeCloseTo(Math.PI / Math.sqrt(6), 15);
    // Distinct parts: y(0) is the scaled mean number of parts, 2√3 ln 2 / π ≈ 0.7643
    // (Erdős & Lehner 1941, from memory).
    expect(DISTINCT_LIMIT_SHAPE.y(0)).toBeCloseTo((2 * Math.sqrt(3) * Math.log(2)) / Math.PI, 12);
  });

  it('uses Kolmogorov–Smirnov against Erdős–Lehner for large n, and can fail there too', () => {
    const n = 1_000_000;
    const family: PartitionFamily = { kind: 'partition', n };
    const { a, location } = gumbelScaling(n, false);
    // a = √(6n)/π (Erdős & Lehner 1941).
    expect(a).toBeCloseTo(Math.sqrt(6 * n) / Math.PI, 9);
    // Synthetic partitions whose largest part is a rounded Gumbel draw (inversion), the rest ones.
    const gumbelPartition = (shift: number) => (source: RandomSource): Partition => {
      const u = Math.max(source.nextDouble(), 1e-300);
      const top = Math.round(location + shift * a + a * -Math.log(-Math.log(u)));
      return { sizes: [top, 1], multiplicities: [1, n - top] };
    };
    const fair = checkPartitionSamples(family, draws(5000, 'gumbel', gumbelPartition(0)));
    expect(fair.largestPart.law).toBe('erdos-lehner-gumbel');
    expect(fair.largestPart.test).toBe('kolmogorov-smirnov');
    expect(fair.largestPart.pValue!).toBeGreaterThan(ALPHA);
    const shifted = checkPartitionSamples(family, draws(5000, 'gumbel', gumbelPartition(0.15)));
    expect(shifted.largestPart.pValue!).toBeLessThan(1e-8);
  });
});

describe('the number of parts of a composition', () => {
  it('is 1 + Binomial(n − 1, 1/2)', () => {
    const law = compositionPartsLaw(12);
    for (let k = 1; k <= 12; k++) expect(law[k]).toBeCloseTo((combinations(11, k - 1) as number) / 2 ** 11, 14);
    expect(law.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('passes uniform compositions (fair cuts) and fails biased ones', () => {
    const n = 100;
    // Each of the 2^{n−1} cut sets equally likely is exactly a uniform composition.
    const parts = (p: number) => (source: RandomSource): number => {
      let k = 1;
      for (let gap = 1; gap < n; gap++) if (source.nextDouble() < p) k++;
      return k;
    };
    expect(checkCompositionParts(n, draws(5000, 'comp', parts(0.5))).pValue!).toBeGreaterThan(ALPHA);
    expect(checkCompositionParts(n, draws(5000, 'comp', parts(0.53))).pValue!).toBeLessThan(1e-8);
  });
});
