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
 * instead of log₂ n). m < L is scanned unless the peak is above log c(L), which bounds every
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
    const g = Math.min(half, Math.max(from + 1, Math.round(guess)));
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
