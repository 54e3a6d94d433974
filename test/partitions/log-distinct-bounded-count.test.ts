import { describe, expect, it } from 'vitest';
import { DistinctPartitionNumbers } from '../../src/core/counting/distinct-partition-numbers.js';
import { LogDistinctBoundedCounts, defaultDistinctExactUpTo } from '../../src/core/counting/log-distinct-bounded-count.js';

/**
 * Exact Q_a(m) (partitions of m into distinct parts >= a) as BigInts, from q(m) (OEIS A000009,
 * Euler's pentagonal recurrence) and Q_{k+1}(m) = Q_k(m) − Q_{k+1}(m − k) (a partition into
 * distinct parts >= k either has no part k or is k plus one into distinct parts >= k + 1).
 * Exact, so no cancellation. Q_2 is OEIS A025147, Q_3 is A025148.
 */
function exactCounts(a: number, upTo: number): bigint[] {
  let c = new DistinctPartitionNumbers().upTo(upTo);
  for (let k = 1; k < a; k++) {
    const next = c.slice();
    for (let m = k; m <= upTo; m++) next[m] = c[m] - next[m - k];
    c = next;
  }
  return c;
}

/** Brute force: subsets of {a..b} with sum m. */
function bruteForce(a: number, b: number, m: number): number {
  const go = (k: number, rest: number): number => (rest === 0 ? 1 : k > Math.min(b, rest) ? 0 : go(k + 1, rest - k) + go(k + 1, rest));
  return go(a, m);
}

function exactLogRatio(x: bigint, y: bigint): number {
  if (x >= y) return Math.log1p(Number(((x - y) << 200n) / y) / 2 ** 200);
  return -Math.log1p(Number(((y - x) << 200n) / x) / 2 ** 200);
}

describe('log Q(m): partitions into distinct parts in [a, b]', () => {
  it('the table agrees with brute-force enumeration and with the BigInt recurrence', () => {
    for (const [a, b] of [[1, Infinity], [2, Infinity], [3, Infinity], [5, Infinity], [2, 9], [3, 12]] as const) {
      const c = new LogDistinctBoundedCounts(a, b, 60);
      for (let m = 0; m <= 45; m++) expect(c.value(m), `a=${a} b=${b} m=${m}`).toBe(bruteForce(a, b, m));
    }
    const ex = exactCounts(2, 40);
    const c = new LogDistinctBoundedCounts(2);
    for (let m = 0; m <= 40; m++) expect(c.value(m)).toBe(Number(ex[m]));
  });

  // Measured worst |error| of the log-ratios above the default table: <= 4.6e-15 (a = 2..100).
  // Below the table end the dropped arcs (q near −1, amplified by 1/(1 + q^k), k < a odd) show:
  // errors > 5e-15 were seen up to m = 1670 (a = 2, 3), 2220 (7), 2940 (20), 3875 (50), 5555 (100),
  // 7300 (150), 9010 (200) (table ends 10625, 14000).
  const RATIO_TOLERANCE = 1e-14;
  for (const a of [2, 3, 4, 7, 20, 50, 100, 150, 200]) {
    it(`a = ${a}: the saddle-point integral's log-ratios agree with exact counts above the table`, () => {
      const from = defaultDistinctExactUpTo(a) + 1;
      const upTo = from + 4000;
      const exact = exactCounts(a, upTo);
      const counts = new LogDistinctBoundedCounts(a, Infinity, 0); // integral everywhere
      let worst = 0;
      for (let m = from; m <= upTo; m += 131) {
        for (const d of [1, 7, 100]) {
          const err = Math.abs(counts.logRatio(m, m - d) - exactLogRatio(exact[m], exact[m - d]));
          worst = Math.max(worst, err);
        }
        const big = exact[m].toString(2).length;
        const logExact = Math.log(Number(exact[m] >> BigInt(big - 60))) + (big - 60) * Math.LN2;
        expect(Math.abs(counts.log(m) - logExact) / logExact, `log Q(${m})`).toBeLessThan(1e-14);
      }
      expect(worst).toBeLessThan(RATIO_TOLERANCE);
    });
  }

  it('log-ratios across the table end and far above it are consistent (telescoping, n up to 1e9)', () => {
    for (const a of [2, 7, 50, 100]) {
      const c = new LogDistinctBoundedCounts(a);
      const e = c.exactUpTo;
      // Table on one side, integral on the other: equals the sum of the integral's steps.
      expect(Math.abs(c.logRatio(e + 5, e - 3) - (c.log(e + 5) - c.log(e - 3)))).toBe(0);
      for (const m of [1e5, 1e7, 999_999_000]) {
        const direct = c.logRatio(m + 900, m);
        const steps = c.logRatio(m + 900, m + 400) + c.logRatio(m + 400, m);
        expect(Math.abs(direct - steps), `a=${a} m=${m}`).toBeLessThan(1e-13 * Math.max(1, Math.abs(direct)));
      }
    }
  });

  it('the counts the sampler uses are log-concave above logConcaveFrom (grid up to 1e9)', () => {
    for (const a of [2, 3, 4, 7, 13, 25, 50, 100]) {
      const c = new LogDistinctBoundedCounts(a);
      const from = c.logConcaveFrom();
      expect(from).toBeLessThan(c.exactUpTo);
      const grid: number[] = [];
      for (let m = from + 1; m < c.exactUpTo + 50; m += 7) grid.push(m);
      for (let m = c.exactUpTo - 3; m < c.exactUpTo + 4; m++) grid.push(m);
      for (let m = 5000; m < 1e9; m *= 1.7) grid.push(Math.round(m));
      for (const m of grid) {
        const second = c.logRatio(m + 1, m) - c.logRatio(m, m - 1);
        expect(second, `a=${a} m=${m}`).toBeLessThan(0);
      }
    }
  });

  /** Exact Q_{[a,b]}(0..upTo) by the BigInt knapsack Π_{a<=k<=b}(1 + q^k). */
  function exactRange(a: number, b: number, upTo: number): bigint[] {
    const c = new Array<bigint>(upTo + 1).fill(0n);
    c[0] = 1n;
    for (let k = a; k <= Math.min(b, upTo); k++) for (let m = upTo; m >= k; m--) c[m] += c[m - k];
    return c;
  }

  // A finite upper bound b: the integral with its tail series where (b + 1)t >= 1, the exact
  // table (grown on demand) nearer the middle, Q(S − m) = Q(m) past it. Measured worst errors:
  // integral <= 3.3e-15 down to (b + 1)t = 1.03; grown table <= 1.8e-14 (b − a + 1 additions
  // per entry, the double table's own rounding).
  for (const [a, b, upTo] of [[1, 300, 22_000], [4, 400, 16_000], [2, 200, 20_099], [13, 600, 20_000]] as const) {
    it(`parts in [${a}, ${b}]: log-ratios agree with exact counts up to m = ${upTo}`, () => {
      const exact = exactRange(a, b, upTo);
      const counts = new LogDistinctBoundedCounts(a, b);
      let worst = 0;
      for (let m = counts.exactUpTo - 50; m <= upTo; m += 97) {
        for (const d of [1, 7, 100]) {
          if (exact[m - d] === 0n) continue;
          worst = Math.max(worst, Math.abs(counts.logRatio(m, m - d) - exactLogRatio(exact[m], exact[m - d])));
        }
      }
      expect(worst).toBeLessThan(2.5e-14);
      if (counts.total <= upTo) {
        expect(counts.log(counts.total)).toBe(0);
        expect(counts.log(counts.total + 1)).toBe(-Infinity);
      }
    });
  }

  it('capped counts the issue family uses (parts in [50, 5000], n = 1e6) are log-concave above logConcaveFrom', () => {
    // Levels [25, 2500], [13, 1250], [7, 625], [4, 312], [2, 156], [1, 78], each up to the
    // largest m it can be asked for (n/2^{l+1}, or the middle S/2); grid over the integral's
    // range, every m of the exact table (grown on demand) up to 6000.
    const levels = [[25, 2500, 500_000], [13, 1250, 250_000], [7, 625, 125_000], [4, 312, 62_500], [2, 156, 31_250], [1, 78, 15_625]];
    for (const [a, b, worst] of levels) {
      const c = new LogDistinctBoundedCounts(a, b);
      const half = Math.min(worst, Math.floor(c.total / 2));
      const from = c.logConcaveFrom();
      const grid: number[] = [];
      for (let m = from + 1; m < Math.min(half, 30_000); m += m < 6000 ? 1 : 7) grid.push(m);
      for (let m = 30_000; m < half; m = Math.ceil(m * 1.05)) grid.push(m);
      for (const m of grid) expect(c.logRatio(m + 1, m) - c.logRatio(m, m - 1), `[${a}, ${b}] m=${m}`).toBeLessThan(0);
    }
  });
});

describe('log Q(m) in the middle of a finite range (the log-cosh power series)', () => {
  /** Exact Q_{[a,b]}(0..upTo) by the BigInt knapsack Π_{a<=k<=b}(1 + q^k). */
  function exactRange(a: number, b: number, upTo: number): bigint[] {
    const c = new Array<bigint>(upTo + 1).fill(0n);
    c[0] = 1n;
    for (let k = a; k <= Math.min(b, upTo); k++) for (let m = upTo; m >= k; m--) c[m] += c[m - k];
    return c;
  }
  const logBig = (x: bigint) => {
    const bits = x.toString(2).length;
    const shift = Math.max(0, bits - 60);
    return Math.log(Number(x >> BigInt(shift))) + shift * Math.LN2;
  };

  it('the exact middle coefficients of Π_{k<=b}(1 + q^k) are OEIS A063865 (solutions of ±1 ±2 ... ±b = 0)', () => {
    // A063865 (from memory): 1, 0, 0, 2, 2, 0, 0, 8, 14, 0, 0, 70, 124, 0, 0, 722, 1314 for b = 0..16.
    const a063865 = [1, 0, 0, 2, 2, 0, 0, 8, 14, 0, 0, 70, 124, 0, 0, 722, 1314];
    for (let b = 1; b <= 16; b++) {
      const S = (b * (b + 1)) / 2;
      const middle = S % 2 === 0 ? Number(exactRange(1, b, S / 2)[S / 2]) : 0;
      expect(middle, `b=${b}`).toBe(a063865[b]);
    }
  });

  // Measured worst |error| of the log-ratios against the BigInt counts: 2.2e-15 ([7, 320]),
  // 2.4e-15 ([60, 330]), 2.3e-15 ([1, 400]); of log Q itself below 1e-15 relative.
  for (const [a, b] of [[7, 320], [60, 330], [1, 400]] as const) {
    it(`parts in [${a}, ${b}]: the series' log Q and log-ratios agree with exact counts up to the middle`, () => {
      const counts = new LogDistinctBoundedCounts(a, b);
      const half = Math.floor(counts.total / 2);
      const exact = exactRange(a, b, half);
      const from = half - 9000;
      expect(counts.regime(from)).toBe('middle');
      expect(counts.regime(half)).toBe('middle');
      let worst = 0;
      for (let m = from; m <= half; m += 211) {
        for (const d of [1, 7, 100]) worst = Math.max(worst, Math.abs(counts.logRatio(m, m - d) - exactLogRatio(exact[m], exact[m - d])));
        expect(Math.abs(counts.log(m) - logBig(exact[m])) / logBig(exact[m]), `log Q(${m})`).toBeLessThan(2e-15);
        // Past the middle by symmetry: Q(S − m) = Q(m).
        expect(counts.logRatio(counts.total - m, m)).toBe(0);
      }
      expect(worst).toBeLessThan(5e-15);
    });
  }

  it('the regimes meet: log-ratios across the middle regime\'s start equal the sum of their steps', () => {
    const counts = new LogDistinctBoundedCounts(1, 2000);
    const half = Math.floor(counts.total / 2);
    let start = half;
    while (counts.regime(start - 1) === 'middle') start = Math.floor(start - (half - start) / 2 - 1);
    for (let m = start - 1; counts.regime(m) === 'middle'; m--) start = m;
    // start: the first middle m (found from below the boundary, then stepped down to it).
    expect(counts.regime(start - 1)).toBe('tail');
    const direct = counts.logRatio(start + 300, start - 300);
    const steps = counts.logRatio(start + 300, start) + counts.logRatio(start, start - 300);
    expect(Math.abs(direct - steps)).toBeLessThan(1e-12 * Math.max(1, Math.abs(direct)));
    // And one step across agrees with the tail regime's neighbouring steps (second difference small).
    const across = counts.logRatio(start, start - 1);
    const below = counts.logRatio(start - 1, start - 2);
    const above = counts.logRatio(start + 1, start);
    expect(Math.abs(across - (below + above) / 2)).toBeLessThan(1e-9);
  });

  it('the counts a maxPart = 2√n family uses at n = 1e9 are log-concave near the middle (grid)', () => {
    for (const b of [31_623, 3952, 494]) {
      const c = new LogDistinctBoundedCounts(1, b);
      const half = Math.floor(c.total / 2);
      for (let m = half; m > half / 2; m -= Math.ceil(half / 300)) {
        expect(c.logRatio(m + 1, m) - c.logRatio(m, m - 1), `b=${b} m=${m}`).toBeLessThan(0);
      }
    }
  });
});

describe('the middle regime against the tail series where both serve', () => {
  // Wide ranges serve the series out to (b + 1)t <= 2.8; from (b + 1)t = 1 the tail series is
  // accurate too (the tests above), so in the overlap the two log-ratios must agree. Measured
  // worst difference 3.6e-15. (Reaches into the class's private parts to evaluate both.)
  for (const [a, b] of [[1, 1000], [7, 5000], [1, 31_623]] as const) {
    it(`parts in [${a}, ${b}]`, () => {
      const c = new LogDistinctBoundedCounts(a, b) as unknown as {
        total: number;
        regime(m: number): string;
        logRatio(m1: number, m2: number): number;
        memo: { get(m: number): { t: number; logI: number } };
        phiDifference(m1: number, t1: number, m2: number, t2: number): number;
        middle: { saddle(m: number): number };
      };
      const half = Math.floor(c.total / 2);
      let checked = 0;
      for (let f = Math.floor(c.total * 0.1); f < half; f += Math.ceil(half / 200)) {
        if (c.regime(f) !== 'middle' || c.regime(f - 50) !== 'middle' || (b + 1) * c.middle.saddle(f - 50) < 1.05) continue;
        for (const d of [1, 50]) {
          const s1 = c.memo.get(f);
          const s2 = c.memo.get(f - d);
          const tail = c.phiDifference(f, s1.t, f - d, s2.t) + s1.logI - s2.logI;
          expect(Math.abs(c.logRatio(f, f - d) - tail), `m=${f} d=${d}`).toBeLessThan(1e-14);
        }
        checked++;
      }
      expect(checked).toBeGreaterThan(10);
    });
  }
});
