import { partsTableWork } from './parts-table-work.js';
/**
 * Count tables for partitions into parts in [a, b] up to a size (log-bounded-part-count.ts fills
 * its table with the cheaper of the two): factor by factor, or by number of parts.
 */

/** c(m) for m <= end, factor by factor: c(m) += c(m − k) for k = a, ..., b (positive additions only). */
export function countsByFactors(a: number, b: number, end: number): Float64Array {
  const c = new Float64Array(end + 1);
  c[0] = 1;
  const top = Math.min(b, end);
  for (let k = a; k <= top; k++) for (let m = k; m <= end; m++) c[m] += c[m - k];
  return c;
}

export function factorWork(a: number, b: number, end: number): number {
  const top = Math.min(b, end);
  return top < a ? 0 : ((top - a + 1) * (2 * end - a - top + 2)) / 2;
}

/**
 * Where few parts fit (end / a well below b − a), the same counts by number of parts: with
 * T(j, m) the partitions of m into exactly j parts in [a, b], c(m) = Σ_j T(j, m) and
 *   T(j, m) = T(j − 1, m − a) + [T(j, m − j) − T(j − 1, m − j − b)]
 * (a part equal to a, removed; else every part in [a + 1, b], less 1 each: j parts in [a, b − 1]
 * of m − j, which are those in [a, b] less the ones with a part b, removed), T(0, 0) = 1; and
 * T(j, m) = T(j, j(a + b) − m) (each part p ↔ a + b − p). The recurrence is used up to the middle
 * j(a + b)/2 only, where the bracket, a count itself, is not a near-cancellation (few of those
 * partitions have a part b); the upper half is the mirror. Two rows of end + 1 doubles, about
 * (end/a)·end steps. Checked against the factor table (relative differences ~1e-14,
 * test/partitions/log-bounded-part-count.test.ts).
 */
export function countsByParts(a: number, b: number, end: number): Float64Array {
  const c = new Float64Array(end + 1);
  c[0] = 1;
  let previous = new Float64Array(end + 1);
  previous[0] = 1;
  let row = new Float64Array(end + 1);
  for (let j = 1; j * a <= end; j++) {
    row.fill(0);
    const top = Math.min(j * b, end);
    const span = j * (a + b);
    const middle = Math.floor(span / 2);
    for (let m = j * a; m <= top; m++) {
      let v: number;
      if (m > middle) v = row[span - m];
      else {
        const rest = m - j;
        v = previous[m - a] + (row[rest] - (rest - b >= 0 ? previous[rest - b] : 0));
      }
      row[m] = v;
      c[m] += v;
    }
    [previous, row] = [row, previous];
  }
  return c;
}

/** The additions of countsByParts, in closed form (parts-table-work.ts). */
export function partsWork(a: number, b: number, end: number): number {
  return partsTableWork(a, b, end);
}
