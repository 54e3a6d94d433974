import { describe, expect, it } from 'vitest';
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import { boltzmannLogX } from '../../src/core/partitions/boltzmann-proposal.js';
import { SelfSimilarEngine, SelfSimilarSampler, type SelfSimilarStats } from '../../src/core/partitions/self-similar.js';
import { RestrictedPartitionTable } from '../../src/core/partitions/table-recursive.js';
import { sampleSource } from '../../src/core/seeding.js';
import { zPValue } from '../support/partition-checks.js';

const table = new RestrictedPartitionTable();
const logP = new LogPartitionNumbers();
const ALPHA = 1e-4; // false-alarm probability per statistical check (project convention)

describe('self-similar method internals', () => {
  it('finds the exact argmax of p(m)·x^{2m} over 0 <= m <= n/2', () => {
    const engine = new SelfSimilarEngine({ baseThreshold: 0, table, logP });
    const bruteForce = (n: number, logX: number): number => {
      let best = 0;
      for (let m = 1; m <= Math.floor(n / 2); m++) {
        if (logP.log(m) + 2 * m * logX > logP.log(best) + 2 * best * logX) best = m;
      }
      return best;
    };
    for (let n = 1; n <= 3000; n += n < 200 ? 1 : 37) {
      const logX = boltzmannLogX(n);
      expect(engine.maximiser(n, logX), `n = ${n}`).toBe(bruteForce(n, logX));
    }
    // Large n: a local maximum of the concave weight (log p is concave above 25, DeSalvo & Pak 2015).
    for (const n of [10_000, 123_457, 1e6, 99_999_999, 1e9]) {
      const logX = boltzmannLogX(n);
      const m = engine.maximiser(n, logX);
      const f = (k: number): number => logP.logRatio(k, m) + 2 * (k - m) * logX;
      expect(f(m - 1)).toBeLessThanOrEqual(0);
      expect(f(m + 1)).toBeLessThanOrEqual(0);
      // Near n/4, the leading-order peak (see the class comment); the next term shifts it by a
      // relative O(n^{-1/2}).
      expect(Math.abs(m / (n / 4) - 1)).toBeLessThan(5 / Math.sqrt(n));
    }
  });

  it.each([1000, 20_000])('accepts at the exact rate at n = %i', (n) => {
    // One trial is accepted with probability (1 + x)·x^n·p(n) / (Z_odd(x)·M), where
    // Z_odd(x) = Π_{k odd} (1 − x^k)^{-1} and M = max_m p(m)x^{2m} (derivation in self-similar.ts:
    // the sum over odd parts A of p((n − |A|)/2) is p(n)). The number of trials at the top level is
    // geometric with that success probability: z-test of its mean with the exact variance.
    const logX = boltzmannLogX(n);
    const engine = new SelfSimilarEngine({ baseThreshold: 0, table, logP });
    const best = engine.maximiser(n, logX);
    let logZodd = 0;
    for (let k = 1; k * -logX < 60; k += 2) logZodd -= Math.log1p(-Math.exp(k * logX));
    const logAcc = Math.log1p(Math.exp(logX)) + (n - 2 * best) * logX + logP.logRatio(n, best) - logZodd;
    const acc = Math.exp(logAcc);
    // Asymptotically 1/√2 (Gaussian width ratio, see the class comment).
    expect(acc).toBeGreaterThan(0.6);
    expect(acc).toBeLessThan(0.75);
    const sampler = new SelfSimilarSampler(n, { baseThreshold: 500, table, logP });
    const source = sampleSource(`acceptance-${n}`, 0, 'test');
    const stats: SelfSimilarStats = { topProposals: 0, proposals: 0, visited: 0 };
    const samples = n > 10_000 ? 20_000 : 40_000;
    for (let i = 0; i < samples; i++) sampler.sample(source, stats);
    const mean = 1 / acc;
    const sd = Math.sqrt(1 - acc) / acc;
    const z = (stats.topProposals / samples - mean) / (sd / Math.sqrt(samples));
    expect(zPValue(z)).toBeGreaterThan(ALPHA);
  });
});
