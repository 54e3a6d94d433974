import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import kstest from '@stdlib/stats-kstest';
import { beforeAll, describe, expect, it } from 'vitest';
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import type { Partition } from '../../src/core/partition.js';
import { DivideAndConquerSampler } from '../../src/core/partitions/divide-and-conquer.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import type { RandomSource } from '../../src/core/random.js';
import { sampleSource } from '../../src/core/seeding.js';
import { assertValidPartition, zPValue } from '../support/partition-checks.js';

// Large-n laws of a uniform random partition against published limit theorems, for the
// planner's sampler (the self-similar method at these n). Every test: false-alarm probability
// alpha = 1e-4 (project convention) if the limit law held exactly at this n; the residual
// finite-n error of each limit law is far below what these sample sizes can see (checked by the
// exact-value comparisons below, which use the identities of test/partitions/exact-laws.test.ts).
const ALPHA = 1e-4;

interface Stats {
  largest: number[];
  distinct: number[];
  ones: number[];
  twos: number[];
}

function collect(sample: (s: RandomSource) => Partition, n: number, count: number, seed: string): Stats {
  const source = sampleSource(seed, 0, 'verify');
  const out: Stats = { largest: [], distinct: [], ones: [], twos: [] };
  for (let i = 0; i < count; i++) {
    const p = sample(source);
    assertValidPartition(p, n);
    out.largest.push(p.sizes[0]);
    out.distinct.push(p.sizes.length);
    let ones = 0;
    let twos = 0;
    const last = p.sizes.length - 1;
    if (p.sizes[last] === 1) ones = p.multiplicities[last];
    for (let j = last; j >= 0 && p.sizes[j] <= 2; j--) if (p.sizes[j] === 2) twos = p.multiplicities[j];
    out.ones.push(ones);
    out.twos.push(twos);
  }
  return out;
}

const expCdf = (x: number): number => (x <= 0 ? 0 : -Math.expm1(-x));

function mean(values: number[]): number {
  return values.reduce((a, b) => a + b, 0) / values.length;
}
function variance(values: number[]): number {
  const m = mean(values);
  return values.reduce((a, b) => a + (b - m) * (b - m), 0) / (values.length - 1);
}

/**
 * Two-sample homogeneity chi-square over bins cut at pooled-sample deciles (common practice:
 * under the null the pooled values are exchangeable, so the bins do not favour either sample).
 * Returns the p-value from chi-square with (bins − 1) degrees of freedom.
 */
function twoSampleChiSquare(a: number[], b: number[], bins = 10): number {
  const pooled = [...a, ...b].sort((x, y) => x - y);
  const cuts: number[] = [];
  for (let i = 1; i < bins; i++) {
    const c = pooled[Math.floor((i * pooled.length) / bins)];
    if (cuts.length === 0 || c > cuts[cuts.length - 1]) cuts.push(c);
  }
  const bin = (v: number): number => {
    let k = 0;
    while (k < cuts.length && v >= cuts[k]) k++;
    return k;
  };
  const ca = new Array(cuts.length + 1).fill(0);
  const cb = new Array(cuts.length + 1).fill(0);
  for (const v of a) ca[bin(v)]++;
  for (const v of b) cb[bin(v)]++;
  let stat = 0;
  let used = 0;
  for (let k = 0; k < ca.length; k++) {
    const col = ca[k] + cb[k];
    if (col === 0) continue;
    used++;
    const ea = (col * a.length) / (a.length + b.length);
    const eb = (col * b.length) / (a.length + b.length);
    stat += ((ca[k] - ea) ** 2) / ea + ((cb[k] - eb) ** 2) / eb;
  }
  return 1 - chisquareCdf(stat, used - 1);
}

describe('uniform partitions of n = 10^6 against limit laws', () => {
  const n = 1_000_000;
  const samples = 20_000;
  const a = Math.sqrt(6 * n) / Math.PI;
  let stats: Stats;
  beforeAll(() => {
    stats = collect((s) => unrestrictedPartitionSampler(n).sample(s), n, samples, 'laws-1e6');
  });
  const logP = new LogPartitionNumbers();
  /** Exact P(X_k >= j) = p(n − jk)/p(n) (remove j parts k; Andrews 1976 ch. 1), via log-ratios. */
  const exactMeanMultiplicity = (k: number): number => {
    let total = 0;
    for (let j = 1; j * k <= n; j++) {
      const term = Math.exp(logP.logRatio(n - j * k, n));
      total += term;
      if (term < 1e-18) break;
    }
    return total;
  };

  /**
   * Exact mean and variance of the largest part λ1, which by conjugation has the law of the
   * number of parts ℓ = Σ_k X_k. With r_j = p(n − j)/p(n) = P(a given set of parts summing to j
   * is present) (Andrews 1976 ch. 1): E[X_k] = Σ_i r_{ik}, E[X_k²] = Σ_i (2i − 1) r_{ik}, and for
   * k ≠ l E[X_k X_l] = Σ_{i,j} r_{ik+jl}. Summed over k, l with d(m) the number of divisors:
   * E[ℓ] = Σ_m d(m) r_m, E[ℓ²] = Σ_{u,v} d(u)d(v) r_{u+v} − Σ_k Σ_{s>=2} (s − 1) r_{sk} + Σ_k Σ_s (2s − 1) r_{sk}.
   * Terms with r_j < 1e-20 are dropped (j up to ~35,000 at n = 1e6; their total is below 1e-12).
   */
  const exactLargestMoments = (): { mean: number; variance: number } => {
    let J = 1;
    while (J < n && Math.exp(logP.logRatio(n - J, n)) > 1e-20) J++;
    const r = new Float64Array(J + 1);
    for (let j = 0; j <= J; j++) r[j] = Math.exp(logP.logRatio(n - j, n));
    const d = new Float64Array(J + 1);
    for (let k = 1; k <= J; k++) for (let m = k; m <= J; m += k) d[m]++;
    let first = 0;
    for (let m = 1; m <= J; m++) first += d[m] * r[m];
    let second = 0;
    for (let u = 1; u < J; u++) for (let v = 1; u + v <= J; v++) second += d[u] * d[v] * r[u + v];
    for (let k = 1; k <= J; k++) for (let s = 1; s * k <= J; s++) second += (2 * s - 1 - (s - 1)) * r[s * k];
    return { mean: first, variance: second - first * first };
  };

  it('largest part: exact mean and variance (conjugation: the number of parts), near the Erdős–Lehner Gumbel law', () => {
    // Erdős & Lehner (1941): (λ1 − a ln a)/a tends to the Gumbel law (mean γ = 0.5772, variance
    // π²/6 = 1.6449). At n = 1e6 its finite-n error is visible at 20,000 samples: the exact scaled
    // mean is 0.5806 and the exact scaled variance 1.6185 (computed here), so a KS test against the
    // limit law would reject a correct sampler more often than alpha says. The sample is tested
    // against the exact moments instead; the limit law is checked against them to 2%.
    const exact = exactLargestMoments();
    const scaledMean = (exact.mean - a * Math.log(a)) / a;
    const scaledVariance = exact.variance / (a * a);
    expect(Math.abs(scaledMean - 0.5772156649)).toBeLessThan(0.02);
    expect(Math.abs(scaledVariance / (Math.PI ** 2 / 6) - 1)).toBeLessThan(0.02);
    const z = (mean(stats.largest) - exact.mean) / Math.sqrt(exact.variance / samples);
    expect(zPValue(z)).toBeGreaterThan(ALPHA);
    // Sample variance: standard error σ²·√((κ − 1)/N) with the Gumbel kurtosis κ = 5.4 (common
    // practice: the large-sample law of the sample variance, kurtosis from the limit law).
    const zVar = (variance(stats.largest) - exact.variance) / (exact.variance * Math.sqrt((5.4 - 1) / samples));
    expect(zPValue(zVar)).toBeGreaterThan(ALPHA);
  });

  it('number of distinct part sizes: mean ≈ √(6n)/π (Wilf 1983, from memory; exact mean Σ p(n−k)/p(n))', () => {
    // Exact: E[distinct] = Σ_k P(X_k >= 1) = Σ_k p(n − k)/p(n).
    let exactMean = 0;
    for (let k = 1; k <= n; k++) {
      const term = Math.exp(logP.logRatio(n - k, n));
      exactMean += term;
      if (term < 1e-18) break;
    }
    // The asymptotic √(6n)/π is within 0.1% of the exact mean at this n (…and within 1 part).
    expect(Math.abs(exactMean / a - 1)).toBeLessThan(1e-3);
    const z = (mean(stats.distinct) - exactMean) / Math.sqrt(variance(stats.distinct) / samples);
    expect(zPValue(z)).toBeGreaterThan(ALPHA);
  });

  it.each([1, 2])('(πk/√(6n))·X_k is Exp(1) for k = %i (Fristedt 1993), KS test and exact mean', (k) => {
    const values = k === 1 ? stats.ones : stats.twos;
    const scaled = values.map((x) => (k * x) / a);
    expect(kstest(scaled, expCdf).pValue).toBeGreaterThan(ALPHA);
    const exact = exactMeanMultiplicity(k);
    const z = (mean(values) - exact) / Math.sqrt(variance(values) / samples);
    expect(zPValue(z)).toBeGreaterThan(ALPHA);
  });
});

describe('fast sampler vs divide-and-conquer at n = 10^5 (two-sample)', () => {
  const n = 100_000;
  const samples = 10_000;
  let fast: Stats;
  let reference: Stats;
  beforeAll(() => {
    fast = collect((s) => unrestrictedPartitionSampler(n).sample(s), n, samples, 'two-sample-fast');
    const dc = new DivideAndConquerSampler(n);
    reference = collect((s) => dc.sample(s), n, samples, 'two-sample-dc');
  });
  it.each(['largest', 'distinct', 'ones', 'twos'] as const)('same law of %s', (key) => {
    expect(twoSampleChiSquare(fast[key], reference[key])).toBeGreaterThan(ALPHA);
  });
});
