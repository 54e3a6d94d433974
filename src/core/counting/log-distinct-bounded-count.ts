import { LogCoshSum } from './log-cosh-sum.js';
import { DistinctMiddleCounts } from './log-distinct-middle-count.js';
import { SaddleMemo, type SaddleIntegral } from './saddle-memo.js';
import { saddleNewton } from './saddle-newton.js';
import { nodePhase, trapezoidGrid } from './saddle-trapezoid.js';

/**
 * log Q(m), Q(m) = Q_{a,b}(m) the number of partitions of m into distinct parts in [a, b]
 * (a >= 1, b >= a or b = ∞; OEIS A000009 for a = 1, b = ∞; A025147 for parts >= 2; A025148 for
 * parts >= 3), for 0 <= m <= 1e9, with numerically stable log-ratios log(Q(m1)/Q(m2)).
 *
 * - m <= exactUpTo: a table filled by c(m) += c(m − k) for k = a..b, m descending (the generating
 *   function Π_{a<=k<=b}(1 + q^k) multiplied in one factor at a time). Additions of positive
 *   numbers only, so each double carries a relative error of at most ~(b − a) roundings.
 * - m > exactUpTo: the saddle-point integral of the circle method's main arc, as in
 *   log-min-part-count.ts. With q = e^{−τ},
 *     Π_{k>=1}(1 + q^k) = P(q)/P(q²) = (1/√2)·exp(π²/(12τ) + τ/24)·P(e^{−4π²/τ})/P(e^{−2π²/τ})
 *   (P = Π 1/(1 − q^k), the modular transformation of the Dedekind eta function; Apostol 1990,
 *   "Modular functions and Dirichlet series", Thm 3.1), the last ratio 1 + O(e^{−2π²·Re(1/τ)}),
 *   below e^{−2π√(12m)} at the saddle. So Q(m) ≈ (1/2π)∫ exp φ(t + iy) dy with
 *     φ(τ) = −½ log 2 + π²/(12τ) + (m + 1/24)τ − Σ_{k<a} log(1 + e^{−kτ}) − T_b(τ),
 *     T_b(τ) = Σ_{k>b} log(1 + e^{−kτ}) = Σ_{j>=1} ((−1)^{j+1}/j)·e^{−j(b+1)τ}/(1 − e^{−jτ}),
 *   along the vertical line through the real saddle point t (φ'(t) = 0, Newton), by the
 *   trapezoidal rule (step 0.5/σ, σ² = φ''(t), range ±10/σ: error e^{−79} and e^{−50}; Trefethen
 *   & Weideman 2014, SIAM Review 56, §5). The j-series of T_b converges like e^{−j(b+1)t}; it is
 *   used only where (b + 1)t >= TAIL_MIN_BT (there T_b is below ~e^{−3}/t, so its rounding stays
 *   far below 1e-14 relative to Q).
 * - The middle of the polynomial (finite b, (b + 1)t <= CENTRAL_MAX_BT, so t near 0, where the
 *   1/τ pole and T_b cancel and T_b's series converges slowly): the same integral written without
 *   the pole, N log 2 − τS/2 + Σ log cosh(kτ/2) as a power series (log-distinct-middle-count.ts).
 *   Where neither serves (a narrow range near its middle), an exact table grown on demand.
 *   The other arcs (q near roots of unity of order >= 2) are dropped: near q = −1 the factors
 *   1/(1 + q^k), k < a odd, amplify them, so the table must reach further for larger a. Where the
 *   dropped part is below double rounding was decided by comparing with exact BigInt counts
 *   (test/partitions/log-distinct-bounded-count.test.ts): defaultDistinctExactUpTo(a) below.
 *
 * Log-ratios across the integral: log Q(m1) − log Q(m2) = [φ_{m1}(t1) − φ_{m2}(t2)] + log I1 −
 * log I2, the bracket formed from differences computed in place (log1p, expm1), never by
 * subtracting two logs of size ~√m.
 */
export class LogDistinctBoundedCounts {
  static readonly MAX_M = 1_000_000_000;
  /** The tail series T_b is used only where (b + 1)·t is at least this (see the class comment). */
  static readonly TAIL_MIN_BT = 1;
  /** Largest exact table built on demand for finite b (additions), and its widest part range (no overflow: Q < 2^1000). */
  static readonly SLOW_TABLE_ADDITIONS = 2e8;
  static readonly SLOW_TABLE_MAX_RANGE = 1000;
  /**
   * The power series serves (folded) m whose saddle point has (b + 1)t at most this (the tail
   * series serves from (b + 1)t = TAIL_MIN_BT on), and for wide ranges up to the largest (b + 1)t
   * <= CENTRAL_WIDEST_BT at which every node is within the series' reach.
   */
  static readonly CENTRAL_MAX_BT = DistinctMiddleCounts.MAX_BT;
  static readonly CENTRAL_WIDEST_BT = DistinctMiddleCounts.WIDEST_BT;
  /** Least N = b − a + 1 for the power series (the dropped arcs, see the class comment). */
  static readonly CENTRAL_MIN_RANGE = DistinctMiddleCounts.MIN_RANGE;
  /** Exact tables longer than this are built only when a count below their end is asked (logConcaveFrom). */
  static readonly LAZY_TABLE_ABOVE = 30_000;
  /** ... and tables of a finite range costing more additions than this (see logConcaveFrom). */
  static readonly LAZY_TABLE_ADDITIONS = 2e6;

  /** Σ_{a<=k<=b} k (Infinity for b = ∞): Q(m) = Q(S − m), Q(m) = 0 for m > S. */
  readonly total: number;
  /** The exact table, built on first use (planning only asks servable(), which needs none). */
  private table: Float64Array | null = null;
  private logTable: Float64Array | null = null;
  /** Largest m the table holds (or will hold once built). */
  private tableEnd: number;
  private readonly memo = new SaddleMemo((m) => computeSaddle(this.a, this.b, m));
  private concaveFrom = -1;
  /** The middle of the polynomial (finite b): the power-series integral (log-distinct-middle-count.ts). */
  private readonly middle: DistinctMiddleCounts;

  /**
   * `below`: counts for the same a and a smaller b (same exactUpTo), whose table this one's is
   * built from by multiplying in the factors (1 + q^k), b_below < k <= b (the same doubles as a
   * table built from scratch, for a fraction of the additions); shared as is when b_below >= exactUpTo.
   */
  constructor(
    readonly a: number,
    readonly b: number = Infinity,
    readonly exactUpTo: number = defaultDistinctExactUpTo(a),
    private readonly below?: LogDistinctBoundedCounts,
  ) {
    if (!Number.isInteger(a) || a < 1) throw new RangeError(`a must be an integer >= 1, got ${a}`);
    if (b !== Infinity && (!Number.isInteger(b) || b < a)) throw new RangeError(`b must be an integer >= a or Infinity, got ${b}`);
    if (!Number.isInteger(exactUpTo) || exactUpTo < 0) throw new RangeError(`exactUpTo must be a non-negative integer, got ${exactUpTo}`);
    this.total = b === Infinity ? Infinity : ((a + b) * (b - a + 1)) / 2;
    this.tableEnd = exactUpTo;
    this.middle = new DistinctMiddleCounts(a, b, this.total);
  }

  private get exact(): Float64Array {
    if (this.table === null) {
      const below = this.below;
      const chained = below !== undefined && below.a === this.a && below.b <= this.b && below.tableEnd === this.tableEnd;
      this.table = chained ? extendKnapsack(below.exact, below.b, this.b) : knapsack(this.a, this.b, this.tableEnd);
      this.logTable = this.table.map(Math.log);
    }
    return this.table;
  }

  private get logExact(): Float64Array {
    void this.exact;
    return this.logTable!;
  }

  /** Additions the table costs (setup work), built from one for [a, from] (from = a − 1: from scratch). */
  static setupWork(a: number, b = Infinity, exactUpTo: number = defaultDistinctExactUpTo(a), from = a - 1): number {
    if (b === Infinity) return byPartsWork(a, exactUpTo);
    let sum = 0;
    for (let k = Math.max(a, from + 1); k <= Math.min(b, exactUpTo); k++) sum += exactUpTo - k + 1;
    return sum;
  }

  /** Q(S − m) = Q(m): the half of the polynomial where the saddle point is positive. */
  private fold(m: number): number {
    return m > this.total / 2 ? this.total - m : m;
  }

  /** Whether the saddle-point integral serves this (folded) m: b = ∞, or the tail series converges fast enough. */
  private fast(m: number): boolean {
    if (this.b === Infinity) return true;
    const t = this.memo.get(m).t;
    return t > 0 && (this.b + 1) * t >= LogDistinctBoundedCounts.TAIL_MIN_BT;
  }

  /**
   * Whether every Q(m), m <= mMax, is served to full accuracy: from the table, the integral, or
   * (finite b) an exact table grown on demand within SLOW_TABLE_ADDITIONS. The saddle point falls
   * as m rises to S/2, so the integral, once unusable, stays so up to S/2.
   */
  servable(mMax: number): boolean {
    const top = Math.min(mMax, Math.floor(this.total / 2));
    // Below the middle regime the saddle point has (b + 1)t > CENTRAL_MAX_BT, where the tail series serves.
    if (top <= this.tableEnd || this.middle.serves(top) || this.fast(top)) return true;
    return this.b - this.a + 1 <= LogDistinctBoundedCounts.SLOW_TABLE_MAX_RANGE &&
      LogDistinctBoundedCounts.slowTableWork(this.a, this.b, top) <= LogDistinctBoundedCounts.SLOW_TABLE_ADDITIONS;
  }

  /**
   * How log Q(m) is served: 'table' (tabulated), 'middle' (the power-series integral), 'tail'
   * (the integral with the tail series T_b, or b = ∞) or 'grown' (an exact table grown on demand).
   */
  regime(m: number): 'table' | 'middle' | 'tail' | 'grown' {
    const f = this.fold(Math.min(m, this.total));
    if (f <= this.tableEnd) return 'table';
    if (this.middle.serves(f)) return 'middle';
    return this.fast(f) ? 'tail' : 'grown';
  }

  /** Additions the power series' coefficients cost (0 for b = ∞). */
  seriesWork(): number {
    return this.middle.seriesWork();
  }

  /** Series terms per node of a middle-regime count at m (for work estimates; the sums stop early). */
  middleTermsAt(m: number): number {
    return this.middle.termsAt(this.fold(Math.min(m, this.total)));
  }

  /** Whether m (folded) is above the table and served by the integral (no grown table). */
  servesByIntegral(m: number): boolean {
    const f = this.fold(Math.min(m, this.total));
    return f > this.tableEnd && (this.middle.serves(f) || this.fast(f));
  }

  /** Additions an exact table up to m costs. */
  static slowTableWork(a: number, b: number, m: number): number {
    return (Math.min(b, m) - a + 1) * m;
  }

  /**
   * The smallest L >= a with Q(m)² >= Q(m − 1)·Q(m + 1) for all L < m < exactUpTo and Q(k) <=
   * Q(L) for all k < L (exact checks on the table); above it the integral's values, checked
   * concave on a grid in the tests.
   */
  logConcaveFrom(): number {
    // Also a table of many additions (a finite range reaching past it, where knapsack runs factor
    // by factor: [74, 17805] to 5974 is ~1.8e7 additions, ~20-90 ms of a first sample): the same
    // answer, since Q(k) <= Q(tableEnd + 1) still holds (adding 1 to the largest part stays
    // within b).
    const costly = this.b !== Infinity && this.exactUpTo + 1 <= this.b && this.exactUpTo + 1 >= this.a &&
      LogDistinctBoundedCounts.setupWork(this.a, this.b, this.exactUpTo) > LogDistinctBoundedCounts.LAZY_TABLE_ADDITIONS;
    if (this.exactUpTo > LogDistinctBoundedCounts.LAZY_TABLE_ABOVE || costly) {
      // A large table (parts >= b' > ~400) is not built to find L: tableEnd + 1 serves as well
      // (above the table the counts are taken log-concave in either case, and Q is
      // non-decreasing from its smallest part on — add 1 to the largest part — so Q(k) <=
      // Q(tableEnd + 1) for k <= tableEnd). The table is then built only if a level's size
      // reaches it (at the upper levels, with probability ~0). The same answer whether or not the
      // table was built since, so the maximiser (and the stream) does not depend on what ran before.
      return this.exactUpTo + 1;
    }
    if (this.concaveFrom < 0) {
      const c = this.exact;
      let from = Math.min(this.a, c.length - 1);
      for (let m = this.a + 1; m < c.length - 1; m++) if (c[m] * c[m] < c[m - 1] * c[m + 1]) from = m;
      let prefixMax = 0;
      for (let k = 0; k < from; k++) prefixMax = Math.max(prefixMax, c[k]);
      while (from < c.length - 1 && c[from] < prefixMax) prefixMax = Math.max(prefixMax, c[from++]);
      this.concaveFrom = from;
    }
    return this.concaveFrom;
  }

  /** Q(m) as a double, m <= exactUpTo. */
  value(m: number): number {
    if (!(m <= this.exactUpTo)) throw new RangeError(`Q(m) as a double is tabulated up to ${this.exactUpTo}, got ${m}`);
    return m < this.exact.length ? this.exact[m] : 0;
  }

  /** log Q(m) (−Infinity where Q(m) = 0). */
  log(m: number): number {
    this.check(m);
    if (m > this.total) return -Infinity;
    const f = this.fold(m);
    if (f <= this.tableEnd) return f < this.exact.length ? this.logExact[f] : -Infinity;
    if (this.middle.serves(f)) return this.middle.log(f);
    if (this.fast(f)) {
      const s = this.memo.get(f);
      return s.phi + s.logI;
    }
    this.grow(f);
    return this.logExact[f];
  }

  /** log(Q(m1)/Q(m2)), stable (see the class comment). */
  logRatio(m1: number, m2: number): number {
    this.check(m1);
    this.check(m2);
    if (m1 > this.total || m2 > this.total) return this.log(m1) - this.log(m2);
    const f1 = this.fold(m1);
    const f2 = this.fold(m2);
    if (f1 === f2) return 0;
    const n = this.tableEnd + 1;
    if (f1 < n && f2 < n) return Math.log(this.exact[f1] / this.exact[f2]);
    if (f1 >= n && f2 >= n && this.middle.serves(f1) && this.middle.serves(f2)) return this.middle.logRatio(f1, f2);
    if (f1 < n || f2 < n || !this.fast(f1) || !this.fast(f2)) return this.log(f1) - this.log(f2);
    const s1 = this.memo.get(f1);
    const s2 = this.memo.get(f2);
    return this.phiDifference(f1, s1.t, f2, s2.t) + s1.logI - s2.logI;
  }

  /** The real saddle point for m (also a Boltzmann parameter of mean size ≈ m). */
  saddlePoint(m: number): number {
    return distinctBoundedSaddle(this.a, this.b, m);
  }

  /**
   * The t (of either sign) at which Boltzmann distinct parts in [a, b] have mean size m,
   * Σ k/(e^{kt} + 1) = m, for 0 < m < S (finite b; m > S/2 by symmetry, t(S − m) = −t(m)).
   */
  tilt(m: number): number {
    const f = this.fold(m);
    const sign = m > this.total / 2 ? -1 : 1;
    if (f >= this.middle.from) return sign * this.middle.saddle(f);
    return sign * distinctBoundedSaddle(this.a, this.b, Math.max(1, f));
  }

  /**
   * The Boltzmann mean size Σ_{a<=k<=b} k/(e^{kt} + 1) at real t (finite b): S/2 − C'(t) near
   * t = 0 (the series), the saddle equation's terms π²/(12t²) − 1/24 − ... + T_b'(t) further out
   * (accurate there to e^{−π²/t}), S − mean(−t) for t < 0. A guess for the maximisers (exact
   * searches), so its own accuracy only sets how far they search.
   */
  meanSize(t: number): number {
    if (t < 0) return this.total - this.meanSize(-t);
    if (t === 0) return this.total / 2;
    const near = this.middle.meanSize(t);
    if (near !== null) return near;
    return -derivatives(this.a, this.b, 0, t)[0];
  }

  /** Grows the exact table to cover m (finite b, where the integral is not used). */
  private grow(m: number): void {
    if (this.b - this.a + 1 > LogDistinctBoundedCounts.SLOW_TABLE_MAX_RANGE || LogDistinctBoundedCounts.slowTableWork(this.a, this.b, m) > LogDistinctBoundedCounts.SLOW_TABLE_ADDITIONS) {
      throw new RangeError(`Q(${m}) for parts in [${this.a}, ${this.b}] is beyond the exact table's limit`);
    }
    const doubled = Math.min(Math.floor(this.total / 2), Math.max(m, 2 * this.tableEnd));
    this.tableEnd = LogDistinctBoundedCounts.slowTableWork(this.a, this.b, doubled) <= LogDistinctBoundedCounts.SLOW_TABLE_ADDITIONS ? doubled : m;
    this.table = null;
  }

  /** φ_{m1}(t1) − φ_{m2}(t2) without cancellation of the large terms. */
  private phiDifference(m1: number, t1: number, m2: number, t2: number): number {
    const d = t1 - t2;
    // π²/(12t1) − π²/(12t2) + (m1 + 1/24)t1 − (m2 + 1/24)t2 = d·(m1 + 1/24 − π²/(12 t1 t2)) + (m1 − m2)·t2
    let sum = d * (m1 + 1 / 24 - PI2_12 / (t1 * t2)) + (m1 - m2) * t2;
    // −Σ_{k<a} log((1 + e^{−k t1})/(1 + e^{−k t2})) = −Σ log1p(e^{−k t2}·expm1(−k d)/(1 + e^{−k t2}))
    const head = headSeries(this.a, Math.max(t1, t2));
    // −Σ_{k<a}: d·S'/2 − (C(t1) − C(t2)) by the series (log-cosh-sum.ts), in place.
    if (head !== null) sum += (d * head.total) / 2 - head.difference(t1, t2);
    else {
      for (let k = 1; k < this.a; k++) {
        const e = Math.exp(-k * t2);
        sum -= Math.log1p((e * Math.expm1(-k * d)) / (1 + e));
      }
    }
    if (this.b !== Infinity) sum -= tailDifference(this.b, t1, t2);
    return sum;
  }

  private check(m: number): void {
    if (!Number.isInteger(m) || m < 0 || m > LogDistinctBoundedCounts.MAX_M) {
      throw new RangeError(`m must be an integer in [0, ${LogDistinctBoundedCounts.MAX_M}], got ${m}`);
    }
  }
}

/** Q(0..upTo) for distinct parts in [a, b], by c(m) += c(m − k) (m descending), doubles; b = ∞ by number of parts. */
export function knapsack(a: number, b: number, upTo: number): Float64Array {
  if (b === Infinity) return distinctByParts(a, upTo);
  const c = new Float64Array(upTo + 1);
  c[0] = 1;
  const last = Math.min(b, upTo);
  for (let k = a; k <= last; k++) for (let m = upTo; m >= k; m--) c[m] += c[m - k];
  return c;
}

/**
 * Q(0..upTo) for distinct parts >= a, by number of parts: j distinct parts λ_1 > ... > λ_j >= a
 * of m are, less a + (j − i) from the i-th, the partitions of m − ja − j(j − 1)/2 into at most j
 * parts (Andrews 1976, §1.3), counted by p_j(M) = p_{j−1}(M) + p_j(M − j) (parts <= j, by
 * conjugation): positive additions only, about 2·j_max·upTo of them (j_max ~ upTo/a) instead of
 * ~upTo²/2 factor by factor.
 */
export function distinctByParts(a: number, upTo: number): Float64Array {
  const c = new Float64Array(upTo + 1);
  c[0] = 1;
  const p = new Float64Array(upTo + 1);
  p[0] = 1;
  for (let j = 1; ; j++) {
    const base = j * a + (j * (j - 1)) / 2;
    if (base > upTo) break;
    // Later j read p only up to upTo − (their larger base).
    for (let M = j; M <= upTo - base; M++) p[M] += p[M - j];
    for (let m = base; m <= upTo; m++) c[m] += p[m - base];
  }
  return c;
}

function byPartsWork(a: number, upTo: number): number {
  let work = 0;
  for (let j = 1; j * a + (j * (j - 1)) / 2 <= upTo; j++) work += 2 * (upTo - j * a - (j * (j - 1)) / 2 + 1);
  return work;
}

/** Q(0..upTo) for parts in [a, b] from the table for [a, b0], b0 <= b (shared when nothing is to multiply in). */
function extendKnapsack(base: Float64Array, b0: number, b: number): Float64Array {
  const upTo = base.length - 1;
  if (b0 >= upTo || b0 === b) return base;
  const c = base.slice();
  const last = Math.min(b, upTo);
  for (let k = b0 + 1; k <= last; k++) for (let m = upTo; m >= k; m--) c[m] += c[m - k];
  return c;
}

const PI2_12 = (Math.PI * Math.PI) / 12;
/** The integrand is summed until it is below e^{−CUTOFF} of its peak. */
const CUTOFF = 45;

/**
 * The table's end per a. Accuracy: above it the dropped arcs are below double rounding; measured
 * against exact BigInt counts, log-ratio errors above 5e-15 were seen up to m = 1670 (a = 2, 3),
 * 2220 (7), 2940 (20), 3875 (50), 5555 (100); 2000 + 50a + a²/20 keeps a margin above each
 * (test/partitions/log-distinct-bounded-count.test.ts checks from the table's end on). Speed: at
 * least 4000, since just above ~2000 the integrand decays to e^{−45} only far out (its floor is
 * e^{−π²/(12t)}, raised by the factors 1/|1 + q^k|, k < a), which costs thousands of nodes; from
 * m = 4000 on a count takes 0.01–0.3 ms (a <= 100).
 */
export function defaultDistinctExactUpTo(a: number): number {
  return Math.ceil(Math.max(4000, 2000 + 50 * a + (a * a) / 20));
}

/**
 * T_b(t1) − T_b(t2) term by term without cancellation: with g_j(t) = e^{−j(b+1)t}/(1 − e^{−jt}),
 * g_j(t1) − g_j(t2) = g_j(t2)·expm1(Δ_j), Δ_j = −j(b+1)(t1 − t2) − log((1 − e^{−jt1})/(1 − e^{−jt2})).
 */
function tailDifference(b: number, t1: number, t2: number): number {
  const d = t1 - t2;
  let sum = 0;
  for (let j = 1; j <= TAIL_TERMS; j++) {
    const den = -Math.expm1(-j * t2);
    const g = Math.exp(-j * (b + 1) * t2) / den;
    const delta = -j * (b + 1) * d - Math.log1p((-Math.exp(-j * t2) * Math.expm1(-j * d)) / den);
    const term = (g * Math.expm1(delta)) / j;
    sum += j % 2 === 1 ? term : -term;
    if (Math.exp(-j * (b + 1) * Math.min(t1, t2)) / den < 1e-18 * (Math.abs(sum) + 1e-300)) break;
  }
  return sum;
}

const TAIL_TERMS = 400;

/** T_b(t) = Σ_{k>b} log(1 + e^{−kt}) for real t by its j-series (b finite). */
function tail(b: number, t: number): number {
  let sum = 0;
  for (let j = 1; ; j++) {
    const g = Math.exp(-j * (b + 1) * t) / -Math.expm1(-j * t);
    sum += (j % 2 === 1 ? g : -g) / j;
    if (g < 1e-18 * Math.abs(sum)) break;
    if (j > TAIL_TERMS) break;
  }
  return sum;
}

/** T_b'(t) and T_b''(t). */
function tailDerivatives(b: number, t: number): [number, number] {
  let d1 = 0;
  let d2 = 0;
  for (let j = 1; j <= TAIL_TERMS; j++) {
    const em = Math.exp(-j * t);
    const den = -Math.expm1(-j * t);
    const g = Math.exp(-j * (b + 1) * t) / den;
    const l1 = -j * (b + 1) - (j * em) / den;
    const l2 = (j * j * em) / (den * den);
    const sign = j % 2 === 1 ? 1 / j : -1 / j;
    d1 += sign * g * l1;
    d2 += sign * g * (l1 * l1 + l2);
    if (g * l1 * l1 < 1e-18 * Math.abs(d2) + 1e-300) break;
  }
  return [d1, d2];
}

/**
 * The parts below a (a > HEAD_SERIES_ABOVE): Σ_{k=1}^{a−1} log(1 + e^{−kτ}) = (a − 1)·log 2 −
 * τ·S'/2 + C(τ), S' = a(a − 1)/2, C = Σ_{k<a} log cosh(kτ/2) as a power series (log-cosh-sum.ts),
 * ~350 multiply-adds per evaluation instead of a − 1 exponentials, logarithms and arctangents
 * (a ~ 2500: ~50x faster). Used where (a − 1)|τ| <= π·MAX_W (the series' reach); the direct sum
 * otherwise, and always for a <= HEAD_SERIES_ABOVE (their values, and so the streams, unchanged).
 */
const HEAD_SERIES_ABOVE = 32;
const heads = new Map<number, LogCoshSum>();
function headSeries(a: number, t: number): LogCoshSum | null {
  if (a <= HEAD_SERIES_ABOVE || !((a - 1) * Math.abs(t) <= Math.PI * LogCoshSum.MAX_W)) return null;
  let head = heads.get(a);
  if (head === undefined) {
    head = new LogCoshSum(1, a - 1);
    heads.set(a, head);
  }
  return head;
}

/** φ'(t) and φ''(t) on the real axis. */
function derivatives(a: number, b: number, m: number, t: number): [number, number] {
  let d1 = -PI2_12 / (t * t) + m + 1 / 24;
  let d2 = (2 * PI2_12) / (t * t * t);
  const head = headSeries(a, t);
  if (head !== null) {
    // Σ_{k<a} k/(e^{kt} + 1) = S'/2 − C'(t) and Σ_{k<a} k²e^{−kt}/(1 + e^{−kt})² = C''(t) (log-cosh-sum.ts).
    const [c1, c2] = head.derivatives(t);
    d1 += head.total / 2 - c1;
    d2 -= c2;
  } else {
    for (let k = 1; k < a; k++) {
      const e = Math.exp(-k * t);
      d1 += (k * e) / (1 + e);
      d2 -= (k * k * e) / ((1 + e) * (1 + e));
    }
  }
  if (b !== Infinity) {
    const [t1, t2] = tailDerivatives(b, t);
    d1 -= t1;
    d2 -= t2;
  }
  return [d1, d2];
}

/**
 * The real saddle point t of φ for (a, b, m), m >= 1: Σ_{a<=k<=b} k/(e^{kt} + 1) ≈ m, so also the
 * Boltzmann parameter x = e^{−t} at which distinct parts in [a, b] have mean size ≈ m.
 */
export function distinctBoundedSaddle(a: number, b: number, m: number): number {
  return saddleNewton((t) => derivatives(a, b, m, t), Math.PI / Math.sqrt(12 * m), 80, 1e-15);
}

function computeSaddle(a: number, b: number, m: number): SaddleIntegral {
  const t = distinctBoundedSaddle(a, b, m);
  const [, d2] = derivatives(a, b, m, t);
  const sigma = Math.sqrt(d2);
  let phi = -0.5 * Math.LN2 + PI2_12 / t + (m + 1 / 24) * t;
  const head = headSeries(a, t);
  // Σ_{k<a} log(1 + e^{−kt}) = (a − 1)·log 2 − t·S'/2 + C(t) (log-cosh-sum.ts).
  if (head !== null) phi -= (a - 1) * Math.LN2 - (t * head.total) / 2 + head.value(t);
  else for (let k = 1; k < a; k++) phi -= Math.log1p(Math.exp(-k * t));
  const tailT = b === Infinity ? 0 : tail(b, t);
  phi -= tailT;
  // Trapezoid with h = 2π/K, K integer, so that the phase m·y = 2π(m·j mod K)/K is exact.
  // Beyond the Gaussian core the integrand is not Gaussian: |exp(π²/(12τ))| decays only to
  // exp(π²/(12t)·(1/(1 + s²) − 1)), s = y/t. So the sum runs on until the integrand is below
  // e^{−CUTOFF} relative (at least TRAPEZOID_RANGE/σ, at most y = π).
  const { K, h, last: first } = trapezoidGrid(sigma);
  let sum = 1;
  for (let j = 1; j <= K / 2; j++) {
    const [re, im] = phiShift(a, b, m, t, j * h, j, K);
    sum += 2 * Math.exp(re) * Math.cos(im);
    if (j >= first && re < -CUTOFF) break;
  }
  const logI = Math.log((h * sum) / (2 * Math.PI));
  return { t, phi, logI };
}

/**
 * φ(t + iy) − φ(t) (real and imaginary parts), y = 2πj/K:
 *   π²/12·(1/(t + iy) − 1/t) = −(π²/(12t²))·(iy + y²/t)/(1 + (y/t)²);  (m + 1/24)·iy;
 *   −Σ_{k<a} log(1 + p_k(e^{−iky} − 1)), p_k = e^{−kt}/(1 + e^{−kt});  −(T_b(t + iy) − T_b(t)).
 */
function phiShift(a: number, b: number, m: number, t: number, y: number, j: number, K: number): [number, number] {
  const s = y / t;
  const s2 = s * s;
  const c = PI2_12 / (t * t) / (1 + s2);
  let re = (-c * y * y) / t;
  let im = nodePhase(m, j, K) - c * y + y / 24;
  const head = headSeries(a, t);
  const shifted = head === null ? null : head.shift(t, y);
  if (shifted !== null && !Number.isNaN(shifted[0])) {
    // Σ_{k<a} [log(1 + e^{−k(t+iy)}) − log(1 + e^{−kt})] = −iy·S'/2 + C(t + iy) − C(t), the
    // phase y·S'/2 = 2π(S'·j mod 2K)/(2K) exact (nodes out of the series' reach: the loop below).
    re -= shifted[0];
    im += nodePhase(head!.total, j, 2 * K) - shifted[1];
  } else {
    for (let k = 1; k < a; k++) {
      const e = Math.exp(-k * t);
      const p = e / (1 + e);
      const half = Math.sin((k * y) / 2);
      const wr = -2 * p * half * half;
      const wi = -p * Math.sin(k * y);
      re -= 0.5 * Math.log1p(2 * wr + wr * wr + wi * wi);
      im -= Math.atan2(wi, 1 + wr);
    }
  }
  if (b !== Infinity) {
    // T_b(t + iy) − T_b(t) = Σ_j ((−1)^{j+1}/j)·g_j(t)·(e^{Δ_j} − 1), term by term without
    // cancellation: Δ_j = −ij(b+1)y − log(1 + w), w = p(1 − e^{−ijy}), p = e^{−jt}/(1 − e^{−jt}).
    let tr = 0;
    let ti = 0;
    for (let jj = 1; jj <= TAIL_TERMS; jj++) {
      const den = -Math.expm1(-jj * t);
      const g = Math.exp(-jj * (b + 1) * t) / den;
      const p = Math.exp(-jj * t) / den;
      const half = Math.sin((jj * y) / 2);
      const wr = 2 * p * half * half;
      const wi = p * Math.sin(jj * y);
      const dr = -0.5 * Math.log1p(2 * wr + wr * wr + wi * wi);
      const di = -jj * (b + 1) * y - Math.atan2(wi, 1 + wr);
      const hd = Math.sin(di / 2);
      const er = Math.expm1(dr) * Math.cos(di) - 2 * hd * hd; // Re(e^Δ − 1)
      const ei = Math.exp(dr) * Math.sin(di);
      const sign = jj % 2 === 1 ? 1 / jj : -1 / jj;
      tr += sign * g * er;
      ti += sign * g * ei;
      if (g < 1e-18) break;
    }
    re -= tr;
    im -= ti;
  }
  return [re, im];
}
