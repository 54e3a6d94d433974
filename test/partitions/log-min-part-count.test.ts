import { describe, expect, it } from 'vitest';
import { LogMinPartCounts, defaultExactUpTo, minPartByParts } from '../../src/core/counting/log-min-part-count.js';
import { PartitionNumbers } from '../../src/core/counting/partition-numbers.js';

/**
 * Exact c_b(m) (partitions of m into parts >= b) as BigInts, from p(m) (Euler's recurrence) and
 * c_{b+1}(m) = c_b(m) − c_b(m − b) (partitions into parts >= b with no part b). Exact, so no
 * cancellation. OEIS A002865 (b = 2): 1, 0, 1, 1, 2, 2, 4, 4, 7, 8, 12.
 */
function exactCounts(b: number, upTo: number): bigint[] {
  let c = new PartitionNumbers().upTo(upTo);
  for (let k = 1; k < b; k++) {
    const next = c.slice();
    for (let m = k; m <= upTo; m++) next[m] = c[m] - c[m - k];
    c = next;
  }
  return c;
}

/** log(x/y) for BigInts x, y > 0 with x/y near 1 (through log1p of the exact quotient). */
function exactLogRatio(x: bigint, y: bigint): number {
  if (x >= y) return Math.log1p(Number(((x - y) << 200n) / y) / 2 ** 200);
  return -Math.log1p(Number(((y - x) << 200n) / x) / 2 ** 200);
}

describe('log c_b(m): partitions into parts >= b', () => {
  it('fills its table by number of parts: exact below 2^53, within rounding above (against BigInt counts)', () => {
    for (const [b, upTo] of [[2, 1500], [5, 3000], [162, 4000]]) {
      const exact = exactCounts(b, upTo);
      const c = minPartByParts(b, upTo);
      for (let m = 0; m <= upTo; m++) {
        // Partial sums are integers: exact while below 2^53; above, each addition rounds once
        // (<= ~2·upTo of them on a path, so relative error < upTo·2^-51 ~ 2e-12 at worst).
        if (exact[m] < 2n ** 53n) expect(c[m], `b=${b} m=${m}`).toBe(Number(exact[m]));
        else expect(Math.abs(c[m] / Number(exact[m]) - 1), `b=${b} m=${m}`).toBeLessThan(2e-12);
      }
    }
  });

  it('matches OEIS A002865 at small m', () => {
    const c = new LogMinPartCounts(2);
    expect([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10].map((m) => c.value(m))).toEqual([1, 0, 1, 1, 2, 2, 4, 4, 7, 8, 12]);
  });

  // Measured worst |error| of the log-ratios below: 7.1e-15 (b = 7), typically 1e-16..2e-15. The
  // floor is the rounding of the phase (m − π²/(6t²))·y at the trapezoid nodes, ~eps·m·|y|.
  const RATIO_TOLERANCE = 1.5e-14;
  const cases: Array<[number, number, number]> = [
    // b, first m checked by the integral (its table ends just below), last m
    [2, defaultExactUpTo(2) + 1, 20_000],
    [3, defaultExactUpTo(3) + 1, 20_000],
    [7, defaultExactUpTo(7) + 1, 20_000],
    [100, defaultExactUpTo(100) + 1, 20_000],
    // For b = 481 the default table ends at 22,214; the integral is checked from 18,000 on.
    [481, 18_000, 20_000],
  ];
  for (const [b, from, upTo] of cases) {
    it(`b = ${b}: the saddle-point integral's log-ratios agree with exact counts (m ${from}..${upTo})`, () => {
      const exact = exactCounts(b, upTo);
      const counts = new LogMinPartCounts(b, Math.min(from - 1, defaultExactUpTo(b)));
      let worst = 0;
      for (let m = from; m <= upTo; m += 97) {
        for (const d of [1, 7, 100]) {
          if (m - d < from) continue;
          const err = Math.abs(counts.logRatio(m, m - d) - exactLogRatio(exact[m], exact[m - d]));
          worst = Math.max(worst, err);
        }
        // log c itself: relative to its size (rounding of a number ~ √m).
        const big = exact[m].toString(2).length;
        const logExact = Math.log(Number(exact[m] >> BigInt(big - 60))) + (big - 60) * Math.LN2;
        expect(Math.abs(counts.log(m) - logExact) / logExact, `log c(${m})`).toBeLessThan(1e-14);
      }
      expect(worst).toBeLessThan(RATIO_TOLERANCE);
    });
  }

  it('the tables (doubles) agree with the exact counts to ~m roundings, and log-ratios across the table end are accurate', () => {
    for (const b of [2, 7, 100]) {
      const counts = new LogMinPartCounts(b);
      const top = counts.exactUpTo;
      const exact = exactCounts(b, top + 300);
      for (let m = 0; m <= top; m += m < 300 ? 1 : 17) {
        if (exact[m] === 0n) expect(counts.value(m)).toBe(0);
        else expect(Math.abs(counts.value(m) / Number(exact[m]) - 1), `b ${b} m ${m}`).toBeLessThanOrEqual((m + 1) * 2 ** -53);
      }
      for (const [x, y] of [
        [top + 1, top],
        [top + 200, top - 100],
      ]) {
        expect(Math.abs(counts.logRatio(x, y) - exactLogRatio(exact[x], exact[y]))).toBeLessThan(1e-12);
      }
    }
  });

  it('is log-concave from logConcaveFrom() on (exact on the table; second differences on a grid above)', () => {
    for (const b of [2, 3, 7, 31, 100]) {
      const counts = new LogMinPartCounts(b);
      const from = counts.logConcaveFrom();
      expect(from).toBeGreaterThanOrEqual(b);
      // b = 2: the last failure is at a small m (the table check is exact).
      for (let m = counts.exactUpTo + 2; m < 5e8; m = Math.ceil(m * 1.7)) {
        const second = counts.logRatio(m + 1, m) - counts.logRatio(m, m - 1);
        expect(second, `b ${b} m ${m}`).toBeLessThan(0);
      }
    }
  });

  it('rejects bad arguments', () => {
    expect(() => new LogMinPartCounts(1)).toThrow(RangeError);
    const c = new LogMinPartCounts(3);
    expect(() => c.log(-1)).toThrow(RangeError);
    expect(() => c.log(1.5)).toThrow(RangeError);
    expect(() => c.log(2e9)).toThrow(RangeError);
  });
});
