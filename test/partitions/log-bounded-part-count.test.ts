import { describe, expect, it } from 'vitest';
import {
  A_MIN,
  LogBoundedPartCounts,
  arcDamping,
  boundedPartSaddle,
  countsByFactors,
  countsByParts,
  mainArcStart,
} from '../../src/core/counting/log-bounded-part-count.js';
import { exactBoundedCounts } from '../support/bounded-laws.js';

/** log(x/y) for BigInts x, y > 0 (through log1p of the exact quotient). */
function exactLogRatio(x: bigint, y: bigint): number {
  if (x >= y) return Math.log1p(Number(((x - y) << 200n) / y) / 2 ** 200);
  return -Math.log1p(Number(((y - x) << 200n) / x) / 2 ** 200);
}

function exactLog(x: bigint): number {
  const bits = x.toString(2).length;
  if (bits < 60) return Math.log(Number(x));
  return Math.log(Number(x >> BigInt(bits - 60))) + (bits - 60) * Math.LN2;
}

describe('log c_{[a,b]}(m): partitions into parts in [a, b]', () => {
  it('matches OEIS at small m (A008619 parts <= 2, A001399 parts <= 3, A001400 parts <= 4)', () => {
    const small = (a: number, b: number) => Array.from({ length: 13 }, (_, m) => new LogBoundedPartCounts(a, b, 20).value(m));
    expect(small(1, 2)).toEqual([1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 6, 6, 7]);
    expect(small(1, 3)).toEqual([1, 1, 2, 3, 4, 5, 7, 8, 10, 12, 14, 16, 19]);
    expect(small(1, 4)).toEqual([1, 1, 2, 3, 5, 6, 9, 11, 15, 18, 23, 27, 34]);
    // Parts in [2, 3]: 1, 0, 1, 1, 1, 1, 2, 1, 2, 2, 2, 2, 3 (from memory: ⌊m/6⌋ + 1 off one residue).
    expect(small(2, 3)).toEqual([1, 0, 1, 1, 1, 1, 2, 1, 2, 2, 2, 2, 3]);
  });

  // From mainArcStart(a, b) on, the main-arc integral against exact BigInt counts (m up to
  // 20,000-60,000; log-ratios of m and m − d, d = 1, 7, 100).
  const cases: Array<[number, number, number, number]> = [
    // a, b, last m, tolerance on log-ratios
    [1, 10, 60_000, 1e-14],
    [1, 15, 20_000, 1e-14],
    // Euler–Maclaurin with few sizes (16 <= b < 64): measured worst 1.6e-14.
    [1, 20, 20_000, 3e-14],
    [1, 60, 20_000, 1e-14],
    [7, 100, 20_000, 1e-14],
    [17, 40, 20_000, 3e-14],
    [40, 300, 20_000, 1e-14],
  ];
  for (const [a, b, upTo, tolerance] of cases) {
    it(`[${a}, ${b}]: log-ratios above the table agree with exact counts (up to m = ${upTo})`, () => {
      const from = mainArcStart(a, b);
      expect(from).toBeLessThan(upTo / 2);
      const exact = exactBoundedCounts(a, b, upTo);
      const counts = new LogBoundedPartCounts(a, b, 0);
      let worst = 0;
      for (let m = from; m <= upTo; m += 97) {
        for (const d of [1, 7, 100]) {
          if (m - d < from) continue;
          worst = Math.max(worst, Math.abs(counts.logRatio(m, m - d) - exactLogRatio(exact[m], exact[m - d])));
        }
        expect(Math.abs(counts.log(m) - exactLog(exact[m])) / exactLog(exact[m]), `log c(${m})`).toBeLessThan(1e-14);
      }
      expect(worst).toBeLessThan(tolerance);
    });
  }

  it('below mainArcStart the arc at q = -1 is not damped (A < A_MIN), and the error is visible there', () => {
    // Parts <= 10 at m = 500: A ~ 16; the main arc alone is off by ~1e-8 in log.
    const exact = exactBoundedCounts(1, 10, 500);
    const counts = new LogBoundedPartCounts(1, 10, 0);
    expect(arcDamping(1, 10, boundedPartSaddle(1, 10, 500))).toBeLessThan(A_MIN);
    expect(Math.abs(counts.log(500) - exactLog(exact[500]))).toBeGreaterThan(1e-12);
    // b = 2 never reaches the threshold (its count ⌊m/2⌋ + 1 has a parity term).
    expect(mainArcStart(1, 2)).toBe(Infinity);
  });

  it('the Euler–Maclaurin form agrees with the direct sum at large m', () => {
    for (const [a, b, m] of [
      [1, 100, 1e5],
      [7, 200, 1e6],
      [40, 300, 1e6],
      [1, 1000, 1e7],
    ]) {
      const em = new LogBoundedPartCounts(a, b, 0);
      const direct = new LogBoundedPartCounts(a, b, 0, true);
      // Relative to the size of the log-ratio (~t·d), at least 1e-14.
      for (const d of [1, 100, Math.floor(m / 10)]) {
        const ratio = direct.logRatio(m, m - d);
        expect(Math.abs(em.logRatio(m, m - d) - ratio), `[${a}, ${b}] m ${m} d ${d}`).toBeLessThan(1e-14 * Math.max(1, Math.abs(ratio)));
      }
      expect(Math.abs(em.log(m) - direct.log(m)) / direct.log(m)).toBeLessThan(1e-14);
    }
  });

  it('log c is concave above the table on a grid', () => {
    for (const [a, b] of [
      [1, 30],
      [1, 300],
      [4, 2000],
      [1, 16_000],
    ]) {
      const counts = new LogBoundedPartCounts(a, b, 0);
      const from = mainArcStart(a, b);
      for (let m = from + 1; m < 5e8; m = Math.ceil(m * 1.7)) {
        const up = counts.logRatio(m + 1, m);
        const down = counts.logRatio(m, m - 1);
        // Concave up to the rounding of neighbour log-ratios at large m (measured up to 1e-11 for
        // b = 30 at m = 2.5e7), which the sampler's margin on M (1e-9) absorbs.
        expect(up - down, `[${a}, ${b}] m ${m}`).toBeLessThanOrEqual(1e-10);
      }
    }
  });
});

describe('the count table: by factors, or by number of parts where few parts fit', () => {
  // [a, b, end]: few parts (end / a well below b − a, the planner's large-minPart levels), and
  // nearly full boxes (b − a small), where the mirror T(j, m) = T(j, j(a + b) − m) does the work.
  const cases: Array<[number, number, number]> = [
    [386, 3877, 12_000],
    [97, 969, 8800],
    [49, 484, 5624],
    [7, 30, 3000],
    [5, 8, 400],
    [20, 25, 2000],
    [1, 5, 500],
    [100, 101, 5000],
  ];
  for (const [a, b, end] of cases) {
    it(`[${a}, ${b}] up to ${end}: both agree with exact BigInt counts`, () => {
      const exact = exactBoundedCounts(a, b, end);
      const byParts = countsByParts(a, b, end);
      const byFactors = countsByFactors(a, b, end);
      let worst = 0;
      for (let m = 0; m <= end; m++) {
        const e = exact[m];
        if (e === 0n) {
          expect(byParts[m], `c(${m})`).toBe(0);
          expect(byFactors[m], `c(${m})`).toBe(0);
          continue;
        }
        const log = exactLog(e);
        worst = Math.max(worst, Math.abs(Math.log(byParts[m]) - log), Math.abs(Math.log(byFactors[m]) - log));
      }
      // Relative errors of ~(number of steps) roundings: measured up to 4e-13 for [7, 30].
      expect(worst).toBeLessThan(1e-12);
    });
  }

  it('is filled on first use only', () => {
    const counts = new LogBoundedPartCounts(386, 3877, 12_000);
    expect(counts.tableFilled).toBe(false);
    expect(counts.logWeightBound(12_000, -1e-3)).toBeGreaterThan(0);
    expect(counts.tableFilled).toBe(false);
    expect(counts.value(5000)).toBeGreaterThan(0);
    expect(counts.tableFilled).toBe(true);
  });
});

describe('logWeightBound: a closed-form bound on the weights below a table', () => {
  // max_{m <= m0} log c(m) + m·slope against the exact table, for slopes around the saddle
  // points of sizes near and far above m0 (the maximiser's use: m0 the table end).
  const cases: Array<[number, number, number]> = [
    [386, 3877, 12_000],
    [49, 484, 5624],
    [7, 100, 4000],
    [1, 60, 3000],
  ];
  for (const [a, b, m0] of cases) {
    it(`[${a}, ${b}], m0 = ${m0}: at or above the exact maximum, and within a few units of it`, () => {
      const exact = exactBoundedCounts(a, b, m0);
      const counts = new LogBoundedPartCounts(a, b, 0);
      for (const factor of [1, 1.5, 3, 10]) {
        const slope = -boundedPartSaddle(a, b, factor * m0);
        let best = -Infinity;
        for (let m = 0; m <= m0; m++) if (exact[m] > 0n) best = Math.max(best, exactLog(exact[m]) + m * slope);
        const bound = counts.logWeightBound(m0, slope);
        expect(bound, `slope ${slope}`).toBeGreaterThanOrEqual(best);
        // Chernoff at m0 is loose by about log(sd · √(2π)) of the size law there.
        expect(bound - best, `slope ${slope}`).toBeLessThan(12);
      }
    });
  }
});
