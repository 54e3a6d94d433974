import { chiSquareTest } from './chi-square.js';

/**
 * Exact laws of statistics of uniform partitions from counting recurrences, in doubles by
 * additions of positives only (independent of the library's counting code), and the chi-square
 * of observed values against such a law. Used by test/verify/method-laws.verify.ts.
 */

/** A law: value -> probability. */
export type Law = Map<number, number>;

/** p(m, c) for m <= n, c <= kMax: rows[c][m] (doubles; additions only). */
export function exactlyPartsRows(n: number, kMax: number): Float64Array[] {
  const rows = [new Float64Array(n + 1)];
  rows[0][0] = 1;
  for (let c = 1; c <= kMax; c++) {
    const row = new Float64Array(n + 1);
    const prev = rows[c - 1];
    for (let m = c; m <= n; m++) row[m] = prev[m - 1] + row[m - c];
    rows.push(row);
  }
  return rows;
}

/** The sizes lo..hi. */
export const range = (lo: number, hi: number) => Array.from({ length: hi - lo + 1 }, (_, i) => lo + i);

/**
 * Knapsack over the sizes (ascending; 0/1 when distinct), tracking the number of parts c <= kMax:
 * the laws of the largest part and of the number of parts over members with kMin <= c <= kMax,
 * their count, and the final table ways[c][m] (members of m with c parts).
 */
export function knapsackLaws(n: number, sizes: readonly number[], distinct: boolean, kMin: number, kMax: number): { largest: Law; parts: Law; total: number; ways: Float64Array[] } {
  const ways = Array.from({ length: kMax + 1 }, () => new Float64Array(n + 1));
  ways[0][0] = 1;
  const upTo: number[] = [];
  for (const j of sizes) {
    if (distinct) {
      for (let c = kMax; c >= 1; c--) for (let m = n; m >= j; m--) ways[c][m] += ways[c - 1][m - j];
    } else {
      for (let c = 1; c <= kMax; c++) for (let m = j; m <= n; m++) ways[c][m] += ways[c - 1][m - j];
    }
    let members = 0;
    for (let c = kMin; c <= kMax; c++) members += ways[c][n];
    upTo.push(members);
  }
  const total = upTo[upTo.length - 1];
  const largest: Law = new Map();
  upTo.forEach((v, i) => {
    const mass = v - (i === 0 ? 0 : upTo[i - 1]);
    if (mass > 0) largest.set(sizes[i], mass / total);
  });
  const parts: Law = new Map();
  for (let c = kMin; c <= kMax; c++) if (ways[c][n] > 0) parts.set(c, ways[c][n] / total);
  return { largest, parts, total, ways };
}

/** A law from a survival function P(X >= v) given at v = from, from + 1, ... (0 past the support). */
export function fromSurvival(from: number, survival: (v: number) => number): Law {
  const law: Law = new Map();
  for (let v = from; ; v++) {
    const here = survival(v);
    if (here <= 0) break;
    const mass = here - survival(v + 1);
    if (mass > 0) law.set(v, mass);
  }
  return law;
}

/** Chi-square of observed values against a law, adjacent values pooled until each cell expects >= 20. */
export function lawPValue(observed: Map<number, number>, law: Law, samples: number): { pValue: number; cells: number } {
  const values = [...law.keys()].sort((a, b) => a - b);
  const o: number[] = [];
  const p: number[] = [];
  let ao = 0;
  let ap = 0;
  for (const v of values) {
    ao += observed.get(v) ?? 0;
    ap += law.get(v)!;
    if (ap * samples >= 20) {
      o.push(ao);
      p.push(ap);
      ao = 0;
      ap = 0;
    }
  }
  if (ap > 0 || ao > 0) {
    o[o.length - 1] += ao;
    p[p.length - 1] += ap;
  }
  // Values outside the law's support would be non-members, checked separately.
  const { pValue } = chiSquareTest(o, p);
  return { pValue, cells: o.length };
}
