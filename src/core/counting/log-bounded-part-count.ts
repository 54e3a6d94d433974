import { log1mExpShift } from './log1m-exp-shift.js';
import { SaddleMemo, type SaddleIntegral } from './saddle-memo.js';
import { saddleNewton } from './saddle-newton.js';
import { nodePhase, trapezoidGrid } from './saddle-trapezoid.js';

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
  static readonly MAX_M = 1_000_000_000;

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

/** c(m) for m <= end, factor by factor: c(m) += c(m − k) for k = a, ..., b (positive additions only). */
export function countsByFactors(a: number, b: number, end: number): Float64Array {
  const c = new Float64Array(end + 1);
  c[0] = 1;
  const top = Math.min(b, end);
  for (let k = a; k <= top; k++) for (let m = k; m <= end; m++) c[m] += c[m - k];
  return c;
}

function factorWork(a: number, b: number, end: number): number {
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

function partsWork(a: number, b: number, end: number): number {
  let work = 0;
  for (let j = 1; j * a <= end; j++) work += Math.min(j * b, end) - j * a + 1;
  return 2 * work;
}

/** How L is evaluated for [a, b]. */
interface Shape {
  readonly a: number;
  readonly b: number;
  /** Sum the terms k = a..b directly. */
  readonly direct: boolean;
  /** Otherwise: the head Σ_{k<a} directly (true) or as −S_{a−1} (false). */
  readonly headDirect: boolean;
}

/** L by direct sums when b < DIRECT_BELOW (the head Σ_{k<a} when a − 1 < DIRECT_BELOW). */
export const DIRECT_BELOW = 16;

function shapeOf(a: number, b: number): Shape {
  return { a, b, direct: b < DIRECT_BELOW, headDirect: a - 1 < DIRECT_BELOW };
}

/** The default table end is capped here (a sampler passes the largest size it needs). */
const DEFAULT_CAP = 1_000_000;
const PI2_6 = (Math.PI * Math.PI) / 6;

/** Main-arc threshold on A(t) (see the class comment and the test file). */
export const A_MIN = 36;

function checkArgument(m: number): void {
  if (!Number.isInteger(m) || m < 0 || m > LogBoundedPartCounts.MAX_M) {
    throw new RangeError(`m must be an integer in [0, ${LogBoundedPartCounts.MAX_M}], got ${m}`);
  }
}

/**
 * A(t) = Σ_{odd k∈[a,b]} log coth(kt/2): the first ARC_TERMS odd terms summed, the rest by the
 * midpoint rule, (1/2t)∫ log coth(u/2) du over [(k0 − 1)t, (b + 1)t] with the antiderivative
 * Li₂(−e^{−u}) − Li₂(e^{−u}) (relative error below 1e-4, measured: A is only compared with A_MIN, and
 * mainArcStart adds 10% to the size). Terms below 1e-18 are dropped (they only fall).
 */
export function arcDamping(a: number, b: number, t: number): number {
  let sum = 0;
  let k = a % 2 === 1 ? a : a + 1;
  for (let i = 0; i < ARC_TERMS && k <= b; i++, k += 2) {
    const e = Math.exp(-k * t);
    const term = Math.log1p((2 * e) / -Math.expm1(-k * t));
    sum += term;
    if (term < 1e-18) return sum;
  }
  if (k > b) return sum;
  const F = (u: number) => 0.5 * complexLi2ExpNeg(2 * u, 0)[0] - 2 * complexLi2ExpNeg(u, 0)[0]; // Li₂(−e^{−u}) − Li₂(e^{−u})
  return sum + (F((b + 1) * t) - F((k - 1) * t)) / (2 * t);
}

const ARC_TERMS = 200;

/** Whether the main arc is accurate at size m for [a, b] (A(t_m) >= A_MIN). */
export function mainArcHolds(a: number, b: number, m: number): boolean {
  if (m < 1) return false;
  return arcDamping(a, b, boundedSaddle(shapeOf(a, b), m)) >= A_MIN;
}

/**
 * Where the table must end for the main arc to be accurate above it, for [a, b] (a <= b): the
 * size at which A(t) reaches A_MIN (A falls with t: bisection on t, then the mean size −L'(t)
 * there), plus 10%, at least 200; Infinity when A < A_MIN even at MAX_M (few sizes, e.g. b = 2).
 */
export function mainArcStart(a: number, b: number): number {
  const shape = shapeOf(a, b);
  if (!mainArcHolds(a, b, LogBoundedPartCounts.MAX_M)) return Infinity;
  let hi = boundedSaddle(shape, 1); // few parts: A small
  let lo = boundedSaddle(shape, LogBoundedPartCounts.MAX_M);
  if (arcDamping(a, b, hi) >= A_MIN) return 200;
  for (let i = 0; i < 100 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (arcDamping(a, b, mid) >= A_MIN) lo = mid;
    else hi = mid;
  }
  const [d1] = realDerivatives(shape, 0, lo);
  return Math.max(200, Math.ceil(1.1 * -d1));
}

/** The table end for sizes up to cap: mainArcStart, or cap when that is smaller. */
export function defaultTableEnd(a: number, b: number, cap: number): number {
  if (b < a) return 0;
  return Math.min(cap, mainArcStart(a, b));
}

// ---------------------------------------------------------------------------------------------
// Real parts: L'(t), L''(t) on the real axis (Newton and the trapezoid width).

/** w(u) = 1/(e^u − 1) and w'(u) = −w(1 + w). */
function w(u: number): number {
  return 1 / Math.expm1(u);
}

/**
 * [φ'(t), φ''(t)] with φ(t) = mt + L(t). L'' is exact for direct sums and the eta part; the
 * Euler–Maclaurin tails contribute their integral term only (σ needs no more).
 */
function realDerivatives(shape: Shape, m: number, t: number): [number, number] {
  const { a, b } = shape;
  let d1 = m;
  let d2 = 0;
  if (shape.direct) {
    for (let k = a; k <= b; k++) {
      const v = w(k * t);
      d1 -= k * v;
      d2 += k * k * v * (1 + v);
    }
    return [d1, d2];
  }
  // Eta part: ½ log(t/2π) + π²/(6t) − t/24.
  d1 += 0.5 / t - PI2_6 / (t * t) - 1 / 24;
  d2 += -0.5 / (t * t) + (2 * PI2_6) / (t * t * t);
  if (shape.headDirect) {
    for (let k = 1; k < a; k++) {
      const v = w(k * t);
      d1 += k * v;
      d2 -= k * k * v * (1 + v);
    }
  } else {
    const [e1, e2] = tailDerivatives(a - 1, t);
    // L = −S_{a−1} + S_b and P's part is not used: undo the eta part and the head.
    d1 -= 0.5 / t - PI2_6 / (t * t) - 1 / 24;
    d2 -= -0.5 / (t * t) + (2 * PI2_6) / (t * t * t);
    d1 -= e1;
    d2 -= e2;
  }
  const [s1, s2] = tailDerivatives(b, t);
  return [d1 + s1, d2 + s2];
}

/**
 * S_c'(t) = Σ_{k>c} k·w(kt) by Euler–Maclaurin on h(x) = x·w(xt) from c + ½, and S_c''(t) by
 * the integral term of −Σ k² w(1 + w).
 */
function tailDerivatives(c: number, t: number): [number, number] {
  const x0 = c + 0.5;
  const u = x0 * t;
  const e = Math.exp(-u);
  const li2 = complexLi2ExpNeg(u, 0)[0];
  const logTerm = -Math.log1p(-e); // −log(1 − e^{−u})
  // ∫_{x0}^∞ x w(xt) dx = (u·(−log(1 − e^{−u})) + Li₂(e^{−u}))/t².
  let s1 = (u * logTerm + li2) / (t * t);
  // h^{(n)}(x0) = t^n x0 w^{(n)}(u) + n t^{n−1} w^{(n−1)}(u); corrections Σ β_j h^{(2j−1)}.
  const terms = emTerms(c);
  const wd = wDerivativesReal(u, 2 * terms);
  for (let j = 1; j <= terms; j++) {
    const n = 2 * j - 1;
    const h = t ** n * x0 * wd[n] + n * t ** (n - 1) * wd[n - 1];
    s1 += EM_BETA[j - 1] * h;
  }
  // −Σ k² w(1 + w) ≈ −(1/t³)(u² w(u) + 2(u·(−log(1 − e^{−u})) + Li₂(e^{−u}))).
  const s2 = -(u * u * w(u) + 2 * (u * logTerm + li2)) / (t * t * t);
  return [s1, s2];
}

/**
 * Euler–Maclaurin weights β_j = −B_{2j}(½)/(2j)! of Σ_{k>c} g(k) = ∫_{c+½}^∞ g + Σ_j β_j g^{(2j−1)}(c + ½):
 * B_{2j}(½) = −(1 − 2^{1−2j}) B_{2j} (DLMF 24.4.27), B_2 .. B_16 (DLMF Table 24.2.1).
 */
const EM_TERMS = 8;
/**
 * Correction terms used at c: the first dropped one, ~2(2J)!/((2π)^{2J+2}(c + ½)^{2J+1}), is
 * below 3e-17 in each tier (J = 2 from c = 500, 3 from 120, 4 from 50, 6 from 25, else 8).
 */
function emTerms(c: number): number {
  return c >= 500 ? 2 : c >= 120 ? 3 : c >= 50 ? 4 : c >= 25 ? 6 : EM_TERMS;
}
const BERNOULLI_EVEN = [1 / 6, -1 / 30, 1 / 42, -1 / 30, 5 / 66, -691 / 2730, 7 / 6, -3617 / 510];
const EM_BETA = BERNOULLI_EVEN.map((B, i) => {
  const j = i + 1;
  let f = 1;
  for (let k = 2; k <= 2 * j; k++) f *= k;
  return ((1 - 2 ** (1 - 2 * j)) * B) / f;
});

/**
 * Polynomials P_n with w^{(n)}(u) = P_n(w(u)): P_0(w) = w, P_{n+1}(w) = −w(1 + w)P_n'(w)
 * (since w' = −w(1 + w)). Coefficients ascending.
 */
const W_POLYS: number[][] = (() => {
  const out: number[][] = [[0, 1]];
  for (let n = 0; n < 2 * EM_TERMS; n++) {
    const p = out[n];
    // derivative
    const dp = p.slice(1).map((c, i) => c * (i + 1));
    // −(w + w²)·dp
    const next = new Array<number>(dp.length + 2).fill(0);
    for (let i = 0; i < dp.length; i++) {
      next[i + 1] -= dp[i];
      next[i + 2] -= dp[i];
    }
    out.push(next);
  }
  return out;
})();

/** [w(u), w'(u), ..., w^{(n)}(u)] for real u > 0. */
function wDerivativesReal(u: number, n: number): number[] {
  const v = w(u);
  const out: number[] = [];
  for (let i = 0; i <= n; i++) {
    const p = W_POLYS[i];
    let s = 0;
    for (let j = p.length - 1; j >= 0; j--) s = s * v + p[j];
    out.push(s);
  }
  return out;
}

/**
 * The real saddle point t of φ for [a, b] at size m > 0 (also the Boltzmann parameter x = e^{−t}
 * at which partitions into parts in [a, b] have mean size ≈ m). Newton on φ'(t) = 0 (φ' increases
 * from −∞ at t → 0+... to m > 0), safeguarded by halving/doubling.
 */
export function boundedSaddle(shape: Shape, m: number, guess?: number): number {
  // Start: the unrestricted value, or for few sizes the mean of b − a + 1 geometrics, (#sizes)/t = m.
  const start = guess ?? Math.max(Math.PI / Math.sqrt(6 * m), (shape.b - shape.a + 1) / m);
  return saddleNewton((t) => realDerivatives(shape, m, t), start, 100, 1e-14);
}

/** boundedSaddle for [a, b] (a <= b). */
export function boundedPartSaddle(a: number, b: number, m: number): number {
  return boundedSaddle(shapeOf(a, b), m);
}

// ---------------------------------------------------------------------------------------------
// Complex parts: L(t + iy) − L(t) at the trapezoid nodes.

function computeSaddle(shape: Shape, m: number): SaddleIntegral {
  const t = boundedSaddle(shape, m);
  const [, d2] = realDerivatives(shape, m, t);
  const sigma = Math.sqrt(d2);
  const phi = m * t + realL(shape, t);
  // Step: TRAPEZOID_STEP/σ (the Gaussian bulk), and at most t/H with H from poleStep (few sizes: the pole
  // of order b − a + 1 at τ = 0 lies at distance t from the line).
  const { K, h, last } = trapezoidGrid(sigma, (2 * Math.PI * poleStep(shape)) / t);
  let sum = 1;
  let previous = 1;
  // Nodes to |y| = TRAPEZOID_RANGE/σ, then on while the terms still matter and fall (few sizes give the
  // integrand polynomial tails, (1 + (y/t)²)^{−(b−a+1)/2}); a rise means another arc: stop there.
  for (let j = 1; j * h < Math.PI; j++) {
    const y = j * h;
    const [re, li] = shift(shape, t, y);
    const size = Math.exp(re);
    if (j > last && (size < TAIL_CUT || size > previous)) break;
    previous = size;
    // m·y reduced exactly: y = 2πj/K, m·j < 2^53.
    const im = nodePhase(m, j, K) + li;
    sum += 2 * size * Math.cos(im);
  }
  return { t, phi, logI: Math.log((h * sum) / (2 * Math.PI)) };
}

/**
 * H with t/H a step small enough for the pole of order r = b − a + 1 at τ = 0 (distance t from
 * the line): on the line at distance d = t(1 − ε) the integrand is at most ~ε^{−r} times its
 * centre, so the trapezoid's error is ~ e^{−2πH(1−ε)}ε^{−r} (Trefethen & Weideman 2014, Thm 5.1),
 * ~exp(−2πH + r + r log(2πH/r)) at the best ε = r/(2πH); H is the least making that <= e^{−45}.
 * Only for r < 64: with more sizes the eta part's Gaussian (width 1/σ ≪ t) governs, as for the
 * unrestricted counts.
 */
function poleStep(shape: Shape): number {
  const r = shape.b - shape.a + 1;
  if (r >= 64) return 0;
  let H = 1;
  while (2 * Math.PI * H - r - r * Math.log(Math.max(1, (2 * Math.PI * H) / r)) < 45) H += 0.5;
  return H;
}

/** Integrand terms below this (relative to the centre) end the sum. */
const TAIL_CUT = 1e-18;

/**
 * [Re(L(t + iy) − L(t)), Im L(t + iy)], the differences formed term by term (log1p, atan) where
 * they are elementary; the Euler–Maclaurin tails as differences of their values (tail0: at y = 0).
 */
function shift(shape: Shape, t: number, y: number): [number, number] {
  const { a, b } = shape;
  let re = 0;
  let im = 0;
  if (shape.direct) {
    for (let k = a; k <= b; k++) {
      const [dr, di] = log1mExpShift(k * t, k * y);
      re -= dr;
      im -= di;
    }
    return [re, im];
  }
  if (shape.headDirect) {
    // log P(e^{−τ}) − log P(e^{−t}): ½ log(1 + is) − (π²/(6t²))(iy + y²/t)/(1 + s²) − iy/24.
    const s = y / t;
    const s2 = s * s;
    const c = PI2_6 / (t * t) / (1 + s2);
    re += 0.25 * Math.log1p(s2) - (c * y * y) / t;
    im += 0.5 * Math.atan(s) - c * y - y / 24;
    for (let k = 1; k < a; k++) {
      const [dr, di] = log1mExpShift(k * t, k * y);
      re += dr;
      im += di;
    }
  } else {
    const [hr, hi] = tailShift(a - 1, t, y);
    re -= hr;
    im -= hi;
  }
  const [sr, si] = tailShift(b, t, y);
  return [re + sr, im + si];
}

/**
 * S_c(t + iy) − S_c(t) (see tailSum), formed without subtracting two values of size ~1/t: with
 * u0 = (c + ½)t, u = u0 + iδ, the dilogarithm term is
 *   −Li₂(e^{−u})/τ + Li₂(e^{−u0})/t = Li₂(e^{−u0})·iy/(tτ) − ΔLi₂/τ,
 * ΔLi₂ = Li₂(e^{−u}) − Li₂(e^{−u0}) from the series term by term (differences of powers and
 * logarithms in product form). The Euler–Maclaurin corrections are small (~1/c): plain differences.
 */
function tailShift(c: number, t: number, y: number): [number, number] {
  const x0 = c + 0.5;
  const u0 = x0 * t;
  const delta = x0 * y;
  const li0 = complexLi2ExpNeg(u0, 0)[0];
  const [dr, di] = li2ExpNegShift(u0, delta);
  const mod2 = t * t + y * y;
  // iy/(tτ) = iy(t − iy)/(t·mod2) = (y² + i·y·t)/(t·mod2)
  let re = (li0 * y * y) / (t * mod2);
  let im = (li0 * y) / mod2;
  // −Δ/τ = −Δ(t − iy)/mod2
  re -= (dr * t + di * y) / mod2;
  im -= (di * t - dr * y) / mod2;
  const [er, ei] = emCorrections(c, t, y);
  const [e0] = emCorrections(c, t, 0);
  return [re + er - e0, im + ei];
}

/** Li₂(e^{−(u0 + iδ)}) − Li₂(e^{−u0}), u0 > 0 real. */
function li2ExpNegShift(u0: number, delta: number): [number, number] {
  if (u0 >= 1) {
    // Σ_j e^{−j u0}(e^{−ijδ} − 1)/j², e^{−ijδ} − 1 = −2 sin²(jδ/2) − i sin(jδ).
    let re = 0;
    let im = 0;
    const q = Math.exp(-u0);
    let p = q;
    for (let j = 1; j < 60 && p > 1e-18 * j * j; j++, p *= q) {
      const s = Math.sin((j * delta) / 2);
      re -= (p * 2 * s * s) / (j * j);
      im -= (p * Math.sin(j * delta)) / (j * j);
    }
    return [re, im];
  }
  // −(u − u0) + (u log u − u0 log u0) − (u² − u0²)/4 + Σ c_j (u^{2j+1} − u0^{2j+1}), u − u0 = iδ;
  // u log u − u0 log u0 = iδ·log u + u0·log(1 + iδ/u0).
  const logUr = 0.5 * Math.log(u0 * u0 + delta * delta);
  const logUi = Math.atan2(delta, u0);
  const s = delta / u0;
  let re = -delta * logUi + u0 * 0.5 * Math.log1p(s * s);
  let im = -delta + delta * logUr + u0 * Math.atan(s);
  // −(u² − u0²)/4 = −iδ(2u0 + iδ)/4
  re += (delta * delta) / 4;
  im -= (2 * u0 * delta) / 4;
  // d_k = u^k − u0^k = u·d_{k−1} + u0^{k−1}·iδ, from d_1 = iδ.
  let dr = 0;
  let di = delta;
  let p0 = u0; // u0^{k−1} at step k
  for (let k = 2; k <= 2 * LI2_ODD.length + 1; k++) {
    const nr = u0 * dr - delta * di;
    const ni = u0 * di + delta * dr + p0 * delta;
    dr = nr;
    di = ni;
    p0 *= u0;
    if (k % 2 === 1) {
      const cj = LI2_ODD[(k - 3) / 2];
      re += cj * dr;
      im += cj * di;
    }
  }
  return [re, im];
}

/**
 * ∫_{m2}^{m1} t(μ) dμ = φ_{m1}(t1) − φ_{m2}(t2): the saddle value F(m) = min_t φ_m(t) has
 * F'(m) = t(m) (the envelope theorem; φ_m(t) = mt + L(t) is convex in t). Composite 8-point
 * Gauss–Legendre on panels [μ, 1.5μ] (t(μ) ~ μ^{−1/2} is analytic around each: the error is
 * ~1e-16 of the panel's integral), so the difference is formed without subtracting two values of
 * size √m.
 */
function envelopeIntegral(shape: Shape, m2: number, m1: number): number {
  if (m1 === m2) return 0;
  const sign = m1 > m2 ? 1 : -1;
  const lo = Math.min(m1, m2);
  const hi = Math.max(m1, m2);
  let total = 0;
  let guess: number | undefined;
  for (let from = lo; from < hi; ) {
    const to = Math.min(hi, from * PANEL_RATIO);
    const mid = 0.5 * (from + to);
    const half = 0.5 * (to - from);
    // Fewer nodes on short panels: the error falls like (half/mid)^{2·nodes} (Bernstein ellipse
    // of the nearest singularity, μ = 0), below 1e-15 of the panel in each tier.
    const rule = half <= 5e-4 * mid ? GL2 : half <= 0.025 * mid ? GL4 : GL8;
    let panel = 0;
    for (let i = 0; i < rule.nodes.length; i++) {
      const mu = mid + half * rule.nodes[i];
      guess = boundedSaddle(shape, mu, guess);
      panel += rule.weights[i] * guess;
    }
    total += half * panel;
    from = to;
  }
  return sign * total;
}

const PANEL_RATIO = 1.5;
/** Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun, Table 25.4). */
const GL2 = { nodes: [-0.5773502691896257, 0.5773502691896257], weights: [1, 1] };
const GL4 = {
  nodes: [-0.8611363115940526, -0.3399810435848563, 0.3399810435848563, 0.8611363115940526],
  weights: [0.3478548451374538, 0.6521451548625461, 0.6521451548625461, 0.3478548451374538],
};
const GL_NODES = [
  -0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498, 0.1834346424956498, 0.5255324099163290,
  0.7966664774136267, 0.9602898564975363,
];
const GL_WEIGHTS = [
  0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620, 0.3626837833783620, 0.3137066458778873,
  0.2223810344533745, 0.1012285362903763,
];
const GL8 = { nodes: GL_NODES, weights: GL_WEIGHTS };

/** L(t) on the real axis. */
function realL(shape: Shape, t: number): number {
  return complexL(shape, t, 0)[0];
}

/** [Re, Im] of L(t + iy) for the shape. */
function complexL(shape: Shape, t: number, y: number): [number, number] {
  const { a, b } = shape;
  let re = 0;
  let im = 0;
  if (shape.direct) {
    for (let k = a; k <= b; k++) {
      const [lr, li] = log1mExp(k * t, k * y);
      re -= lr;
      im -= li;
    }
    return [re, im];
  }
  // log P(e^{−τ}) = ½ log(τ/2π) + π²/(6τ) − τ/24 (τ = t + iy).
  const mod2 = t * t + y * y;
  re += 0.25 * Math.log(mod2 / (4 * Math.PI * Math.PI)) + (PI2_6 * t) / mod2 - t / 24;
  im += 0.5 * Math.atan2(y, t) - (PI2_6 * y) / mod2 - y / 24;
  if (shape.headDirect) {
    for (let k = 1; k < a; k++) {
      const [lr, li] = log1mExp(k * t, k * y);
      re += lr;
      im += li;
    }
  } else {
    // Replace log P + head by −S_{a−1}: cancel the eta part again.
    re -= 0.25 * Math.log(mod2 / (4 * Math.PI * Math.PI)) + (PI2_6 * t) / mod2 - t / 24;
    im -= 0.5 * Math.atan2(y, t) - (PI2_6 * y) / mod2 - y / 24;
    const [sr, si] = tailSum(a - 1, t, y);
    re -= sr;
    im -= si;
  }
  const [sr, si] = tailSum(b, t, y);
  return [re + sr, im + si];
}

/** log(1 − e^{−(x + iy)}) as [Re, Im] (x > 0). */
function log1mExp(x: number, y: number): [number, number] {
  const e = Math.exp(-x);
  // 1 − e^{−x}(cos y − i sin y) = (1 − e cos y) + i e sin y; |.|² = (1 − e)² + 4e sin²(y/2).
  const den = -Math.expm1(-x); // 1 − e
  const s = Math.sin(y / 2);
  const re = Math.log(den) + 0.5 * Math.log1p((4 * e * s * s) / (den * den));
  const im = Math.atan2(e * Math.sin(y), 1 - e * Math.cos(y));
  return [re, im];
}

/** S_c(τ) = Σ_{k>c} log(1 − e^{−kτ}) by Euler–Maclaurin (see the class comment), τ = t + iy. */
function tailSum(c: number, t: number, y: number): [number, number] {
  const x0 = c + 0.5;
  const ur = x0 * t;
  const ui = x0 * y;
  // −Li₂(e^{−u})/τ
  const [lr, li] = complexLi2ExpNeg(ur, ui);
  const mod2 = t * t + y * y;
  // (lr + i li)/(t + iy) = ((lr t + li y) + i(li t − lr y))/mod2
  let re = -(lr * t + li * y) / mod2;
  let im = -(li * t - lr * y) / mod2;
  const [er, ei] = emCorrections(c, t, y);
  return [re + er, im + ei];
}

/** Σ_j β_j τ^{2j−1} f^{(2j−1)}(u), f^{(n)} = w^{(n−1)}, u = (c + ½)τ (the corrections of tailSum). */
function emCorrections(c: number, t: number, y: number): [number, number] {
  const x0 = c + 0.5;
  const ur = x0 * t;
  const ui = x0 * y;
  let re = 0;
  let im = 0;
  const [wr, wi] = complexW(ur, ui);
  let tr = t; // τ^n, n = 1
  let ti = y;
  const tau2r = t * t - y * y;
  const tau2i = 2 * t * y;
  const terms = emTerms(c);
  for (let j = 1; j <= terms; j++) {
    const n = 2 * j - 1;
    const [pr, pi] = complexPoly(W_POLYS[n - 1], wr, wi);
    re += EM_BETA[j - 1] * (tr * pr - ti * pi);
    im += EM_BETA[j - 1] * (tr * pi + ti * pr);
    const nr = tr * tau2r - ti * tau2i;
    ti = tr * tau2i + ti * tau2r;
    tr = nr;
  }
  return [re, im];
}

/** w(u) = 1/(e^u − 1) for complex u = ur + i·ui. */
function complexW(ur: number, ui: number): [number, number] {
  if (ur > 700) return [0, 0]; // |w| < e^{−700}: and e^{ur} would overflow

  // e^u − 1 = (e^{ur} cos ui − 1) + i e^{ur} sin ui; the real part as expm1(ur)·cos ui − 2 sin²(ui/2).
  const s = Math.sin(ui / 2);
  const dr = Math.expm1(ur) * Math.cos(ui) - 2 * s * s;
  const di = Math.exp(ur) * Math.sin(ui);
  const d = dr * dr + di * di;
  return [dr / d, -di / d];
}

function complexPoly(p: number[], xr: number, xi: number): [number, number] {
  let sr = 0;
  let si = 0;
  for (let j = p.length - 1; j >= 0; j--) {
    const nr = sr * xr - si * xi + p[j];
    si = sr * xi + si * xr;
    sr = nr;
  }
  return [sr, si];
}

/** B_{2j}/(2j (2j + 1)!) for j = 1..12: the odd coefficients of Li₂(e^{−u}) at u = 0. */
const BERNOULLI_2J = [
  1 / 6, -1 / 30, 1 / 42, -1 / 30, 5 / 66, -691 / 2730, 7 / 6, -3617 / 510, 43867 / 798, -174611 / 330, 854513 / 138, -236364091 / 2730,
];
const LI2_ODD = BERNOULLI_2J.map((B, i) => {
  const j = i + 1;
  let f = 1;
  for (let k = 2; k <= 2 * j + 1; k++) f *= k;
  return B / (2 * j * f);
});

/** Li₂(e^{−u}) for complex u with Re u > 0 (|u| < 2π when Re u < 1). */
function complexLi2ExpNeg(ur: number, ui: number): [number, number] {
  if (ur >= 1) {
    // Σ_j e^{−ju}/j²
    const er = Math.exp(-ur) * Math.cos(ui);
    const ei = -Math.exp(-ur) * Math.sin(ui);
    let pr = er;
    let pi = ei;
    let sr = 0;
    let si = 0;
    const mod = Math.exp(-ur);
    let pm = mod;
    for (let j = 1; j < 60 && pm > 1e-18 * j * j; j++) {
      sr += pr / (j * j);
      si += pi / (j * j);
      const nr = pr * er - pi * ei;
      pi = pr * ei + pi * er;
      pr = nr;
      pm *= mod;
    }
    return [sr, si];
  }
  // π²/6 − u + u log u − u²/4 + Σ c_j u^{2j+1}
  const logr = 0.5 * Math.log(ur * ur + ui * ui);
  const logi = Math.atan2(ui, ur);
  let re = PI2_6 - ur + (ur * logr - ui * logi);
  let im = -ui + (ur * logi + ui * logr);
  const u2r = ur * ur - ui * ui;
  const u2i = 2 * ur * ui;
  re -= u2r / 4;
  im -= u2i / 4;
  let pr = ur * u2r - ui * u2i; // u³
  let pi = ur * u2i + ui * u2r;
  for (let j = 0; j < LI2_ODD.length; j++) {
    re += LI2_ODD[j] * pr;
    im += LI2_ODD[j] * pi;
    const nr = pr * u2r - pi * u2i;
    pi = pr * u2i + pi * u2r;
    pr = nr;
  }
  return [re, im];
}
