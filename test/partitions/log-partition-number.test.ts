import { describe, expect, it } from 'vitest';
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import { PartitionNumbers } from '../../src/core/counting/partition-numbers.js';

const exact = new PartitionNumbers();
const logP = new LogPartitionNumbers();

/** log of a positive BigInt to double accuracy (Number() rounds correctly; values stay < 1e308 here). */
function logBig(value: bigint): number {
  return Math.log(Number(value));
}

describe('LogPartitionNumbers', () => {
  it('matches OEIS A000041 values', () => {
    // p(100) = 190569292, p(1000) = 24061467864032622473692149727991 (OEIS A000041).
    expect(logP.value(100)).toBe(190569292);
    expect(logP.log(100)).toBeCloseTo(Math.log(190569292), 14);
    expect(logP.log(1000)).toBeCloseTo(Math.log(24061467864032622473692149727991), 13);
    // p(0) = 1, p(1) = 1, p(5) = 7 (OEIS A000041).
    expect(logP.log(0)).toBe(0);
    expect(logP.log(1)).toBe(0);
    expect(logP.value(5)).toBe(7);
  });

  it('agrees with exact BigInt values on both sides of the switch and far above it', () => {
    // Exact p(m) from Euler's pentagonal recurrence in BigInt (DLMF 26.9.8). Above the switch
    // the Rademacher leading term (DLMF 26.10.12, k = 1) drops terms of relative size
    // e^{−Cλ/2} < 1e-24; what remains is double rounding of Cλ (~100–260 here), so the bound is
    // on the relative error of log p(m): 1e-14.
    const switchAt = LogPartitionNumbers.EXACT_UP_TO;
    for (const m of [switchAt - 1, switchAt, switchAt + 1, switchAt + 2, 2500, 4000, 6000, 8000, 10000]) {
      const want = logBig(exact.get(m));
      expect(Math.abs(logP.log(m) - want) / want).toBeLessThan(1e-14);
    }
  });

  it('gives log-ratios accurate to ~1e-14 absolute, also across the switch', () => {
    const pairs: Array<[number, number]> = [
      [2001, 2000],
      [1999, 2003],
      [5000, 4990],
      [10000, 9999],
      [10000, 2500],
      [3000, 3000],
      [120, 7],
    ];
    for (const [a, b] of pairs) {
      const big = exact.get(a);
      const small = exact.get(b);
      const want = logBig(big) - logBig(small);
      expect(Math.abs(logP.logRatio(a, b) - want)).toBeLessThan(1e-13);
    }
    // Nearby large arguments: the ratio form avoids subtracting two logs of size ~8e4.
    const a = 999_999_999;
    const b = 1_000_000_000;
    const r = logP.logRatio(a, b);
    // d/dm log p(m) ≈ C/(2√m) (Hardy & Ramanujan 1918): ≈ −4.0562e-5 for one step at 1e9.
    expect(r).toBeCloseTo(-(Math.PI * Math.sqrt(2 / 3)) / (2 * Math.sqrt(1e9)), 8);
    expect(logP.logRatio(a, b)).toBe(-logP.logRatio(b, a));
  });

  it('rejects arguments outside [0, 1e9]', () => {
    expect(() => logP.log(-1)).toThrow(RangeError);
    expect(() => logP.log(1.5)).toThrow(RangeError);
    expect(() => logP.log(1e9 + 1)).toThrow(RangeError);
    expect(() => logP.value(2001)).toThrow(RangeError);
  });
});
