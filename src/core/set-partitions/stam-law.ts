import { DiscreteLaw, windowAround } from './discrete-law.js';
import { logFactorial } from './log-poisson.js';

/**
 * The number of urns M in Stam's algorithm: P(M = m) = m^n / (m!·e·B_n), m >= 1, a law that sums
 * to 1 by Dobinski's formula B_n = (1/e)·sum m^n/m! (Dobinski 1877; DLMF 26.7.5 — reference
 * from memory). Its moments are ratios of Bell numbers, E[M] = B_(n+1)/B_n and
 * E[M²] = B_(n+2)/B_n, since m·m^n = m^(n+1).
 *
 * The weights are log-concave in m with a mode near n / W(n) (W the Lambert function), so the
 * table is the window of the mode (see windowAround): a few thousand entries at n = 10^7.
 */
export interface StamLaw {
  readonly law: DiscreteLaw;
  /** ln B_n, from the same sum (accurate to ~1e-13 relative; for sizes and estimates only). */
  readonly logBell: number;
}

/** The mode of m^n/m!: the m where n·ln((m+1)/m) falls below ln(m+1). */
function mode(n: number): number {
  // n/m - ln(m + 1/2) is decreasing in m; bisection for its root, then the integer next to it.
  let lo = 1;
  let hi = Math.max(2, n);
  for (let i = 0; i < 200 && hi - lo > 1; i++) {
    const mid = Math.floor((lo + hi) / 2);
    if (n / mid - Math.log(mid + 0.5) > 0) lo = mid;
    else hi = mid;
  }
  return n * Math.log1p(1 / lo) > Math.log(lo + 1) ? hi : lo;
}

export function stamLaw(n: number): StamLaw {
  if (n < 1) throw new RangeError('Stam\'s law needs n >= 1');
  const m0 = mode(n);
  // ln((m+1)^n/(m+1)!) - ln(m^n/m!) = n·ln(1 + 1/m) - ln(m + 1).
  const { lo, logWeights } = windowAround(m0, 1, Number.MAX_SAFE_INTEGER, (m) => n * Math.log1p(1 / m) - Math.log(m + 1));
  const law = new DiscreteLaw(lo, logWeights);
  return { law, logBell: law.logTotal + n * Math.log(m0) - logFactorial(m0) - 1 };
}

/**
 * ln B_n for any n >= 0 (B_0 = 1), by Dobinski's sum as above. For sizes of counts and limits;
 * exact Bell numbers are in counts.ts.
 */
export function logBellNumber(n: number): number {
  return n === 0 ? 0 : stamLaw(n).logBell;
}
