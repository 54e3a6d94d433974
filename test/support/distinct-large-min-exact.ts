import { LogDistinctBoundedCounts, defaultDistinctExactUpTo } from '../../src/core/counting/log-distinct-bounded-count.js';

/**
 * Exact Q_a(m) (partitions of m into distinct parts >= a) as BigInts, by number of parts: j
 * distinct parts λ_1 > ... > λ_j >= a of m are, less a + (j − i) from the i-th, the partitions of
 * m − ja − j(j − 1)/2 into at most j parts (Andrews 1976, "The theory of partitions", §1.3),
 * counted by p_j(M) = p_{j−1}(M) + p_j(M − j). Independent of the doubles' code path (BigInt).
 */
export function exactLargeMinCounts(a: number, upTo: number): bigint[] {
  const c = new Array<bigint>(upTo + 1).fill(0n);
  c[0] = 1n;
  const p = new Array<bigint>(upTo + 1).fill(0n);
  p[0] = 1n;
  for (let j = 1; ; j++) {
    const base = j * a + (j * (j - 1)) / 2;
    if (base > upTo) break;
    for (let M = j; M <= upTo - base; M++) p[M] += p[M - j];
    for (let m = base; m <= upTo; m++) c[m] += p[m - base];
  }
  return c;
}

function exactLogRatio(x: bigint, y: bigint): number {
  if (x >= y) return Math.log1p(Number(((x - y) << 200n) / y) / 2 ** 200);
  return -Math.log1p(Number(((y - x) << 200n) / x) / 2 ** 200);
}

function exactLog(x: bigint): number {
  const bits = x.toString(2).length;
  return bits <= 60 ? Math.log(Number(x)) : Math.log(Number(x >> BigInt(bits - 60))) + (bits - 60) * Math.LN2;
}

/**
 * Parts >= a above 200 (distinct parts >= 2a, up to 2a = 800, through the self-similar levels):
 * the parts below a enter the integral through the log cosh series (log-distinct-bounded-count.ts,
 * headSeries). Checked as for a <= 200 (test/partitions/log-distinct-bounded-count.test.ts): from
 * the default table's end on, log-ratios against exact BigInt counts.
 */
export function checkAboveTable(a: number, span: number, stride: number): { worstRatio: number; worstLog: number } {
  const from = defaultDistinctExactUpTo(a) + 1;
  const upTo = from + span;
  const exact = exactLargeMinCounts(a, upTo);
  const counts = new LogDistinctBoundedCounts(a, Infinity, 0); // integral everywhere
  let worstRatio = 0;
  let worstLog = 0;
  for (let m = from; m <= upTo; m += stride) {
    for (const d of [1, 7, 100]) worstRatio = Math.max(worstRatio, Math.abs(counts.logRatio(m, m - d) - exactLogRatio(exact[m], exact[m - d])));
    const l = exactLog(exact[m]);
    worstLog = Math.max(worstLog, Math.abs(counts.log(m) - l) / l);
  }
  return { worstRatio, worstLog };
}
