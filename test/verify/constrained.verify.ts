import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { countPartitions } from '../../src/core/counting/partition-counts.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { lengthOf, sizeOf } from '../../src/core/partition.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';

/**
 * Large-n checks of the constrained samplers against published limit laws and exact tables.
 * Every statistical check has false-alarm probability at most alpha = 1e-4 (project convention):
 * z-tests use |z| < 3.89 (two-sided normal 1e-4), chi-square tests p > 1e-4.
 */
const Z = 3.89;

/** BigInt ratio a / b as a double. */
function ratio(a: bigint, b: bigint): number {
  const scale = 10n ** 18n;
  return Number((a * scale) / b) / 1e18;
}

describe('distinct parts', () => {
  it('n = 1e6: mean number of parts ~ (2 sqrt(3) ln 2 / pi) sqrt(n) (Erdős & Lehner 1941)', () => {
    const n = 1_000_000;
    const family: PartitionFamily = { kind: 'partition', n, distinct: true };
    const sampler = constrainedPartitionSampler(family);
    const samples = 300;
    let sum = 0;
    let sumSq = 0;
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('erdos-lehner', i, 'verify'));
      expect(sizeOf(p)).toBe(n);
      expect(p.multiplicities.every((m) => m === 1)).toBe(true);
      const k = lengthOf(p);
      sum += k;
      sumSq += k * k;
    }
    const mean = sum / samples;
    const se = Math.sqrt((sumSq / samples - mean * mean) / samples);
    const leading = ((2 * Math.sqrt(3) * Math.log(2)) / Math.PI) * Math.sqrt(n); // 764.3
    // Tolerance: Z standard errors plus 0.5% of the leading term for lower-order terms of the
    // expansion (the Boltzmann mean is (ln 2 / c) sqrt(n) - 1/4 + o(1), c = pi / sqrt(12): Euler-
    // Maclaurin on sum 1 / (1 + e^(ck/sqrt(n))), from memory).
    expect(Math.abs(mean - leading)).toBeLessThan(Z * se + 0.005 * leading);
  });

  it('n = 3000, distinct-boltzmann forced: mean number of parts matches the exact law (z-test with the exact variance)', () => {
    const n = 3000;
    // Exact law of the number of parts from BigInt counts by length (staircase + A008284).
    const total = countPartitions({ kind: 'partition', n, distinct: true });
    let mean = 0;
    let second = 0;
    for (let k = 1; k * (k + 1) <= 2 * n; k++) {
      const pk = ratio(countPartitions({ kind: 'partition', n, distinct: true, length: k }), total);
      mean += k * pk;
      second += k * k * pk;
    }
    const variance = second - mean * mean;
    const sampler = constrainedPartitionSampler({ kind: 'partition', n, distinct: true }, { method: 'distinct-boltzmann' });
    const samples = 4000;
    let sum = 0;
    for (let i = 0; i < samples; i++) sum += lengthOf(sampler.sample(sampleSource('distinct-exact', i, 'verify')));
    const z = (sum / samples - mean) / Math.sqrt(variance / samples);
    expect(Math.abs(z)).toBeLessThan(Z);
  });
});

describe('parts <= m', () => {
  it('n = 1000, m = 40, bounded-boltzmann forced: largest-part distribution matches the exact table', () => {
    const n = 1000;
    const m = 40;
    // P(largest part <= j) = p(n, parts <= j) / p(n, parts <= m), exact in BigInt.
    const total = countPartitions({ kind: 'partition', n, maxPart: m });
    const cdf: number[] = [];
    for (let j = 0; j <= m; j++) cdf.push(j === 0 ? 0 : ratio(countPartitions({ kind: 'partition', n, maxPart: j }), total));
    const sampler = constrainedPartitionSampler({ kind: 'partition', n, maxPart: m }, { method: 'bounded-boltzmann' });
    const samples = 20_000;
    const observed = new Map<number, number>();
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('largest-part', i, 'verify'));
      expect(sizeOf(p)).toBe(n);
      expect(p.sizes[0]).toBeLessThanOrEqual(m);
      observed.set(p.sizes[0], (observed.get(p.sizes[0]) ?? 0) + 1);
    }
    // Cells j = m, m-1, ... while the expected count is >= 20 (common practice), the rest pooled.
    let statistic = 0;
    let cells = 0;
    let pooledObserved = samples;
    let j = m;
    for (; j >= 1; j--) {
      const expected = samples * (cdf[j] - cdf[j - 1]);
      if (expected < 20 || samples * cdf[j - 1] < 20) break;
      const o = observed.get(j) ?? 0;
      statistic += (o - expected) ** 2 / expected;
      pooledObserved -= o;
      cells++;
    }
    const pooledExpected = samples * cdf[j];
    statistic += (pooledObserved - pooledExpected) ** 2 / pooledExpected;
    cells++;
    expect(cells).toBeGreaterThan(5);
    expect(1 - chisquareCdf(statistic, cells - 1)).toBeGreaterThan(1e-4);
  });

  it('n = 1e5, m = 100: samples never exceed m and P(largest part = m) matches the exact table', () => {
    const n = 100_000;
    const m = 100;
    const exact = 1 - ratio(countPartitions({ kind: 'partition', n, maxPart: m - 1 }), countPartitions({ kind: 'partition', n, maxPart: m }));
    const sampler = constrainedPartitionSampler({ kind: 'partition', n, maxPart: m });
    const samples = 3000;
    let hits = 0;
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('parts-at-most', i, 'verify'));
      expect(sizeOf(p)).toBe(n);
      expect(p.sizes[0]).toBeLessThanOrEqual(m);
      if (p.sizes[0] === m) hits++;
    }
    const z = (hits / samples - exact) / Math.sqrt((exact * (1 - exact)) / samples);
    expect(Math.abs(z)).toBeLessThan(Z);
  });
});
