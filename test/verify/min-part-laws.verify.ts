import { describe, expect, it } from 'vitest';
import { PartitionNumbers } from '../../src/core/counting/partition-numbers.js';
import { MinPartSelfSimilarSampler } from '../../src/core/partitions/min-part-self-similar.js';
import { sampleSource } from '../../src/core/seeding.js';
import { assertValidPartition, zPValue } from '../support/partition-checks.js';

// Laws of a uniform partition into parts >= a at n = 20,000 against exact values, for the
// min-part self-similar sampler (its recursion runs 3–4 levels here and uses the saddle-point
// counts above their tables). False-alarm probability alpha = 1e-4 per describe block
// (project convention), Bonferroni-split over its statistics.
const ALPHA = 1e-4;

/** Exact c_a(m), m <= n, as BigInts: c_{b+1}(m) = c_b(m) − c_b(m − b) from p(m). */
function exactCounts(a: number, n: number): bigint[] {
  let c = new PartitionNumbers().upTo(n);
  for (let k = 1; k < a; k++) {
    const next = c.slice();
    for (let m = k; m <= n; m++) next[m] = c[m] - c[m - k];
    c = next;
  }
  return c;
}

describe.each([7, 100])('partitions of 20,000 into parts >= %d against exact values', (a) => {
  const n = 20_000;
  const c = exactCounts(a, n);
  const scale = 10n ** 15n;
  // #partitions with at least j parts k is c(n − jk): P(k is a part) = c(n − k)/c(n), and
  // E[number of parts] = Σ_k Σ_j c(n − jk)/c(n).
  const probability = (k: number) => Number((c[n - k] * scale) / c[n]) / 1e15;
  let total = 0n;
  for (let k = a; k <= n; k++) for (let m = n - k; m >= 0; m -= k) total += c[m];
  const meanParts = Number((total * scale) / c[n]) / 1e15;
  const sizes = [a, a + 1, a + 2, 2 * a, 2 * a + 1, 4 * a, 8 * a];
  const samples = 10_000;
  const sampler = new MinPartSelfSimilarSampler(n, a);
  const source = sampleSource('min-part-exact-laws', a, 'verify');
  const parts: number[] = [];
  const hits = new Map<number, number>(sizes.map((k) => [k, 0]));
  for (let i = 0; i < samples; i++) {
    const p = sampler.sample(source);
    assertValidPartition(p, n);
    expect(Math.min(...p.sizes)).toBeGreaterThanOrEqual(a);
    parts.push(p.multiplicities.reduce((x, y) => x + y, 0));
    for (const s of p.sizes) if (hits.has(s)) hits.set(s, hits.get(s)! + 1);
  }

  it('each listed size is a part with its exact probability', () => {
    for (const k of sizes) {
      const p = probability(k);
      const z = (hits.get(k)! - samples * p) / Math.sqrt(samples * p * (1 - p));
      expect(zPValue(z), `size ${k}, P = ${p}`).toBeGreaterThan(ALPHA / (sizes.length + 1));
    }
  });

  it('the number of parts has the exact mean (z-test with the sample variance)', () => {
    const mean = parts.reduce((x, y) => x + y, 0) / samples;
    const variance = parts.reduce((x, y) => x + (y - mean) ** 2, 0) / (samples - 1);
    const z = (mean - meanParts) / Math.sqrt(variance / samples);
    expect(zPValue(z)).toBeGreaterThan(ALPHA / (sizes.length + 1));
  });
});
