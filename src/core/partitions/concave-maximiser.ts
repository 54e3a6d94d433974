/** What the maximiser needs of a count family c. */
export interface LogConcaveCounts {
  logRatio(m1: number, m2: number): number;
  log(m: number): number;
  /** From here on the counts are log-concave in m (a local maximum of the weight is global). */
  logConcaveFrom(): number;
}

/**
 * The maximiser M of a self-similar level's acceptance: argmax over integers 0 <= m <= n/2 of
 * the weight log c(m) + 2m·logX (x < 1, or any x for a finite largest part). Above L = logConcaveFrom() the weight is concave, so the
 * last m with a positive forward difference is found by bisection on [L, n/2] (with a guess, the
 * answer is first bracketed by galloping from it: the same answer in ~log₂|guess error| counts
 * instead of log₂ n; the guess first refined by a few secant steps on the forward difference,
refine() below). m < L is scanned unless the peak is above log c(L), which bounds every
 * weight there (c non-decreasing from its smallest part on — add 1 to the largest part — and
 * zero below it except c(0) = 1, and x < 1). With n/2 <= L, a direct scan (c(0) = 1 > 0).
 */
export function concaveMaximiser(counts: LogConcaveCounts, n: number, logX: number, guess?: number): number {
  const half = Math.floor(n / 2);
  const weight = (a: number, b: number) => counts.logRatio(a, b) + 2 * (a - b) * logX;
  const from = counts.logConcaveFrom();
  if (half <= from) {
    let best = 0;
    for (let m = 1; m <= half; m++) if (weight(m, best) > 0) best = m;
    return best;
  }
  // rises(m): weight(m) > weight(m − 1); true then false on (from, half] (concave).
  const rises = (m: number) => weight(m, m - 1) > 0;
  let lo = from; // rises(lo) or lo = from
  let hi = half; // the answer is <= hi
  if (guess !== undefined && Number.isFinite(guess)) {
    const g = refine(weight, Math.min(half, Math.max(from + 1, Math.round(guess))), from + 1, half);
    if (rises(g)) {
      lo = g;
      for (let step = 1; ; step *= 2) {
        const probe = g + step;
        if (probe > half) break;
        if (!rises(probe)) {
          hi = probe - 1;
          break;
        }
        lo = probe;
      }
    } else {
      hi = g - 1;
      for (let step = 1; ; step *= 2) {
        const probe = g - step;
        if (probe <= from) break;
        if (rises(probe)) {
          lo = probe;
          break;
        }
        hi = probe - 1;
      }
    }
  }
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (rises(mid)) lo = mid;
    else hi = mid - 1;
  }
  let m = lo;
  // Every weight below `from` is at most log c(from) + 2·from·max(0, logX) (see above; x > 1 only
  // for a finite largest part past the middle of its range).
  if (counts.log(m) + 2 * m * logX < counts.log(from) + 2 * from * Math.max(0, logX)) {
    for (let k = 0; k < from; k++) if (weight(k, m) > 0) m = k;
  }
  return m;
}

/**
 * A better starting point for the exact search: secant steps on the forward difference
 * d(m) = weight(m) − weight(m − 1), decreasing on [lo, hi] (concave weight), whose last positive
 * m is the answer. Near the peak d is nearly linear (its slope changes over a scale ~m), so from
 * a guess off by E two or three steps land within ±1 (2 counts each, memoised by the counts)
 * where galloping took ~4·log₂E counts (n = 2e8, a = 300: 31 counts at the top level, E ~ 2e4).
 * Only the starting point changes: the search after it is exact, so the answer is the same.
 */
function refine(weight: (a: number, b: number) => number, g: number, lo: number, hi: number): number {
  const d = (m: number) => weight(m, m - 1);
  let m0 = g;
  let d0 = d(m0);
  let m1 = Math.min(hi, Math.max(lo, m0 + (d0 > 0 ? 1 : -1) * Math.max(2, Math.round(Math.sqrt(m0)))));
  for (let step = 0; step < SECANT_STEPS && m1 !== m0; step++) {
    const d1 = d(m1);
    // The real root of the line through (m0, d0), (m1, d1): the answer is its floor.
    const root = m1 - (d1 * (m1 - m0)) / (d1 - d0);
    if (!Number.isFinite(root)) break;
    const next = Math.min(hi, Math.max(lo, Math.floor(root)));
    m0 = m1;
    d0 = d1;
    if (Math.abs(next - m1) <= 1) return next;
    m1 = next;
  }
  return m1;
}
const SECANT_STEPS = 4;
