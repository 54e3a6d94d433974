import { nextBigBelow, type RandomSource } from '../random.js';
import type { CompositionSampler } from '../sampler.js';
import type { FixedCore, FreeCore } from './reduce.js';
import { partBounds, partValues } from './resolve.js';

/**
 * Exact uniform sampling by sequential choice from a table of exact counts (the recursive method
 * of Nijenhuis & Wilf, Combinatorial Algorithms 1978, ch. 13): with c(r) compositions of the
 * remainder r, the first part is v with probability c(r - v) / c(r). One uniform BigInt below
 * c(r) per part, walked down the candidate parts in ascending order, makes the choice exact —
 * no floating point anywhere. Tables are built once per planned family and owned by the sampler.
 */

/** Free length: c(0) = 1, c(m) = sum_{v in S} c(m - v), all m <= n kept. */
export function freeCountTable(core: FreeCore): bigint[] {
  const { n, parts } = core;
  const c: bigint[] = new Array(n + 1).fill(0n);
  c[0] = 1n;
  if (parts.kind === 'range') {
    // Prefix sums P(i) = c(0) + ... + c(i): c(m) = P(m - a) - P(m - b - 1).
    const prefix: bigint[] = new Array(n + 1).fill(0n);
    prefix[0] = 1n;
    for (let m = 1; m <= n; m++) {
      const hi = m - parts.min;
      const lo = m - parts.max - 1;
      c[m] = (hi >= 0 ? prefix[hi] : 0n) - (lo >= 0 ? prefix[lo] : 0n);
      prefix[m] = prefix[m - 1] + c[m];
    }
  } else {
    for (let m = 1; m <= n; m++) {
      let s = 0n;
      for (const v of parts.values) {
        if (v > m) break;
        s += c[m - v];
      }
      c[m] = s;
    }
  }
  return c;
}

export function freeTableSampler(core: FreeCore, counts: bigint[], estimate: { expectedLength: number; expectedWork: number }): CompositionSampler {
  const values = core.parts.kind === 'list' ? core.parts.values : null;
  const { min, max } = partBounds(core.parts);
  const scale = core.scale;
  return {
    method: 'count-table/1',
    ...estimate,
    sample(source: RandomSource) {
      const out: number[] = [];
      let r = core.n;
      while (r > 0) {
        let pick = nextBigBelow(source, counts[r]);
        let chosen = -1;
        if (values) {
          for (const v of values) {
            if (v > r) break;
            const w = counts[r - v];
            if (pick < w) { chosen = v; break; }
            pick -= w;
          }
        } else {
          for (let v = min; v <= Math.min(max, r); v++) {
            const w = counts[r - v];
            if (pick < w) { chosen = v; break; }
            pick -= w;
          }
        }
        if (chosen < 0) throw new Error('count table inconsistent (bug)');
        out.push(chosen * scale);
        r -= chosen;
      }
      return out;
    },
  };
}

/** Exact length: rows[j][m] = compositions of m into j parts from S (S contains 0). */
export function fixedCountTable(core: FixedCore): bigint[][] {
  const { n, k, parts } = core;
  const values = partValues(parts.kind === 'range' && parts.max > n ? { kind: 'range', min: 0, max: n } : parts);
  const rows: bigint[][] = [];
  let row: bigint[] = new Array(n + 1).fill(0n);
  row[0] = 1n;
  rows.push(row);
  for (let j = 1; j <= k; j++) {
    const next: bigint[] = new Array(n + 1).fill(0n);
    if (parts.kind === 'range') {
      let window = 0n; // sum of row[m - L .. m]
      for (let m = 0; m <= n; m++) {
        window += row[m];
        if (m - parts.max - 1 >= 0) window -= row[m - parts.max - 1];
        next[m] = window;
      }
    } else {
      for (let m = 0; m <= n; m++) {
        let s = 0n;
        for (const v of values) {
          if (v > m) break;
          s += row[m - v];
        }
        next[m] = s;
      }
    }
    rows.push(next);
    row = next;
  }
  return rows;
}

export function fixedTableSampler(core: FixedCore, rows: bigint[][], estimate: { expectedLength: number; expectedWork: number }): CompositionSampler {
  const values = core.parts.kind === 'list' ? core.parts.values : null;
  const top = partBounds(core.parts).max;
  const { shift, scale, k } = core;
  return {
    method: 'count-table/1',
    ...estimate,
    sample(source: RandomSource) {
      const out = new Array<number>(k);
      let m = core.n;
      for (let j = k; j >= 1; j--) {
        const below = rows[j - 1];
        let pick = nextBigBelow(source, rows[j][m]);
        let chosen = -1;
        if (values) {
          for (const v of values) {
            if (v > m) break;
            if (pick < below[m - v]) { chosen = v; break; }
            pick -= below[m - v];
          }
        } else {
          for (let v = 0; v <= Math.min(top, m); v++) {
            if (pick < below[m - v]) { chosen = v; break; }
            pick -= below[m - v];
          }
        }
        if (chosen < 0) throw new Error('count table inconsistent (bug)');
        out[k - j] = shift + chosen * scale;
        m -= chosen;
      }
      return out;
    },
  };
}
