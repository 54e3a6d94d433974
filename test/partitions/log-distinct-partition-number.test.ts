import { describe, expect, it } from 'vitest';
import { DistinctPartitionNumbers } from '../../src/core/counting/distinct-partition-numbers.js';
import { LogDistinctPartitionNumbers } from '../../src/core/counting/log-distinct-partition-number.js';
import { DistinctPartitionTable } from '../../src/core/partitions/distinct-table.js';

const exact = new DistinctPartitionNumbers().upTo(20_000);
const logQ = new LogDistinctPartitionNumbers();

/** log(a/b) for BigInts a >= b > 0 with a/b < 2^50, to ~1 ulp of the result: log1p of (a − b)/b scaled. */
function logRatioBig(a: bigint, b: bigint): number {
  const scale = 10n ** 40n;
  return Math.log1p(Number(((a - b) * scale) / b) / 1e40);
}

/** log of a positive BigInt (all q(m) here are below 1e308). */
const logBig = (a: bigint): number => Math.log(Number(a));

describe('exact q(n), partitions into distinct parts', () => {
  it('matches OEIS A000009 for n = 0..31 (values from memory of the OEIS entry)', () => {
    expect(exact.slice(0, 32).map(Number)).toEqual([
      1, 1, 1, 2, 2, 3, 4, 5, 6, 8, 10, 12, 15, 18, 22, 27, 32, 38, 46, 54, 64, 76, 89, 104, 122, 142, 165, 192, 222, 256, 296, 340,
    ]);
    // A000009(100) = 444793 (OEIS entry, from memory).
    expect(exact[100]).toBe(444_793n);
  });

  it('agrees with the subset-sum recurrence Π(1 + x^k) up to n = 600', () => {
    const N = 600;
    const d: bigint[] = new Array(N + 1).fill(0n);
    d[0] = 1n;
    for (let k = 1; k <= N; k++) for (let m = N; m >= k; m--) d[m] += d[m - k];
    expect(exact.slice(0, N + 1)).toEqual(d);
  });

  it('is strictly log-concave from 33 to 20,000, and not at 32 (the planner relies on it)', () => {
    expect(exact[32] * exact[32] <= exact[31] * exact[33]).toBe(true);
    for (let m = 33; m < 20_000; m++) {
      if (!(exact[m] * exact[m] > exact[m - 1] * exact[m + 1])) throw new Error(`not log-concave at ${m}`);
    }
  });

  it('fits the base table: q(566) < 2^53 <= q(567), and the table agrees with q', () => {
    expect(exact[566] < 2n ** 53n).toBe(true);
    expect(exact[567] >= 2n ** 53n).toBe(true);
    const table = new DistinctPartitionTable(DistinctPartitionTable.MAX_N);
    for (let m = 0; m <= DistinctPartitionTable.MAX_N; m++) expect(table.count(m, m)).toBe(Number(exact[m]));
  });
});

describe('log q(m) and its ratios', () => {
  it('log q(m) is the exact value rounded up to 2000, and Hua\'s leading term within 1e-15 relative above', () => {
    for (let m = 0; m <= 2000; m += 13) expect(logQ.log(m)).toBe(Math.log(Number(exact[m])));
    for (let m = 2001; m <= 20_000; m += 7) {
      const e = logBig(exact[m]);
      expect(Math.abs(logQ.log(m) - e) / e, `m = ${m}`).toBeLessThan(1e-15);
    }
  });

  it('the leading term of Hua\'s series already matches q(m) at m = 1000..2000 (ratios across the table end)', () => {
    // logRatio(a, m) with m <= 2000 < a uses Hua's term on both sides: accurate to ulps of the ratio.
    for (let m = 1000; m <= 2000; m += 1) {
      for (const a of [2001, 2002, 2500, 5000]) {
        const want = logRatioBig(exact[a], exact[m]);
        expect(Math.abs(logQ.logRatio(a, m) - want) / want, `m = ${m}, a = ${a}`).toBeLessThan(2e-15);
      }
    }
  });

  it('log-ratios are accurate to a few ulps of the ratio (not of log q) up to 20,000', () => {
    let worst = 0;
    for (let m = 2001; m < 20_000; m += 7) {
      for (const d of [1, 2, 13, 500]) {
        if (m + d > 20_000) continue;
        const want = logRatioBig(exact[m + d], exact[m]);
        worst = Math.max(worst, Math.abs(logQ.logRatio(m + d, m) - want) / want);
        worst = Math.max(worst, Math.abs(logQ.logRatio(m, m + d) + want) / want);
      }
    }
    expect(worst).toBeLessThan(2e-15);
  });

  it('rejects arguments outside [0, 1e9]', () => {
    expect(() => logQ.log(-1)).toThrow(RangeError);
    expect(() => logQ.logRatio(1.5, 2)).toThrow(RangeError);
    expect(() => logQ.log(1e9 + 1)).toThrow(RangeError);
  });
});
