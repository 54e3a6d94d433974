import { log1mExpShift } from './log1m-exp-shift.js';
import { SaddleMemo, type SaddleIntegral } from './saddle-memo.js';
import { saddleNewton } from './saddle-newton.js';
import { nodePhase, trapezoidGrid } from './saddle-trapezoid.js';

/**
 * log c_b(m), c_b(m) the number of partitions of m into parts >= b (OEIS A002865 for b = 2,
 * A008483 for b = 3, A008484 for b = 4), for b >= 2 and 0 <= m <= 1e9, with numerically stable
 * log-ratios log(c_b(m1)/c_b(m2)).
 *
 * - m <= exactUpTo: a table filled by c(m) += c(m − k) for k = b, b + 1, ... (the generating
 *   function Π_{k>=b} 1/(1 − q^k) multiplied in one factor at a time). Only additions of positive
 *   numbers, so each double carries a relative error of at most ~m roundings (as the restricted
 *   partition table in table-recursive.ts).
 * - m > exactUpTo: the saddle-point integral of the circle method's main term. With
 *   c_b(m) = [q^m] P(q)·G_b(q), G_b(q) = Π_{k<b}(1 − q^k), q = e^{−τ}, the modular transformation
 *   of the Dedekind eta function (Apostol 1990, "Modular functions and Dirichlet series", Thm 3.1)
 *   gives P(e^{−τ}) = √(τ/2π)·exp(π²/(6τ) − τ/24)·P(e^{−4π²/τ}), and near q = 1 the last factor is
 *   1 + O(e^{−4π²·Re(1/τ)}) (at the saddle, below e^{−4π√(6m)}). So
 *     c_b(m) ≈ (1/2π) ∫ exp φ(t + iy) dy,  φ(τ) = ½ log(τ/2π) + π²/(6τ) + (m − 1/24)τ + log G_b(e^{−τ}),
 *   along the vertical line through the real saddle point t of φ (φ'(t) = 0, found by Newton).
 *   The integrand is analytic and Gaussian-like (width 1/σ, σ² = φ''(t)), so the trapezoidal rule
 *   with step h converges like e^{−2π²/(hσ)²} (Trefethen & Weideman 2014, SIAM Review 56, §5):
 *   h = 0.5/σ leaves e^{−79}; the sum stops at |y| = 10/σ, where the Gaussian is e^{−50}.
 *   The other arcs of the circle (q near other roots of unity) are dropped: for p(m) they are
 *   relatively O(e^{−z/2}), z = π√(2m/3) (the k = 2 Rademacher term); G_b is smaller near q = 1
 *   than elsewhere, which eats part of that margin when b is large against √m. The switch
 *   (exactUpTo) is therefore chosen per b, and the agreement with exact counts is checked in
 *   test/partitions/log-min-part-count.test.ts (b = 2, 3, 7, 100, 481 against BigInt counts).
 *
 * Log-ratios: log c(m1) − log c(m2) = [φ_{m1}(t1) − φ_{m2}(t2)] + log I1 − log I2, with
 * I = (h/2π)·Σ_j exp(φ(t + ijh) − φ(t)). Both brackets are formed from differences computed in
 * place (log1p, expm1), never by subtracting two large logs: the saddle values themselves are of
 * order √m, so their rounding would cost ~1e-12 at m = 1e8.
 */
export class LogMinPartCounts {
  /** Largest m accepted (the service's limit on n). */
  static readonly MAX_M = 1_000_000_000;

  /** Exact (double) counts c_b(0..exactUpTo). */
  private readonly exact: Float64Array;
  private readonly logExact: Float64Array;
  /** Saddle-point data per m above the table. */
  private readonly memo = new SaddleMemo((m) => computeSaddle(this.b, m));
  private concaveFrom = -1;

  constructor(
    readonly b: number,
    readonly exactUpTo: number = defaultExactUpTo(b),
  ) {
    if (!Number.isInteger(b) || b < 2) throw new RangeError(`b must be an integer >= 2, got ${b}`);
    if (!Number.isInteger(exactUpTo) || exactUpTo < 0) throw new RangeError(`exactUpTo must be a non-negative integer, got ${exactUpTo}`);
    const c = minPartByParts(b, exactUpTo);
    this.exact = c;
    this.logExact = c.map(Math.log);
  }

  /** Additions done by the constructor (setup work). */
  static setupWork(b: number, exactUpTo: number = defaultExactUpTo(b)): number {
    let work = 0;
    for (let j = 1; j * b <= exactUpTo; j++) work += 2 * (exactUpTo - j * b + 1);
    return work;
  }

  /**
   * The smallest L with c_b(m)² >= c_b(m − 1)·c_b(m + 1) for all L < m < exactUpTo (exact check
   * on the table; strict inequality is not needed by the maximiser). Above the table the values
   * are the saddle-point integral, concave in m (checked on a grid in the test file).
   */
  logConcaveFrom(): number {
    if (this.concaveFrom < 0) {
      const c = this.exact;
      // c_b(m) >= 1 from m = b on (zeros before: 0 < m < b), so the search starts at b at least.
      let from = this.b;
      for (let m = this.b + 1; m < this.exactUpTo; m++) if (c[m] * c[m] < c[m - 1] * c[m + 1]) from = m;
      this.concaveFrom = from;
    }
    return this.concaveFrom;
  }

  /** c_b(m) as a double, m <= exactUpTo. */
  value(m: number): number {
    if (!(m <= this.exactUpTo)) throw new RangeError(`c_b(m) as a double is tabulated up to ${this.exactUpTo}, got ${m}`);
    return this.exact[m];
  }

  /** log c_b(m) (−Infinity where c_b(m) = 0, i.e. 0 < m < b). */
  log(m: number): number {
    checkArgument(m);
    if (m <= this.exactUpTo) return this.logExact[m];
    const s = this.memo.get(m);
    return s.phi + s.logI;
  }

  /** log(c_b(m1)/c_b(m2)), stable (see the class comment). */
  logRatio(m1: number, m2: number): number {
    checkArgument(m1);
    checkArgument(m2);
    if (m1 === m2) return 0;
    if (m1 <= this.exactUpTo && m2 <= this.exactUpTo) return Math.log(this.exact[m1] / this.exact[m2]);
    if (m1 <= this.exactUpTo || m2 <= this.exactUpTo) return this.log(m1) - this.log(m2);
    const s1 = this.memo.get(m1);
    const s2 = this.memo.get(m2);
    return this.phiDifference(m1, s1.t, m2, s2.t) + s1.logI - s2.logI;
  }

  /** φ_{m1}(t1) − φ_{m2}(t2) without cancellation of the large terms. */
  private phiDifference(m1: number, t1: number, m2: number, t2: number): number {
    const d = t1 - t2;
    // π²/(6t1) − π²/(6t2) + (m1 − 1/24)t1 − (m2 − 1/24)t2
    //   = d·(m1 − 1/24 − π²/(6 t1 t2)) + (m1 − m2)·t2
    let sum = 0.5 * Math.log1p(d / t2) + d * (m1 - 1 / 24 - PI2_6 / (t1 * t2)) + (m1 - m2) * t2;
    // Σ_k log((1 − e^{−k t1})/(1 − e^{−k t2})) = Σ log1p(e^{−k t2}·expm1(−k d)/expm1(−k t2))
    for (let k = 1; k < this.b; k++) sum += Math.log1p((Math.exp(-k * t2) * Math.expm1(-k * d)) / Math.expm1(-k * t2));
    return sum;
  }
}

const PI2_6 = (Math.PI * Math.PI) / 6;

/**
 * The table's end per b: above it the dropped arcs are below double rounding. Measured against
 * exact BigInt counts (scratch runs, log-ratio of neighbours off by < 1e-15 from): m = 2000 for
 * b = 2..7, 3000 for b = 31, 4000 for 61, 5000 for 100 and 121, 9000 for 241, ~18000 for 481;
 * this formula keeps a margin above each (test/partitions/log-min-part-count.test.ts checks it).
 */
/**
 * c_b(0..upTo), partitions into parts >= b, by number of parts: j parts >= b of m are, less b − 1
 * from each, the partitions of m − jb into at most j parts (parts >= 1 after one is taken from
 * each), counted by p_j(M) = p_{j−1}(M) + p_j(M − j) (parts <= j, by conjugation). Positive
 * additions only, about 2·(upTo/b)·upTo of them instead of ~upTo²/2 factor by factor (b = 162:
 * 0.7e6 against 2.7e7, ~40 ms of a first sample at n = 2e6, minPart = 323); the doubles differ
 * from the factor-by-factor sums only by rounding (~1e-16 relative per addition).
 */
export function minPartByParts(b: number, upTo: number): Float64Array {
  const c = new Float64Array(upTo + 1);
  c[0] = 1;
  const p = new Float64Array(upTo + 1);
  p[0] = 1;
  for (let j = 1; j * b <= upTo; j++) {
    const base = j * b;
    // Later j read p only up to upTo − (their larger base).
    for (let M = j; M <= upTo - base; M++) p[M] += p[M - j];
    for (let m = base; m <= upTo; m++) c[m] += p[m - base];
  }
  return c;
}

export function defaultExactUpTo(b: number): number {
  return Math.ceil(2000 + 30 * b + (b * b) / 40);
}

function checkArgument(m: number): void {
  if (!Number.isInteger(m) || m < 0 || m > LogMinPartCounts.MAX_M) {
    throw new RangeError(`m must be an integer in [0, ${LogMinPartCounts.MAX_M}], got ${m}`);
  }
}

/** φ'(t) and φ''(t) on the real axis. */
function derivatives(b: number, m: number, t: number): [number, number] {
  let d1 = 0.5 / t - PI2_6 / (t * t) + m - 1 / 24;
  let d2 = -0.5 / (t * t) + (2 * PI2_6) / (t * t * t);
  for (let k = 1; k < b; k++) {
    const e = Math.exp(-k * t);
    const den = -Math.expm1(-k * t); // 1 − e^{−kt}
    d1 += (k * e) / den;
    d2 -= (k * k * e) / (den * den);
  }
  return [d1, d2];
}

/**
 * The real saddle point t of φ for (b, m), m >= 1: also the Boltzmann parameter x = e^{−t} at
 * which partitions into parts >= b have mean size ≈ m (used by the sampler).
 */
export function minPartSaddle(b: number, m: number): number {
  return saddleNewton((t) => derivatives(b, m, t), Math.PI / Math.sqrt(6 * m), 60, 1e-15);
}

function computeSaddle(b: number, m: number): SaddleIntegral {
  const t = minPartSaddle(b, m);
  const [, d2] = derivatives(b, m, t);
  const sigma = Math.sqrt(d2);
  // φ(t)
  let phi = 0.5 * Math.log(t / (2 * Math.PI)) + PI2_6 / t + (m - 1 / 24) * t;
  for (let k = 1; k < b; k++) phi += Math.log(-Math.expm1(-k * t));
  // The trapezoid with h = 2π/K, K integer, so that the phase m·y = 2π(m·j mod K)/K is exact.
  const { K, h, last } = trapezoidGrid(sigma);
  let sum = 1; // j = 0
  for (let j = 1; j <= last; j++) {
    const y = j * h;
    const [re, im] = phiShift(b, m, t, y, j, K);
    sum += 2 * Math.exp(re) * Math.cos(im);
  }
  const logI = Math.log((h * sum) / (2 * Math.PI));
  return { t, phi, logI };
}

/**
 * φ(t + iy) − φ(t) (real and imaginary parts), y = 2πj/K. Terms:
 *   ½ log(1 + iy/t);  π²/6·(1/(t + iy) − 1/t) = −(π²/(6t²))·(iy + y²/t)/(1 + (y/t)²);
 *   (m − 1/24)·iy (phase of m·y reduced exactly mod 2π);
 *   Σ_k log(1 + e^{−kt}(1 − e^{−iky})/(1 − e^{−kt})).
 */
function phiShift(b: number, m: number, t: number, y: number, j: number, K: number): [number, number] {
  const s = y / t;
  const s2 = s * s;
  let re = 0.25 * Math.log1p(s2);
  let im = 0.5 * Math.atan(s);
  const a = PI2_6 / (t * t) / (1 + s2);
  re -= (a * y * y) / t;
  // Imaginary: m·y − π²y/(6t²(1 + s²)) − y/24. m·y = 2π·((m·j) mod K)/K exactly (m·j < 2^53).
  im += nodePhase(m, j, K) - a * y - y / 24;
  for (let k = 1; k < b; k++) {
    const [dr, di] = log1mExpShift(k * t, k * y);
    re += dr;
    im += di;
  }
  return [re, im];
}
