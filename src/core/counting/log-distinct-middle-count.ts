import { LogCoshSum } from './log-cosh-sum.js';
import { SaddleMemo, type SaddleIntegral } from './saddle-memo.js';
import { nodePhase, trapezoidGrid } from './saddle-trapezoid.js';

/**
 * The middle regime of log Q(m), Q(m) the number of partitions of m into distinct parts in [a, b]
 * (finite b; log-distinct-bounded-count.ts uses it): near the middle of the polynomial
 * ((b + 1)t <= MAX_BT, t the saddle point, so t near 0, where the circle method's 1/τ pole and the
 * tail T_b cancel and T_b's series converges slowly) the saddle-point integral written without
 * the pole,
 *   log Π_{a<=k<=b}(1 + e^{−kτ}) = N log 2 − τS/2 + C(τ),   C(τ) = Σ log cosh(kτ/2)
 * as a power series in τ (log-cosh-sum.ts; every node of the trapezoid stays at |bτ| <= 0.93π), so
 * φ(τ) = N log 2 + (m − S/2)τ + C(τ) exactly and the saddle solves C'(t) = S/2 − m (t = 0 at
 * m = S/2). Only the main arc is kept: at a root of unity of order j >= 2 the product has modulus
 * at most ~2^{N·2/j}·e^{O(1)} <= 2^{2N/3} (order 3), against 2^N/(σ√(2π)) for the main arc, so for
 * N >= MIN_RANGE the dropped arcs are below 1e-19 relative (checked against exact BigInt counts
 * in test/partitions/log-distinct-bounded-count.test.ts). The trapezoidal rule as in the other
 * regime (step 0.5/σ, Trefethen & Weideman 2014, SIAM Review 56, §5). Log-ratios are formed from
 * differences in place (C(t1) − C(t2) term by term). m here is folded (m <= S/2).
 */
export class DistinctMiddleCounts {
  /**
   * The power series serves m whose saddle point has (b + 1)t at most this (the tail series
   * serves from (b + 1)t = 1 on), and for wide ranges up to the largest (b + 1)t <= WIDEST_BT at
   * which every node is within the series' reach.
   */
  static readonly MAX_BT = 1.25;
  static readonly WIDEST_BT = 2.8;
  /** Least N = b − a + 1 for the power series (the dropped arcs, see the class comment). */
  static readonly MIN_RANGE = 200;

  private readonly memo = new SaddleMemo((m) => this.computeCentral(m));
  /** Σ log cosh(kτ/2) as a series (built on first use). */
  private cosh: LogCoshSum | null = null;
  /** The least m whose saddle point has (b + 1)t <= maxBt (−1: not yet computed). */
  private seriesFrom = -1;
  private wideRange: boolean | undefined;
  /** The largest |w| the series is asked for (set with wideRange). */
  private reach = LogCoshSum.MAX_W;
  /** The regime's largest (b + 1)t (set with wideRange). */
  private maxBt = DistinctMiddleCounts.MAX_BT;

  /** `total`: S = Σ_{a<=k<=b} k (Infinity for b = ∞, where the regime serves nothing). */
  constructor(
    readonly a: number,
    readonly b: number,
    readonly total: number,
  ) {}

  /** The series, summed out to the reach the regime needs (see `wide`). */
  private get series(): LogCoshSum {
    if (this.cosh === null) {
      void this.wide;
      this.cosh = new LogCoshSum(this.a, this.b, this.reach);
    }
    return this.cosh;
  }

  /** The least m served by the power series' saddle (Infinity for b = ∞). */
  get from(): number {
    if (this.b === Infinity) return Infinity;
    if (this.seriesFrom < 0) {
      // Mean size at t: S/2 − C'(t), decreasing in t.
      void this.wide;
      const [d1] = this.series.derivatives(this.maxBt / (this.b + 1));
      this.seriesFrom = Math.max(0, Math.ceil(this.total / 2 - d1));
    }
    return this.seriesFrom;
  }

  /**
   * Whether the power-series integral serves this range (finite b): N >= MIN_RANGE, and at the
   * regime's largest saddle point ((b + 1)t = MAX_BT, where the nodes reach furthest out: the
   * width 1/σ grows with t) the trapezoid's last node is within the series' reach.
   */
  private get wide(): boolean {
    if (this.wideRange === undefined) {
      // Real t up to MAX_BT/(b + 1) (saddle points, `from`) need |w| <= 0.4.
      this.reach = Math.max(0.4, (this.b * DistinctMiddleCounts.MAX_BT) / ((this.b + 1) * Math.PI)) * 1.01;
      this.maxBt = DistinctMiddleCounts.MAX_BT;
      let ok = this.b !== Infinity && this.b - this.a + 1 >= DistinctMiddleCounts.MIN_RANGE;
      if (ok) ok = this.nodeReach(this.maxBt) * REACH_MARGIN <= LogCoshSum.MAX_W;
      if (ok) {
        // Wide ranges serve further from the middle, as far as the series reaches (bisection):
        // fewer counts fall to the slower tail series.
        let lo = this.maxBt;
        let hi = DistinctMiddleCounts.WIDEST_BT;
        if (this.nodeReach(hi) * REACH_MARGIN <= LogCoshSum.MAX_W) lo = hi;
        else {
          for (let i = 0; i < 8; i++) {
            const mid = (lo + hi) / 2;
            if (this.nodeReach(mid) * REACH_MARGIN <= LogCoshSum.MAX_W) lo = mid;
            else hi = mid;
          }
        }
        this.maxBt = lo;
        this.reach = Math.min(LogCoshSum.MAX_W, Math.max(this.reach, this.nodeReach(lo) * REACH_MARGIN));
      }
      this.wideRange = ok;
    }
    return this.wideRange;
  }

  /**
   * |w| = b|τ|/π at the trapezoid's last node (one past TRAPEZOID_RANGE/σ) for the saddle point
   * t = bt/(b + 1): σ² = C''(t) = Σ (k/2)²·sech²(kt/2) by a midpoint sum over ~2000 strides
   * (relative error ~1e-6, inside REACH_MARGIN). The nodes reach furthest at the largest t.
   */
  private nodeReach(bt: number): number {
    const t = bt / (this.b + 1);
    const stride = Math.max(1, Math.floor((this.b - this.a + 1) / 2000));
    let v = 0;
    for (let k = this.a; k <= this.b; k += stride) {
      const width = Math.min(stride, this.b - k + 1);
      const mid = k + (width - 1) / 2;
      v += (width * mid * mid) / (4 * Math.cosh((mid * t) / 2) ** 2);
    }
    const { h, last } = trapezoidGrid(Math.sqrt(v));
    return (this.b * Math.hypot(t, (last + 1) * h)) / Math.PI;
  }

  /** Whether the power-series integral serves this m. */
  serves(m: number): boolean {
    return this.wide && m >= this.from;
  }

  /** Additions the power series' coefficients cost (0 for b = ∞). */
  seriesWork(): number {
    if (this.b === Infinity) return 0;
    void this.wide;
    return LogCoshSum.setupWork(this.a, this.b, this.reach);
  }

  /** Series terms per node of a count at m (for work estimates; the sums stop early). */
  termsAt(m: number): number {
    const t = this.saddle(m);
    const sigma = Math.sqrt(this.series.derivatives(t)[1]);
    const w = (this.b * Math.hypot(t, TRAPEZOID_RANGE_NODES / sigma)) / Math.PI;
    return LogCoshSum.termsFor(Math.min(this.reach, w));
  }

  /** The Boltzmann mean size S/2 − C'(t) where the series serves t > 0 ((b + 1)t <= maxBt), else null. */
  meanSize(t: number): number | null {
    void this.wide;
    return (this.b + 1) * t <= this.maxBt ? this.total / 2 - this.series.derivatives(t)[0] : null;
  }

  /** log Q(m) (m served). */
  log(m: number): number {
    const s = this.memo.get(m);
    return this.phi(m, s.t) + s.logI;
  }

  /** log(Q(m1)/Q(m2)) (both served). */
  logRatio(m1: number, m2: number): number {
    // φ_{m1}(t1) − φ_{m2}(t2) = (m1 − m2)t1 + (m2 − S/2)(t1 − t2) + C(t1) − C(t2).
    const s1 = this.memo.get(m1);
    const s2 = this.memo.get(m2);
    const phi = (m1 - m2) * s1.t + (m2 - this.total / 2) * (s1.t - s2.t) + this.series.difference(s1.t, s2.t);
    return phi + s1.logI - s2.logI;
  }

  /** φ(t) = N log 2 + (m − S/2)t + C(t). */
  private phi(m: number, t: number): number {
    return (this.b - this.a + 1) * Math.LN2 + (m - this.total / 2) * t + this.series.value(t);
  }

  /**
   * The saddle point, C'(t) = S/2 − m (m >= from): Newton from t = (S/2 − m)/C''(0). C' is odd,
   * increasing and concave on t >= 0, so from below the steps stay below the root and rise to it.
   */
  saddle(m: number): number {
    const target = this.total / 2 - m;
    if (target <= 0) return 0;
    const [, c0] = this.series.derivatives(0);
    let t = target / c0;
    for (let i = 0; i < 60; i++) {
      const [d1, d2] = this.series.derivatives(t);
      const step = (target - d1) / d2;
      t += step;
      if (!(Math.abs(step) > 1e-16 * t)) break;
    }
    return t;
  }

  /** The integral at m (see the class comment). */
  private computeCentral(m: number): SaddleIntegral {
    const t = this.saddle(m);
    const [, d2] = this.series.derivatives(t);
    const sigma = Math.sqrt(d2);
    const { K, h, last: first } = trapezoidGrid(sigma);
    let sum = 1;
    for (let j = 1; j <= K / 2; j++) {
      const y = j * h;
      const [re, ci] = this.series.shift(t, y);
      if (Number.isNaN(re)) throw new RangeError(`Q(${m}) for parts in [${this.a}, ${this.b}]: the power series does not reach node ${j}`);
      // (m − S/2)·y mod 2π, both phases exact: S·y/2 = 2π(S·j mod 2K)/(2K).
      const im = nodePhase(m, j, K) - nodePhase(this.total, j, 2 * K) + ci;
      sum += 2 * Math.exp(re) * Math.cos(im);
      if (j >= first && re < -CUTOFF) break;
    }
    return { t, phi: 0, logI: Math.log((h * sum) / (2 * Math.PI)) };
  }
}

/** How far out (×1/σ) a count's nodes go, for its work estimate. */
const TRAPEZOID_RANGE_NODES = 10;
/** Safety factor on the series' reach estimate (the stride sum for σ, the node count's rounding). */
const REACH_MARGIN = 1.02;
/** The integrand is summed until it is below e^{−CUTOFF} of its peak. */
const CUTOFF = 45;
