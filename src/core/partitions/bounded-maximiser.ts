import { LogBoundedPartCounts } from '../counting/log-bounded-part-count.js';
import { FallingDifferences, bracketedLastRise } from './falling-differences.js';

/**
 * argmax over integers 0 <= m <= n/2 of log c(m) + 2m·logX for parts in [a, b]. Above from (the
 * last log-concavity failure of the table; above the table the main-arc values, concave: checked
 * on a grid in the tests) the forward difference D(m) = w(m) − w(m − 1) falls, so the maximiser
 * is the last m with D(m) > 0. A guess comes from bisection on a cheap proxy of D above the table
 * (LogBoundedPartCounts.slopeProxy: the saddle-point approximation's slope, no integrals); from
 * it a galloping search with exact differences finds the last m with D(m) > 0 (exact whatever
 * the proxy's error; it only sets the number of exact steps, ~2·log₂ of the guess's distance).
 * Below from, the sizes m' < from are scanned unless the peak's weight is at least
 * max_{m' <= from} log c(m'), which bounds every weight there (x < 1). c may vanish (parts in
 * [a, b] miss some sizes); such m lie below from and are never the maximiser. While the table is
 * not filled (large smallest parts: the sizes a level reaches lie far above it), the search runs
 * above the table only and the weights below are bounded in closed form (logWeightBound), so the
 * table is filled only if a proposal lands there.
 */
export function boundedMaximiser(counts: LogBoundedPartCounts, n: number, logX: number, differences?: FallingDifferences): number {
  const half = Math.floor(n / 2);
  const weight = (k: number) => counts.log(k) + 2 * k * logX;
  // D(m) > 0, exactly (remembered in `differences` when given).
  const rises = differences === undefined ? (m: number) => counts.logRatio(m, m - 1) + 2 * logX > 0 : (m: number) => differences.at(m) + 2 * logX > 0;
  // Table not filled yet: search the main-arc sizes above it, and keep the result when the
  // bound on every weight below it (logWeightBound) is under it. Where the weight is unimodal
  // this is the maximiser the search with the table finds (the same values), so the choice
  // does not depend on whether an earlier sample filled the table.
  // When the bound does not decide, a maximiser found strictly above `above` (D(m) > 0 there) is
  // also the last rise on the table's concave range, so only the scan below it remains.
  const above = counts.exactUpTo + 1;
  let interior: number | null = null;
  if (!counts.tableFilled && above < half) {
    const m = concaveArgmax(counts, above, half, logX, rises, differences);
    if (weight(m) > counts.logWeightBound(counts.exactUpTo, 2 * logX)) return m;
    if (m > above) interior = m;
  }
  const from = Math.min(counts.logConcaveFrom(), half);
  let m = interior ?? concaveArgmax(counts, from, half, logX, rises, differences);
  if (from > 0 && weight(m) < counts.logMaxUpTo(Math.min(from, counts.exactUpTo))) {
    let best = weight(m);
    for (let k = 0; k < from; k++) {
      const w = weight(k);
      if (w > best) {
        best = w;
        m = k;
      }
    }
  }
  return m;
}

/**
 * The last m in [from, half] whose forward difference D(m) = w(m) − w(m − 1) is positive (from
 * when none), w(m) = log c(m) + 2m·logX concave on [from, half]: bracketed by the remembered
 * differences when they are narrow (falling-differences.ts), else a guess by bisection on the
 * slope proxy, then galloping and bisection on exact differences. Counts below `from` are not read.
 */
function concaveArgmax(
  counts: LogBoundedPartCounts,
  from: number,
  half: number,
  logX: number,
  rises: (m: number) => boolean,
  differences?: FallingDifferences,
): number {
  if (differences !== undefined) {
    const m = bracketedLastRise(differences, (d) => d + 2 * logX > 0, from, half);
    if (m !== null) return m;
  }
  let guessT: number | undefined;
  const proxyRises = (m: number) => {
    if (m - 1 <= counts.exactUpTo) return rises(m);
    const [slope, tm] = counts.slopeProxy(m, guessT);
    guessT = tm;
    return slope + 2 * logX > 0;
  };
  // Guess: the last m in [from, half] whose proxy rises.
  let good = from;
  let bad = half + 1;
  while (bad - good > 1) {
    const mid = Math.floor((good + bad) / 2);
    if (proxyRises(mid)) good = mid;
    else bad = mid;
  }
  // Exact: the last m in [from, half] with D(m) > 0 (from itself when none), by galloping from the guess.
  const g = good;
  if (g > from && !rises(g)) {
    bad = g;
    let step = 1;
    while (bad - step > from && !rises(bad - step)) {
      bad -= step;
      step *= 2;
    }
    good = Math.max(from, bad - step);
  } else {
    good = g;
    let step = 1;
    while (good + step <= half && rises(good + step)) {
      good += step;
      step *= 2;
    }
    bad = Math.min(half + 1, good + step);
  }
  while (bad - good > 1) {
    const mid = Math.floor((good + bad) / 2);
    if (rises(mid)) good = mid;
    else bad = mid;
  }
  return good;
}
