import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { BoltzmannProposal, boltzmannLogX } from '../../src/core/partitions/boltzmann-proposal.js';
import { sampleSource } from '../../src/core/seeding.js';

// The proposal must give independent X_k with P(X_k = j) = (1 − x^k)·x^{jk} (the Boltzmann model
// of partitions; Fristedt 1993). Chi-square tests per size k over the cells X = 0, 1, 2, >= 3,
// in both phases (direct loop: x^k > 0.3; thinning beyond), and a 2x2 independence test for
// neighbouring sizes in the thinning phase. Each check: false-alarm probability alpha = 1e-4
// (project convention), p-values from @stdlib/stats-base-dists-chisquare-cdf.
const ALPHA = 1e-4;
const DRAWS = 300_000;

function geometricCells(q: number): number[] {
  // P(X = 0) = 1 − q, P(X = 1) = q(1 − q), P(X = 2) = q²(1 − q), P(X >= 3) = q³ with q = x^k.
  return [1 - q, q * (1 - q), q * q * (1 - q), q * q * q];
}

function chiSquare(observed: number[], probabilities: number[], total: number): number {
  let stat = 0;
  let cells = 0;
  for (let i = 0; i < observed.length; i++) {
    const e = probabilities[i] * total;
    if (e === 0) {
      expect(observed[i]).toBe(0);
      continue;
    }
    stat += ((observed[i] - e) * (observed[i] - e)) / e;
    cells++;
  }
  return 1 - chisquareCdf(stat, cells - 1);
}

describe('BoltzmannProposal', () => {
  it.each([
    ['all sizes', 1, 1, [1, 2, 5, 18, 19, 20, 25, 40, 60, 90]],
    ['odd sizes from 3', 3, 2, [3, 5, 17, 19, 21, 23, 41, 61, 91]],
  ] as const)('draws exact geometric multiplicities (%s)', (_name, start, step, probes) => {
    const logX = boltzmannLogX(400); // x ≈ 0.938: the direct phase ends near k = 19
    const proposal = new BoltzmannProposal();
    const source = sampleSource(`proposal-${start}-${step}`, 0, 'test');
    const cells = new Map<number, number[]>(probes.map((k) => [k, [0, 0, 0, 0]]));
    const pairs = new Map<number, number[]>();
    for (const k of [41, 61]) pairs.set(k, [0, 0, 0, 0]); // thinning phase, k and k + step
    let sizeSum = 0;
    for (let d = 0; d < DRAWS; d++) {
      const total = proposal.draw(source, logX, start, step, Infinity);
      sizeSum += total;
      const seen = new Map<number, number>();
      let check = 0;
      for (let i = 0; i < proposal.count; i++) {
        const k = proposal.sizes[i];
        if (i > 0 && !(k > proposal.sizes[i - 1])) throw new Error(`sizes not ascending at ${k}`);
        if ((k - start) % step !== 0) throw new Error(`size ${k} is not in the progression`);
        seen.set(k, proposal.multiplicities[i]);
        check += k * proposal.multiplicities[i];
      }
      if (check !== total) throw new Error(`total ${total} but parts add to ${check}`);
      for (const [k, c] of cells) c[Math.min(3, seen.get(k) ?? 0)]++;
      for (const [k, c] of pairs) c[(seen.has(k) ? 2 : 0) + (seen.has(k + step) ? 1 : 0)]++;
    }
    for (const [k, c] of cells) {
      const pValue = chiSquare(c, geometricCells(Math.exp(k * logX)), DRAWS);
      expect(pValue, `size ${k}`).toBeGreaterThan(ALPHA);
    }
    for (const [k, c] of pairs) {
      const a = Math.exp(k * logX);
      const b = Math.exp((k + step) * logX);
      const probs = [(1 - a) * (1 - b), (1 - a) * b, a * (1 - b), a * b];
      expect(chiSquare(c, probs, DRAWS), `pair ${k}, ${k + step}`).toBeGreaterThan(ALPHA);
    }
    // Mean size Σ k·x^k/(1 − x^k) over the progression (Boltzmann mean; Fristedt 1993); the
    // variance Σ k²x^k/(1 − x^k)² gives the z-test bound (|z| < 3.89 is alpha = 1e-4 two-sided,
    // normal quantile from memory).
    let mean = 0;
    let variance = 0;
    for (let k = start; k < 100_000; k += step) {
      const q = Math.exp(k * logX);
      mean += (k * q) / (1 - q);
      variance += (k * k * q) / ((1 - q) * (1 - q));
    }
    const z = (sizeSum / DRAWS - mean) / Math.sqrt(variance / DRAWS);
    expect(Math.abs(z)).toBeLessThan(3.89);
  });

  it('stops with OVER exactly when the full draw would exceed the budget, otherwise draws the same', () => {
    const logX = boltzmannLogX(10_000);
    const full = new BoltzmannProposal();
    const capped = new BoltzmannProposal();
    for (let i = 0; i < 300; i++) {
      const total = full.draw(sampleSource('budget', i, 'test'), logX, 1, 1, Infinity);
      const budget = 10_000;
      const result = capped.draw(sampleSource('budget', i, 'test'), logX, 1, 1, budget);
      if (total > budget) expect(result).toBe(BoltzmannProposal.OVER);
      else {
        expect(result).toBe(total);
        expect(Array.from(capped.sizes.subarray(0, capped.count))).toEqual(Array.from(full.sizes.subarray(0, full.count)));
      }
    }
  });

  it('rejects a non-negative log x', () => {
    expect(() => new BoltzmannProposal().draw(sampleSource('x', 0, 'test'), 0, 1, 1, 10)).toThrow(RangeError);
  });
});
