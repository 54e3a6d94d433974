import { describe, expect, it } from 'vitest';
import { DistinctPartitionNumbers } from '../../src/core/counting/distinct-partition-numbers.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { assertValidPartition, zPValue } from '../support/partition-checks.js';

// Laws of a uniform partition into distinct parts at large n, for the planner's sampler (the
// distinct self-similar method at these n). Every test: false-alarm probability alpha = 1e-4
// (project convention), Bonferroni-split where several statistics are tested together.
const ALPHA = 1e-4;

/** Exact P(k is a part) for k = 1..n: #{distinct partitions of n − k avoiding k} / q(n), as doubles. */
function exactPartProbabilities(n: number): { probability: (k: number) => number; meanParts: number } {
  const q = new DistinctPartitionNumbers().upTo(n);
  const scale = 10n ** 15n;
  // Partitions of j into distinct parts avoiding k: q(j) − q(j − k) + q(j − 2k) − ...
  const containing = (k: number): bigint => {
    let s = 0n;
    for (let i = 1; i * k <= n; i++) s += i % 2 === 1 ? q[n - i * k] : -q[n - i * k];
    return s;
  };
  let total = 0n;
  for (let k = 1; k <= n; k++) total += containing(k);
  return {
    probability: (k) => Number((containing(k) * scale) / q[n]) / 1e15,
    meanParts: Number((total * scale) / q[n]) / 1e15,
  };
}

describe('partitions into distinct parts at n = 20,000 against exact values', () => {
  const n = 20_000;
  const exact = exactPartProbabilities(n);
  const samples = 20_000;
  const sampler = planPartitionSampler({ kind: 'partition', n, distinct: true });
  const source = sampleSource('distinct-exact-laws', 0, 'verify');
  const parts: number[] = [];
  const sizes = [1, 2, 3, 4, 8, 16, 64, 100, 256];
  const hits = new Map<number, number>(sizes.map((k) => [k, 0]));
  for (let i = 0; i < samples; i++) {
    const p = sampler.sample(source);
    assertValidPartition(p, n);
    parts.push(p.sizes.length);
    for (const s of p.sizes) if (hits.has(s)) hits.set(s, hits.get(s)! + 1);
  }

  it('uses the self-similar method', () => {
    expect(sampler.method).toBe('distinct-self-similar/1');
  });

  it('each of the sizes 1, 2, 3, 4, 8, 16, 64, 100, 256 is a part with its exact probability', () => {
    // Sizes 2^j are the parts that level j of the recursion contributes as "its part 1".
    for (const k of sizes) {
      const p = exact.probability(k);
      const z = (hits.get(k)! - samples * p) / Math.sqrt(samples * p * (1 - p));
      expect(zPValue(z), `size ${k}, P = ${p}`).toBeGreaterThan(ALPHA / (sizes.length + 1));
    }
  });

  it('the number of parts has the exact mean (z-test with the sample variance)', () => {
    const mean = parts.reduce((a, b) => a + b, 0) / samples;
    const variance = parts.reduce((a, b) => a + (b - mean) ** 2, 0) / (samples - 1);
    const z = (mean - exact.meanParts) / Math.sqrt(variance / samples);
    expect(zPValue(z)).toBeGreaterThan(ALPHA / (sizes.length + 1));
  });
});

describe.each([1e8, 1e9])('partitions into distinct parts at n = %d: number of parts', (n) => {
  it('matches the conditioned Boltzmann mean and variance', () => {
    // At t = π/√(12n) the parts are independent Bernoulli(p_k), p_k = 1/(1 + e^{tk}) (Fristedt 1993's
    // model for distinct parts); conditioned on the size n, the number of parts N is asymptotically
    // Gaussian with mean Σp_k and variance Var N − Cov(N, S)²/Var S (bivariate local limit). The
    // finite-n bias of that mean is +0.21 at n = 1e3, 5e3 and 2e4 (against the exact mean, as
    // computed above), below 0.05 standard errors here; the variance's relative error O(n^{-1/4}).
    const t = Math.PI / Math.sqrt(12 * n);
    let mean = 0;
    let vN = 0;
    let cov = 0;
    let vS = 0;
    for (let k = 1; k * t < 60; k++) {
      const p = 1 / (1 + Math.exp(t * k));
      const v = p * (1 - p);
      mean += p;
      vN += v;
      cov += k * v;
      vS += k * k * v;
    }
    const variance = vN - (cov * cov) / vS;
    const sampler = planPartitionSampler({ kind: 'partition', n, distinct: true });
    expect(sampler.method).toBe('distinct-self-similar/1');
    const samples = n >= 1e9 ? 300 : 600;
    const counts: number[] = [];
    for (let i = 0; i < samples; i++) {
      const p = sampler.sample(sampleSource('distinct-large-laws', i, String(n)));
      if (i < 3) assertValidPartition(p, n);
      counts.push(p.sizes.length);
    }
    const m = counts.reduce((a, b) => a + b, 0) / samples;
    const z = (m - mean) / Math.sqrt(variance / samples);
    expect(zPValue(z), `mean ${m} vs ${mean}`).toBeGreaterThan(ALPHA / 2);
    // Sample variance against the limit: (s²/σ² − 1)·√(samples/2) is approximately N(0, 1).
    const s2 = counts.reduce((a, b) => a + (b - m) ** 2, 0) / (samples - 1);
    const zv = (s2 / variance - 1) * Math.sqrt(samples / 2);
    expect(zPValue(zv), `variance ${s2} vs ${variance}`).toBeGreaterThan(ALPHA / 2);
  });
});
