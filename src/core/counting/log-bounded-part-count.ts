import { countsByFactors, countsByParts, factorWork, partsWork } from './bounded-count-tables.js';
import { boundedSaddle, realDerivatives, realL, shapeOf, type Shape } from './bounded-log-generating.js';
import { BOUNDED_MAX_M, defaultTableEnd, mainArcHolds } from './bounded-main-arc.js';
import { computeSaddle, envelopeIntegral } from './bounded-saddle-integral.js';
import { SaddleMemo } from './saddle-memo.js';

export { countsByFactors, countsByParts } from './bounded-count-tables.js';
export { DIRECT_BELOW, boundedPartSaddle, boundedSaddle } from './bounded-log-generating.js';
export { A_MIN, arcDamping, defaultTableEnd, mainArcHolds, mainArcStart } from './bounded-main-arc.js';

/**
 * log c(m), c(m) = c_{[a,b]}(m) the number of partitions of m into parts in [a, b] (1 <= a, b
 * finite; OEIS A008284 row sums / A026820 for a = 1: partitions of m into parts <= b), for
 * 0 <= m <= 1e9, with log-ratios log(c(m1)/c(m2)).
 *
 * - m <= exactUpTo: a table (filled on the first request that needs it) built factor by factor, c(m) += c(m − k) for k = a, ..., b (the
 *   generating function Π_{k=a}^{b} 1/(1 − q^k)); additions of positive numbers only, so each
 *   double carries a relative error of at most ~m roundings.
 * - m > exactUpTo: the saddle-point integral of the circle method's main arc,
 *     c(m) ≈ (1/2π) ∫ exp φ(t + iy) dy,  φ(τ) = mτ + L(τ),  L(τ) = −Σ_{k=a}^{b} log(1 − e^{−kτ}),
 *   along the vertical line through the real saddle point t (φ'(t) = 0, Newton), by the
 *   trapezoidal rule (saddle-trapezoid.ts, as log-min-part-count.ts: Trefethen & Weideman 2014,
 *   SIAM Review 56, §5). L is evaluated in O(1) terms per node whatever b:
 *     * b < DIRECT_BELOW: the sum itself (< 16 terms);
 *     * else L = log P(e^{−τ}) + Σ_{k<a} log(1 − e^{−kτ}) + S_b(τ), with log P from the modular
 *       transformation of the Dedekind eta function (Apostol 1990, Thm 3.1; as
 *       log-min-part-count.ts), and S_c(τ) = Σ_{k>c} log(1 − e^{−kτ}) by the Euler–Maclaurin
 *       formula from c + ½ (midpoint form; Abramowitz & Stegun 23.1.32 / DLMF 2.10.1):
 *         S_c = −Li₂(e^{−u})/τ + Σ_{j=1}^{8} β_j τ^{2j−1} f^{(2j−1)}(u),  u = (c + ½)τ,
 *       f(u) = log(1 − e^{−u}), β_j = −B_{2j}(½)/(2j)!, B_{2j}(½) = −(1 − 2^{1−2j})B_{2j}. The
 *       dropped term is ~ 2·16!/((2π)^{18} c^{17}) (~1e-21 at c = 16); when a − 1 >= DIRECT_BELOW
 *       the head sum is replaced the same way (L = −S_{a−1} + S_b).
 *   Li₂(e^{−u}) (complex u, Re u > 0) is the power series Σ e^{−ju}/j² for Re u >= 1, else the
 *   Bernoulli expansion π²/6 − u + u log u − u²/4 + Σ_j B_{2j} u^{2j+1}/(2j (2j+1)!) (DLMF 25.12.12
 *   with the series of Li_s(e^μ) at s = 2, |u| < 2π).
 *
 * Where the main arc is accurate: for parts <= b the generating function also has poles of order
 * ⌊b/2⌋ at q = −1 (and lower orders at the other roots of unity of order <= b), so the arcs the
 * integral drops are small only when the odd sizes damp the arc at −1 enough. On |q| = e^{−t},
 * |G(−q)|/G(q) = exp(−A(t)), A(t) = Σ_{odd k∈[a,b]} log coth(kt/2); each term grows as t falls,
 * i.e. as m grows. `mainArcStart` is the m (+10%) whose saddle has A = A_MIN = 36; the table must
 * reach it (defaultTableEnd). A_MIN was set by comparing with exact BigInt counts
 * (test/partitions/log-bounded-part-count.test.ts): log-ratio errors fall to ~1e-15 once A is
 * past ~30 (b = 2 has A ~ log m: never, as its count ⌊m/2⌋ + 1 has a parity term).
 *
 * Log-ratios (the sampler's acceptance) avoid subtracting values of size √m: above the table
 * log c(m1) − log c(m2) = [φ_{m1}(t1) − φ_{m2}(t2)] + log I1 − log I2, the bracket as
 * ∫_{m2}^{m1} t(μ) dμ (the envelope theorem, Gauss–Legendre; envelopeIntegral) and the integrands
 * exp(φ(t + iy) − φ(t)) from differences formed term by term (shift, tailShift). Measured against
 * exact BigInt counts (test file, m <= 6e4): <= 3e-15 with direct sums, <= 1.6e-14 with the
 * Euler–Maclaurin tails; against the direct sum at m up to 1e7: ~1e-14 of the ratio's size.
 * log c itself is φ(t) + log I in doubles (relative error ~1e-15). The trapezoid's step also
 * respects the pole of order b − a + 1 at τ = 0, at distance t from the line (poleStep).
 */
export class LogBoundedPartCounts {
  /** Largest m accepted (the service's limit on n). */
  static readonly MAX_M = BOUNDED_MAX_M;

  /** The table (c and log c up to exactUpTo), filled on the first request that needs it. */
  private filled: { readonly exact: Float64Array; readonly logExact: Float64Array } | null = null;
  private readonly memo = new SaddleMemo((m) => computeSaddle(this.shape, m));
  private concaveFrom = -1;
  private prefixMax: Float64Array | null = null;
  private readonly shape: Shape;

  constructor(
    readonly a: number,
    readonly b: number,
    readonly exactUpTo: number = defaultTableEnd(a, b, DEFAULT_CAP),
    /** Sum L term by term whatever b (tests: the Euler–Maclaurin form is checked against it). */
    direct = false,
  ) {
    if (!Number.isInteger(a) || a < 1) throw new RangeError(`a must be an integer >= 1, got ${a}`);
    if (!Number.isInteger(b) || b < 0) throw new RangeError(`b must be a non-negative integer, got ${b}`);
    if (!Number.isInteger(exactUpTo) || exactUpTo < 0) throw new RangeError(`exactUpTo must be a non-negative integer, got ${exactUpTo}`);
    this.shape = direct ? { a, b, direct: true, headDirect: true } : shapeOf(a, b);
  }

  /**
   * The table, filled on first use (setupWork additions): a sampler whose sizes all lie where
   * the main arc is accurate never fills it (boundedMaximiser bounds the weights below it by
   * logWeightBound instead of scanning them).
   */
  private table(): { readonly exact: Float64Array; readonly logExact: Float64Array } {
    if (this.filled === null) {
      const { a, b, exactUpTo } = this;
      const c = partsWork(a, b, exactUpTo) < factorWork(a, b, exactUpTo) ? countsByParts(a, b, exactUpTo) : countsByFactors(a, b, exactUpTo);
      this.filled = { exact: c, logExact: c.map(Math.log) };
    }
    return this.filled;
  }

  /** Whether the table has been filled (a sampler's first requests below exactUpTo fill it). */
  get tableFilled(): boolean {
    return this.filled !== null;
  }

  /**
   * An upper bound on max_{0 <= m <= m0} [log c(m) + m·slope] (slope < 0) without the table:
   * for every τ > 0, c(m) e^{−τm} <= Σ_j c(j) e^{−τj} = exp L(τ) (all terms positive), so
   * log c(m) + m·slope <= L(τ) + m(τ + slope) <= L(τ) + m0(τ + slope) when τ >= −slope; τ is the
   * saddle point of m0 (the Chernoff bound at m0) when that is >= −slope, else −slope. Rounded
   * up by 1e-9 relative plus 1e-6 (L by the same sums as the counts, relative error ~1e-15).
   */
  logWeightBound(m0: number, slope: number): number {
    if (!(slope < 0)) throw new RangeError(`the slope must be negative, got ${slope}`);
    if (m0 < 1 || this.b < this.a) return 0;
    const tau = Math.max(-slope, boundedSaddle(this.shape, m0));
    const bound = realL(this.shape, tau) + m0 * (tau + slope);
    return bound + 1e-9 * Math.abs(bound) + 1e-6;
  }

  /** Additions filling the table (setup work, paid on its first use). */
  static setupWork(a: number, b: number, exactUpTo: number): number {
    return Math.min(factorWork(a, b, exactUpTo), partsWork(a, b, exactUpTo));
  }

  /** Whether m lies where the main arc is accurate (or in the table). */
  covers(m: number): boolean {
    return m <= this.exactUpTo || this.b < this.a || mainArcHolds(this.a, this.b, m);
  }

  /**
   * The smallest L with c(m)² >= c(m − 1)·c(m + 1) for all L < m < exactUpTo (exact check on
   * the table). Above the table the values are the main-arc integral, concave in m (checked on
   * a grid in the test file).
   */
  logConcaveFrom(): number {
    if (this.concaveFrom < 0) {
      const c = this.table().exact;
      let from = 0;
      // A zero inside counts as a failure too (a log-concave sequence has no internal zeros).
      for (let m = 1; m < this.exactUpTo; m++) if (c[m] === 0 || c[m] * c[m] < c[m - 1] * c[m + 1]) from = m;
      this.concaveFrom = from;
    }
    return this.concaveFrom;
  }

  /** max_{m' <= m} log c(m'), m <= exactUpTo. */
  logMaxUpTo(m: number): number {
    if (this.prefixMax === null) {
      const p = new Float64Array(this.exactUpTo + 1);
      const { logExact } = this.table();
      let best = -Infinity;
      for (let i = 0; i <= this.exactUpTo; i++) p[i] = best = Math.max(best, logExact[i]);
      this.prefixMax = p;
    }
    return this.prefixMax[m];
  }

  /** c(m) as a double, m <= exactUpTo. */
  value(m: number): number {
    if (!(m <= this.exactUpTo)) throw new RangeError(`c(m) as a double is tabulated up to ${this.exactUpTo}, got ${m}`);
    return this.table().exact[m];
  }

  /** log c(m) (−Infinity where c(m) = 0). */
  log(m: number): number {
    checkArgument(m);
    if (m <= this.exactUpTo) return this.table().logExact[m];
    if (this.b < this.a) return -Infinity;
    const s = this.memo.get(m);
    return s.phi + s.logI;
  }

  /** log(c(m1)/c(m2)) (NaN when both are 0). */
  logRatio(m1: number, m2: number): number {
    if (m1 === m2) return 0;
    if (m1 <= this.exactUpTo && m2 <= this.exactUpTo) {
      const { exact } = this.table();
      return Math.log(exact[m1] / exact[m2]);
    }
    if (m1 <= this.exactUpTo || m2 <= this.exactUpTo || this.b < this.a) return this.log(m1) - this.log(m2);
    const s1 = this.memo.get(m1);
    const s2 = this.memo.get(m2);
    return envelopeIntegral(this.shape, m2, m1) + s1.logI - s2.logI;
  }

  /**
   * The slope proxy of log c at m − ½: t(m − ½) − ½·(log φ''(t_m) − log φ''(t_{m−1})) (the
   * saddle-point approximation's derivative: envelope plus the change of the Gaussian width).
   */
  slopeProxy(m: number, guess?: number): [number, number] {
    const tm = boundedSaddle(this.shape, m - 0.5, guess);
    // t_m, t_{m−1} ≈ t(m − ½) ∓ 1/(2φ''): first order is enough for a proxy.
    const d = 0.5 / realDerivatives(this.shape, m - 0.5, tm)[1];
    const w1 = realDerivatives(this.shape, m, tm - d)[1];
    const w0 = realDerivatives(this.shape, m - 1, tm + d)[1];
    return [tm - 0.5 * Math.log1p((w1 - w0) / w0), tm];
  }
}

/** The default table end is capped here (a sampler passes the largest size it needs). */
const DEFAULT_CAP = 1_000_000;

function checkArgument(m: number): void {
  if (!Number.isInteger(m) || m < 0 || m > LogBoundedPartCounts.MAX_M) {
    throw new RangeError(`m must be an integer in [0, ${LogBoundedPartCounts.MAX_M}], got ${m}`);
  }
}
