/**
 * The trapezoidal rule along the vertical line through a real saddle point t, for the integral
 * (1/2π) ∫ exp(φ(t + iy) − φ(t)) dy of a circle-method count: the integrand is analytic and
 * Gaussian-like (width 1/σ, σ² = φ''(t)), so step h converges like e^{−2π²/(hσ)²} (Trefethen &
 * Weideman 2014, SIAM Review 56, §5): h = STEP/σ leaves e^{−79}; RANGE/σ, where the Gaussian is
 * e^{−50}, is where the sum may stop. The step is h = 2π/K with K an integer, so that the phase
 * m·y of the node y = jh is reduced mod 2π exactly (nodePhase).
 */
export const TRAPEZOID_STEP = 0.5;
export const TRAPEZOID_RANGE = 10;

export interface TrapezoidGrid {
  /** Nodes per 2π: h = 2π/K. */
  readonly K: number;
  readonly h: number;
  /** The last node j with jh <= RANGE/σ (rounded up). */
  readonly last: number;
}

/** The grid for width σ, with at least leastK nodes per 2π (0: the Gaussian's step alone). */
export function trapezoidGrid(sigma: number, leastK = 0): TrapezoidGrid {
  const K = Math.ceil(Math.max((2 * Math.PI * sigma) / TRAPEZOID_STEP, leastK));
  const h = (2 * Math.PI) / K;
  const last = Math.ceil((TRAPEZOID_RANGE * K) / (2 * Math.PI * sigma));
  return { K, h, last };
}

/** m·y mod 2π at the node y = 2πj/K, exactly (m·j < 2^53). */
export function nodePhase(m: number, j: number, K: number): number {
  return (2 * Math.PI * ((m * j) % K)) / K;
}
