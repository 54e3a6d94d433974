import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { logFactorial, logPoissonPmf } from '../../src/core/set-partitions/log-poisson.js';
import { PoissonVariate } from '../../src/core/set-partitions/poisson-variate.js';
import { sizeLaw } from '../../src/core/set-partitions/size-law.js';
import { tiltForMeanSize, tiltForTotal } from '../../src/core/set-partitions/tilt.js';
import { sampleSource } from '../../src/core/seeding.js';
import { binnedChiSquare } from '../../src/core/pictures/statistics.js';
import { fillUniformUrns, urnsPerWord } from '../../src/core/set-partitions/urns.js';

/** ln of a positive BigInt to double precision: its top 53 bits, shifted. */
function lnBig(x: bigint): number {
  const bits = x.toString(2);
  const top = Math.min(53, bits.length);
  return (bits.length - top) * Math.LN2 + Math.log(parseInt(bits.slice(0, top), 2));
}

describe('log-factorials and Poisson log-probabilities', () => {
  it('ln k! agrees with the exact factorial (BigInt) to a few units in the last place, k <= 2000', () => {
    let f = 1n;
    for (let k = 1; k <= 2000; k++) {
      f *= BigInt(k);
      const exact = lnBig(f);
      expect(Math.abs(logFactorial(k) - exact), `k = ${k}`).toBeLessThanOrEqual(1e-15 * Math.max(1, exact));
    }
  });

  it('Poisson probabilities sum to 1 and agree with the naive formula where that one is accurate', () => {
    for (const lambda of [0.25, 3, 10, 123.5, 1e4, 1e6]) {
      let total = 0;
      const lo = Math.max(0, Math.floor(lambda - 12 * Math.sqrt(lambda) - 20));
      for (let k = lo; k <= lambda + 12 * Math.sqrt(lambda) + 20; k++) total += Math.exp(logPoissonPmf(k, lambda));
      expect(Math.abs(total - 1), `lambda = ${lambda}`).toBeLessThan(1e-12);
    }
    for (const [k, lambda] of [[0, 2], [3, 2], [7, 4.5], [20, 11]] as const) {
      expect(logPoissonPmf(k, lambda)).toBeCloseTo(-lambda + k * Math.log(lambda) - logFactorial(k), 13);
    }
  });
});

describe('Poisson variates (inversion below mean 10, PTRS above)', () => {
  // Pearson chi-square against the exact law, cells pooled to expect >= 5 (common practice);
  // fixed seeds, alpha = 1e-4 per mean.
  for (const mean of [0.3, 4, 9.99, 10, 57.5, 2000, 3e5]) {
    it(`mean ${mean}`, () => {
      const variate = new PoissonVariate(mean);
      const draws = 40_000;
      const lo = Math.max(0, Math.floor(mean - 8 * Math.sqrt(mean) - 10));
      const hi = Math.ceil(mean + 8 * Math.sqrt(mean) + 10);
      const observed = new Array<number>(hi - lo + 1).fill(0);
      // One stream, many draws: the variates' own behaviour, not the seeding, is under test.
      const source = sampleSource('poisson', 0, `mean-${mean}`);
      let outside = 0;
      for (let i = 0; i < draws; i++) {
        const k = variate.sample(source);
        if (k < lo || k > hi) outside++;
        else observed[k - lo]++;
      }
      expect(outside).toBe(0);
      const probabilities = observed.map((_, i) => Math.exp(logPoissonPmf(lo + i, mean)));
      expect(binnedChiSquare(observed, probabilities).pValue).toBeGreaterThan(1e-4);
    });
  }
});

describe('block size laws and their tuning', () => {
  it('a truncated Poisson law has the mean asked for', () => {
    for (const [mean, a, b] of [[3.5, 1, 100], [2.2, 2, 3], [1000, 1, 1e6], [7.9, 1, 8], [1.01, 1, 50]] as const) {
      expect(tiltForMeanSize(mean, a, b).law.mean / mean - 1).toBeLessThan(1e-9);
    }
  });

  it('the free model has expected size n: x·G\'(x) = n (for blocks of any size, x·e^x = n: Lambert W)', () => {
    for (const n of [1e3, 1e6]) {
      const s = tiltForTotal(n, 1, n);
      const x = Math.exp(s.t);
      // Sizes above n are left out of G, a relative change below 1e-300 at these n.
      expect(Math.abs(x * Math.exp(x) / n - 1)).toBeLessThan(1e-9); // G(x) = e^x − 1, x·G'(x) = x·e^x
    }
  });

  it('sizes outside the table are negligible: the table holds all sizes within e^-45 of the largest weight', () => {
    const { law } = sizeLaw(Math.log(500), 1, 10_000);
    expect(law.probability(law.lo - 1)).toBe(0);
    expect(Math.log(law.pmf[0] / law.pmax)).toBeGreaterThan(-46);
    expect(law.lo).toBeGreaterThan(1);
  });
});

describe('uniform urns (multiply-and-shift up to 2^21 urns, modulo above)', () => {
  for (const urns of [3, 7, 1000, 2 ** 21, 2 ** 21 + 3]) {
    it(`${urns} urns: chi-square against the uniform law (alpha = 1e-4)`, () => {
      const cells = Math.min(urns, 1000);
      const labels = new Int32Array(200_000);
      fillUniformUrns(sampleSource('urns', 0, `u-${urns}`), labels, urns);
      // More than 1000 urns are folded into 1000 cells, each with its exact probability.
      const observed = new Array<number>(cells).fill(0);
      const probabilities = new Array<number>(cells).fill(0);
      for (let u = 0; u < urns; u++) probabilities[Math.floor((u * cells) / urns)] += 1 / urns;
      let outside = 0;
      for (const label of labels) {
        if (label < 0 || label >= urns) outside++;
        else observed[Math.floor((label * cells) / urns)]++;
      }
      expect(outside).toBe(0);
      expect(binnedChiSquare(observed, probabilities).pValue).toBeGreaterThan(1e-4);
    });
  }
});

/** The joint counts of `width` consecutive labels starting at `offset`, `step` apart, as base-`urns` cells. */
function jointCounts(labels: Int32Array, urns: number, width: number, offset: number, step: number): number[] {
  const counts = new Array<number>(urns ** width).fill(0);
  for (let i = offset; i + width <= labels.length; i += step) {
    let cell = 0;
    for (let j = 0; j < width; j++) cell = cell * urns + labels[i + j];
    counts[cell]++;
  }
  return counts;
}

describe('uniform urns, several per 32-bit word (batched multiply-and-shift)', () => {
  it('takes the k with urns^k <= 2^32 that accepts the most urns per word', () => {
    // 10^9 <= 2^32 < 10^10, and 9 digits accepted with probability 1 − (2^32 mod 10^9)/2^32 ≈ 0.93
    // (8.4 per word) beat 8 digits at ≈ 0.98 (7.8); for 3 urns, 20 digits are accepted with
    // probability ≈ 0.81 (16.2 per word), 18 with ≈ 0.992 (17.9); 2^32 = 65536^2 exactly; past
    // 2^16 urns only one fits.
    expect([2, 3, 10, 1000, 65_536, 65_537, 2 ** 21].map(urnsPerWord)).toEqual([32, 18, 9, 3, 2, 1, 1]);
    for (let urns = 2; urns <= 5000; urns++) expect(urns ** urnsPerWord(urns)).toBeLessThanOrEqual(2 ** 32);
  });

  // Urns drawn from one word must be independent, not only uniform one by one: pairs of
  // neighbours at both parities (within a word and across words, since 3 and 9 per word are
  // odd), chi-square against the uniform law on urns^2 cells; alpha = 1e-4 each.
  for (const urns of [2, 3, 10, 40]) {
    for (const offset of [0, 1]) {
      it(`${urns} urns (${urnsPerWord(urns)} per word): neighbours at offset ${offset} are independent (chi-square, alpha = 1e-4)`, () => {
        const labels = new Int32Array(200_001);
        fillUniformUrns(sampleSource('urns-pairs', offset, `u-${urns}`), labels, urns);
        const counts = jointCounts(labels, urns, 2, offset, 2);
        expect(binnedChiSquare(counts, new Array<number>(urns * urns).fill(1 / urns ** 2)).pValue).toBeGreaterThan(1e-4);
      });
    }
  }

  it('a fill shorter than a word (7 of the 18 urns one word gives for 3 urns) is uniform on all 3^7 outcomes (chi-square, alpha = 1e-4)', () => {
    const source = sampleSource('urns-tail', 0, 'u-3');
    const counts = new Array<number>(3 ** 7).fill(0);
    const labels = new Int32Array(7);
    for (let t = 0; t < 200_000; t++) {
      fillUniformUrns(source, labels, 3);
      counts[labels.reduce((cell, urn) => cell * 3 + urn, 0)]++;
    }
    expect(binnedChiSquare(counts, new Array<number>(3 ** 7).fill(1 / 3 ** 7)).pValue).toBeGreaterThan(1e-4);
  });

  it('every length fills every entry with an urn in range (whole words and a partial last word)', () => {
    for (const urns of [1, 2, 10, 1000, 70_000]) {
      for (let length = 0; length <= 2 * urnsPerWord(Math.max(urns, 2)) + 3; length++) {
        const labels = new Int32Array(length).fill(-1);
        fillUniformUrns(sampleSource('urns-lengths', length, `u-${urns}`), labels, urns);
        expect(labels.every((v) => v >= 0 && v < urns)).toBe(true);
      }
    }
  });
});
