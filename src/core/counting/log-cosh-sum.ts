/**
 * C(τ) = Σ_{k=a}^{b} log cosh(kτ/2) as a power series in τ, for complex τ with |bτ| < π: the part
 * of log Π_{a<=k<=b}(1 + e^{−kτ}) that is not linear in τ near τ = 0, since
 *   log(1 + e^{−x}) = log 2 − x/2 + log cosh(x/2),
 *   log Π_{a<=k<=b}(1 + e^{−kτ}) = N·log 2 − τ·S/2 + C(τ),   N = b − a + 1,  S = Σ_{a<=k<=b} k.
 *
 * With log cosh z = Σ_{j>=1} log(1 + 4z²/((2j − 1)²π²)) (the product for cosh, DLMF 4.36.2)
 * expanded in z², log cosh z = Σ_{n>=1} (−1)^{n+1}·β(2n)/n·(2z/π)^{2n}, β(s) = Σ_{j odd} j^{−s}
 * = (1 − 2^{−s})ζ(s) (DLMF 25.2.1), radius |z| < π/2. Summed over k, with w = bτ/π:
 *   C(τ) = Σ_{n>=1} c_n·w^{2n},   c_n = (−1)^{n+1}·β(2n)·p_n/n,   p_n = Σ_{a<=k<=b} (k/b)^{2n},
 * converging like |w|^{2n} (|w| < 1). β(2n) = (2^{2n} − 1)|B_{2n}|π^{2n}/(2(2n)!) for n <= 6
 * (DLMF 25.6.2 with B_2..B_12 from DLMF Table 24.2.1), the direct sum over odd j < 199 plus its
 * integral tail (relative error < 1e-25) for n >= 7.
 *
 * Differences C(τ) − C(t) are formed term by term, w^{2n} − w0^{2n} by the recurrence
 * D_{n+1} = u·D_n + u0^n·D_1 (u = w², u0 = w0²), so that a difference of size δ carries
 * rounding ~1e-16·δ and not ~1e-16·C (C ~ N at the saddle).
 */
export class LogCoshSum {
  /** Largest |w| = b|τ|/π at which the series may be summed (terms fall like |w|^{2n}). */
  static readonly MAX_W = 0.93;
  readonly total: number;
  readonly size: number;
  /** Terms kept: |c_n|·|w|^{2n} <= N·reach^{2n}/n below 1e-22 relative to N beyond them. */
  readonly terms: number;
  /** c_n, n = 1..terms (index n − 1). */
  private readonly coefficients: Float64Array;

  /** `reach`: the largest |w| = b|τ|/π the caller will ask for (<= MAX_W). */
  constructor(
    readonly a: number,
    readonly b: number,
    readonly reach = LogCoshSum.MAX_W,
  ) {
    if (!Number.isInteger(a) || a < 1 || !Number.isInteger(b) || b < a) throw new RangeError(`need integers 1 <= a <= b, got [${a}, ${b}]`);
    if (!(reach > 0 && reach <= LogCoshSum.MAX_W)) throw new RangeError(`reach must be in (0, ${LogCoshSum.MAX_W}], got ${reach}`);
    this.size = b - a + 1;
    this.total = ((a + b) * this.size) / 2;
    this.terms = LogCoshSum.termsFor(reach);
    const p = powerSums(a, b, this.terms);
    this.coefficients = new Float64Array(this.terms);
    for (let n = 1; n <= this.terms; n++) this.coefficients[n - 1] = ((n % 2 === 1 ? 1 : -1) * oddZeta(2 * n) * p[n - 1]) / n;
  }

  /** Terms for a reach: reach^{2n} < 1e-22 (c_n <= p_n/n <= N/n and the sums are >= their first term ~ N·w²). */
  static termsFor(reach: number): number {
    return Math.max(4, Math.ceil(Math.log(1e-22) / (2 * Math.log(reach))) + 2);
  }

  /** Additions the constructor does (power sums; for setup estimates). */
  static setupWork(a: number, b: number, reach = LogCoshSum.MAX_W): number {
    return (b - a + 1) * Math.min(LogCoshSum.termsFor(reach), 100);
  }

  /** w = bτ/π scale. */
  private get scale(): number {
    return this.b / Math.PI;
  }

  /** C(t) for real t (|bt| <= π·reach). */
  value(t: number): number {
    const u = (this.scale * t) ** 2;
    let sum = 0;
    let pw = 1;
    for (let n = 0; n < this.terms; n++) {
      pw *= u;
      const term = this.coefficients[n] * pw;
      sum += term;
      if (Math.abs(term) < 1e-20 * Math.abs(sum)) break;
    }
    return sum;
  }

  /** C'(t) and C''(t) for real t. */
  derivatives(t: number): [number, number] {
    const s = this.scale;
    const w = s * t;
    const u = w * w;
    let d1 = 0;
    let d2 = 0;
    let pw = 1; // w^{2n − 2}
    for (let n = 1; n <= this.terms; n++) {
      const c = this.coefficients[n - 1];
      const t2 = 2 * n * (2 * n - 1) * c * pw;
      d2 += t2;
      d1 += 2 * n * c * pw * w;
      pw *= u;
      if (Math.abs(t2) < 1e-20 * Math.abs(d2)) break;
    }
    return [s * d1, s * s * d2];
  }

  /** C(t1) − C(t2) for real t1, t2, without cancellation between the two. */
  difference(t1: number, t2: number): number {
    const s = this.scale;
    const u1 = (s * t1) ** 2;
    const u2 = (s * t2) ** 2;
    const d1 = s * s * (t1 - t2) * (t1 + t2);
    let d = d1;
    let u2n = u2; // u2^n
    // |D_n| <= n·max(u1, u2)^{n−1}·|D_1| (mean value theorem): stop once that bound is negligible.
    const umax = Math.max(u1, u2);
    let bound = Math.abs(d1);
    let sum = 0;
    for (let n = 1; n <= this.terms; n++) {
      const c = this.coefficients[n - 1];
      sum += c * d;
      if (d === 0 || Math.abs(c) * n * bound < 1e-20 * Math.abs(sum)) break;
      bound *= umax;
      d = u1 * d + u2n * d1;
      u2n *= u2;
    }
    return sum;
  }

  /**
   * C(t + iy) − C(t) (real, imaginary) for real t, y; NaN when |w| > reach (out of the series'
   * reach: the caller must not ask there).
   */
  shift(t: number, y: number): [number, number] {
    const s = this.scale;
    if (s * s * (t * t + y * y) > this.reach * this.reach) return [NaN, NaN];
    const u0 = (s * t) ** 2;
    // u = (s(t + iy))² = s²(t² − y²) + i·2s²ty; D_1 = u − u0 = s²(−y² + 2ity).
    const ur = s * s * (t * t - y * y);
    const ui = 2 * s * s * t * y;
    const d1r = -s * s * y * y;
    const d1i = ui;
    let dr = d1r;
    let di = d1i;
    let u0n = u0;
    // |D_n| <= n·max(|u|, u0)^{n−1}·|D_1| (along the segment from u0 to u): stop once negligible.
    const umax = Math.max(Math.sqrt(ur * ur + ui * ui), u0);
    let bound = Math.sqrt(d1r * d1r + d1i * d1i);
    let sr = 0;
    let si = 0;
    for (let n = 1; n <= this.terms; n++) {
      const c = this.coefficients[n - 1];
      sr += c * dr;
      si += c * di;
      if (Math.abs(c) * n * bound < 1e-20 * (Math.abs(sr) + Math.abs(si))) break;
      bound *= umax;
      const nr = ur * dr - ui * di + u0n * d1r;
      const ni = ur * di + ui * dr + u0n * d1i;
      dr = nr;
      di = ni;
      u0n *= u0;
    }
    return [sr, si];
  }
}

/** p_n = Σ_{a<=k<=b} (k/b)^{2n}, n = 1..terms; each k's powers stop once below 1e-22 (p_n >= 1). */
function powerSums(a: number, b: number, terms: number): Float64Array {
  const p = new Float64Array(terms);
  // Smallest k first, so that each p_n is summed from its small terms up.
  for (let k = a; k <= b; k++) {
    const x = (k / b) ** 2;
    let pw = x;
    for (let n = 0; n < terms && pw > 1e-22; n++) {
      p[n] += pw;
      pw *= x;
    }
  }
  return p;
}

/** |B_{2n}| for n = 1..6 (DLMF Table 24.2.1). */
const BERNOULLI = [1 / 6, 1 / 30, 1 / 42, 1 / 30, 5 / 66, 691 / 2730];

/** β(s) = Σ_{j odd} j^{−s} for even s >= 2 (see the class comment), remembered (~100 powers each; every series asks for the same ~350). */
export function oddZeta(s: number): number {
  let value = oddZetas.get(s);
  if (value === undefined) {
    value = computeOddZeta(s);
    oddZetas.set(s, value);
  }
  return value;
}
const oddZetas = new Map<number, number>();

function computeOddZeta(s: number): number {
  const n = s / 2;
  if (n <= BERNOULLI.length) {
    let factorial = 1;
    for (let i = 2; i <= s; i++) factorial *= i;
    return ((2 ** s - 1) * BERNOULLI[n - 1] * Math.PI ** s) / (2 * factorial);
  }
  // Largest terms last; tail Σ_{j odd >= J} j^{−s} ≈ J^{1−s}/(2(s − 1)) + J^{−s}/2 (< 1e-25 here).
  const J = 199;
  let sum = J ** (1 - s) / (2 * (s - 1)) + J ** -s / 2;
  for (let j = J - 2; j >= 1; j -= 2) sum += j ** -s;
  return sum;
}
