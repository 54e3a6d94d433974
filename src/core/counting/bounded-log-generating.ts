import { complexLi2ExpNeg } from './complex-dilog.js';
import { saddleNewton } from './saddle-newton.js';

/**
 * L(τ) = −Σ_{k=a}^{b} log(1 − e^{−kτ}) for parts in [a, b] in O(1) terms whatever b (direct sums,
 * Dedekind eta and Euler–Maclaurin tails: see log-bounded-part-count.ts), on the real axis with
 * its derivatives (the saddle point) and at complex τ = t + iy.
 */

/** How L is evaluated for [a, b]. */
export interface Shape {
  readonly a: number;
  readonly b: number;
  /** Sum the terms k = a..b directly. */
  readonly direct: boolean;
  /** Otherwise: the head Σ_{k<a} directly (true) or as −S_{a−1} (false). */
  readonly headDirect: boolean;
}

/** L by direct sums when b < DIRECT_BELOW (the head Σ_{k<a} when a − 1 < DIRECT_BELOW). */
export const DIRECT_BELOW = 16;

export function shapeOf(a: number, b: number): Shape {
  return { a, b, direct: b < DIRECT_BELOW, headDirect: a - 1 < DIRECT_BELOW };
}

export const PI2_6 = (Math.PI * Math.PI) / 6;

// ---------------------------------------------------------------------------------------------
// Real parts: L'(t), L''(t) on the real axis (Newton and the trapezoid width).

/** w(u) = 1/(e^u − 1) and w'(u) = −w(1 + w). */
export function w(u: number): number {
  return 1 / Math.expm1(u);
}

/**
 * [φ'(t), φ''(t)] with φ(t) = mt + L(t). L'' is exact for direct sums and the eta part; the
 * Euler–Maclaurin tails contribute their integral term only (σ needs no more).
 */
export function realDerivatives(shape: Shape, m: number, t: number): [number, number] {
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
export function tailDerivatives(c: number, t: number): [number, number] {
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
export const EM_TERMS = 8;
/**
 * Correction terms used at c: the first dropped one, ~2(2J)!/((2π)^{2J+2}(c + ½)^{2J+1}), is
 * below 3e-17 in each tier (J = 2 from c = 500, 3 from 120, 4 from 50, 6 from 25, else 8).
 */
export function emTerms(c: number): number {
  return c >= 500 ? 2 : c >= 120 ? 3 : c >= 50 ? 4 : c >= 25 ? 6 : EM_TERMS;
}
export const BERNOULLI_EVEN = [1 / 6, -1 / 30, 1 / 42, -1 / 30, 5 / 66, -691 / 2730, 7 / 6, -3617 / 510];
export const EM_BETA = BERNOULLI_EVEN.map((B, i) => {
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
export function wDerivativesReal(u: number, n: number): number[] {
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

/** L(t) on the real axis. */
export function realL(shape: Shape, t: number): number {
  return complexL(shape, t, 0)[0];
}

/** [Re, Im] of L(t + iy) for the shape. */
export function complexL(shape: Shape, t: number, y: number): [number, number] {
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
export function log1mExp(x: number, y: number): [number, number] {
  const e = Math.exp(-x);
  // 1 − e^{−x}(cos y − i sin y) = (1 − e cos y) + i e sin y; |.|² = (1 − e)² + 4e sin²(y/2).
  const den = -Math.expm1(-x); // 1 − e
  const s = Math.sin(y / 2);
  const re = Math.log(den) + 0.5 * Math.log1p((4 * e * s * s) / (den * den));
  const im = Math.atan2(e * Math.sin(y), 1 - e * Math.cos(y));
  return [re, im];
}

/** S_c(τ) = Σ_{k>c} log(1 − e^{−kτ}) by Euler–Maclaurin (see the class comment), τ = t + iy. */
export function tailSum(c: number, t: number, y: number): [number, number] {
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
export function emCorrections(c: number, t: number, y: number): [number, number] {
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
export function complexW(ur: number, ui: number): [number, number] {
  if (ur > 700) return [0, 0]; // |w| < e^{−700}: and e^{ur} would overflow

  // e^u − 1 = (e^{ur} cos ui − 1) + i e^{ur} sin ui; the real part as expm1(ur)·cos ui − 2 sin²(ui/2).
  const s = Math.sin(ui / 2);
  const dr = Math.expm1(ur) * Math.cos(ui) - 2 * s * s;
  const di = Math.exp(ur) * Math.sin(ui);
  const d = dr * dr + di * di;
  return [dr / d, -di / d];
}

export function complexPoly(p: number[], xr: number, xi: number): [number, number] {
  let sr = 0;
  let si = 0;
  for (let j = p.length - 1; j >= 0; j--) {
    const nr = sr * xr - si * xi + p[j];
    si = sr * xi + si * xr;
    sr = nr;
  }
  return [sr, si];
}
