import { boundedSaddle, emCorrections, PI2_6, realDerivatives, realL, type Shape } from './bounded-log-generating.js';
import { complexLi2ExpNeg, LI2_ODD } from './complex-dilog.js';
import { log1mExpShift } from './log1m-exp-shift.js';
import type { SaddleIntegral } from './saddle-memo.js';
import { nodePhase, trapezoidGrid } from './saddle-trapezoid.js';

/**
 * The main-arc saddle-point integral for parts in [a, b] at the trapezoid nodes (differences of L
 * formed term by term) and the envelope integral of log-ratios (see log-bounded-part-count.ts).
 */

// ---------------------------------------------------------------------------------------------
// Complex parts: L(t + iy) − L(t) at the trapezoid nodes.

export function computeSaddle(shape: Shape, m: number): SaddleIntegral {
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
export function envelopeIntegral(shape: Shape, m2: number, m1: number): number {
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

