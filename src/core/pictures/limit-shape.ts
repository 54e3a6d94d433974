import type { Partition } from '../partition.js';

/**
 * Limit shapes of Ferrers diagrams scaled by 1/√n (Vershik 1996, "Statistical mechanics of
 * combinatorial partitions, and their limit shapes", Funct. Anal. Appl. 30). Put a diagram with
 * its parts as rows; at column x√n count the rows that reach it, y√n = #{i : λ_i ≥ x√n}.
 *
 * - All partitions: e^{−cx} + e^{−cy} = 1 with c = π/√6, i.e. y = −ln(1 − e^{−cx}) / c.
 *   (In the Boltzmann model with x_0 = e^{−c/√n}, E #{parts ≥ k} = Σ_{j≥k} x_0^j/(1 − x_0^j)
 *   ≈ −(√n/c) ln(1 − e^{−ck/√n}); Fristedt 1993 proves the concentration.)
 * - Distinct parts: c = π/√12 and e^{cy} = 1 + e^{−cx}, i.e. y = ln(1 + e^{−cx}) / c
 *   (Σ_{j≥k} x_0^j/(1 + x_0^j) ≈ (√n/c) ln(1 + e^{−ck/√n}); Vershik 1996, the "Fermi" case).
 *   At x = 0 it gives the known mean number of distinct parts, (2√3 ln 2/π)·√n.
 */
export interface LimitShape {
  readonly name: 'partitions' | 'distinct-parts';
  readonly c: number;
  /** The curve's equation, in plain text. */
  readonly equation: string;
  y(x: number): number;
}

export const PARTITION_LIMIT_SHAPE: LimitShape = {
  name: 'partitions',
  c: Math.PI / Math.sqrt(6),
  equation: 'e^(-c x) + e^(-c y) = 1, c = pi/sqrt(6)',
  y(x) {
    return -Math.log1p(-Math.exp(-this.c * x)) / this.c;
  },
};

export const DISTINCT_LIMIT_SHAPE: LimitShape = {
  name: 'distinct-parts',
  c: Math.PI / Math.sqrt(12),
  equation: 'e^(c y) = 1 + e^(-c x), c = pi/sqrt(12)',
  y(x) {
    return Math.log1p(Math.exp(-this.c * x)) / this.c;
  },
};

/** Points of the scaled boundary: x in (0, xMax], where the curve is well above zero. */
export function boundaryGrid(shape: LimitShape, points = 48): number[] {
  // Beyond x where y < 0.005 the boundary is flat at zero; e^{-cx} ≈ 0.005c there.
  const xMax = Math.log(1 / (0.005 * shape.c)) / shape.c;
  const xs: number[] = [];
  for (let i = 1; i <= points; i++) xs.push((xMax * i) / points);
  return xs;
}

/** Running mean of the scaled boundary y(x) = #{i : λ_i ≥ x√n}/√n over samples. */
export class BoundaryAverage {
  private readonly sums: Float64Array;
  private count = 0;
  private readonly thresholds: number[];

  constructor(readonly n: number, readonly xs: readonly number[]) {
    this.sums = new Float64Array(xs.length);
    // Rows reaching column x√n are the parts of size at least ceil(x√n) (at least 1).
    this.thresholds = xs.map((x) => Math.max(1, Math.ceil(x * Math.sqrt(n) - 1e-9)));
  }

  add(partition: Partition): void {
    const root = Math.sqrt(this.n);
    // sizes are largest first; walk the thresholds from the largest down.
    let rows = 0;
    let i = 0;
    for (let t = this.thresholds.length - 1; t >= 0; t--) {
      const threshold = this.thresholds[t];
      while (i < partition.sizes.length && partition.sizes[i] >= threshold) rows += partition.multiplicities[i++];
      this.sums[t] += rows / root;
    }
    this.count++;
  }

  /** The mean boundary at each x (empty before any sample). */
  means(): number[] {
    return [...this.sums].map((s) => (this.count > 0 ? s / this.count : 0));
  }
}
