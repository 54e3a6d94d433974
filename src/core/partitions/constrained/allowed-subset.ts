import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { gcd } from './spec.js';

/**
 * Exact uniform partitions of n into exactly k distinct parts from an allowed list
 * s_1 < ... < s_r: the k-subsets of S with sum n.
 *
 * The subset design over S: a k-subset T drawn with probability proportional to x^(sum T). With
 * the elementary symmetric functions e_j of the x^s over suffixes of S (a table of r x k numbers,
 * positive additions: e_j(i) = e_j(i+1) + x^(s_i) e_(j-1)(i+1)), the sequential method draws it
 * exactly (Nijenhuis & Wilf 1978, ch. 10, x-weighted): s_i is in T with probability
 * x^(s_i) e_(j-1)(i+1) / e_j(i) when j elements remain. Entries are stored divided by x^(sum of the
 * j smallest sizes of the suffix), so that they stay below C(r, j) and need no exponentials.
 *
 * Probabilistic divide-and-conquer with the last element determined (Arratia & DeSalvo 2016,
 * §3.3), as in box-subset.ts: draw a (k-1)-subset from the design, let w = n - its sum; keep
 * T = S' + {w} when w is an allowed size not drawn, with probability x^(w - s_(rank of w in T)) —
 * s_rank being the smallest value an element of that rank can take, so the probability is at most
 * 1 for x <= 1. Every member T = {w_1 < ... < w_k} then has probability
 *   sum_rank x^(n - w_rank) / e_(k-1) * x^(w_rank - s_rank) = x^n (x^-s_1 + ... + x^-s_k) / e_(k-1),
 * the same for all: exactly uniform. For x > 1 (n above the middle of the sums) the sampler works
 * on the reflected sizes s_1 + s_r - s, whose k-subsets sum to k (s_1 + s_r) - n.
 *
 * Method id "allowed-subset/1". The caller guarantees the family is not empty.
 */
export class AllowedSubset implements PartitionSampler {
  readonly method = 'allowed-subset/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  readonly expectedProposals: number;
  /** Sizes worked on (reflected when x > 1), ascending, and the target sum. */
  private readonly sizes: number[];
  private readonly target: number;
  private readonly reflect: number | null;
  /** -ln x >= 0. */
  private readonly s: number;
  /** table[i * (k) + j] = e_j(i) / x^(sum of the j smallest sizes from i), j < k (the (k-1)-design). */
  private readonly table: Float64Array;
  private readonly allowed: Set<number>;
  private readonly chosen: Float64Array;

  constructor(
    values: readonly number[],
    readonly n: number,
    readonly k: number,
  ) {
    const r = values.length;
    if (k < 1 || k > r) throw new RangeError('allowed-subset needs 1 <= k <= number of sizes');
    const tilt = solveSubsetTilt(values, n, k);
    const reflect = tilt > 0 ? values[0] + values[r - 1] : null;
    this.reflect = reflect;
    this.sizes = reflect === null ? values.slice() : values.map((v) => reflect - v).reverse();
    this.target = reflect === null ? n : k * reflect - n;
    this.s = Math.abs(tilt);
    this.allowed = new Set(this.sizes);
    this.chosen = new Float64Array(Math.max(1, k - 1));
    // The (k-1)-design's table over suffixes.
    const width = k;
    const table = new Float64Array((r + 1) * width);
    for (let i = r; i >= 0; i--) {
      table[i * width] = 1;
      for (let j = 1; j < width; j++) {
        if (j > r - i) continue;
        const skip = j <= r - i - 1 ? table[(i + 1) * width + j] * Math.exp(-this.s * (this.sizes[i + j] - this.sizes[i])) : 0;
        table[i * width + j] = skip + table[(i + 1) * width + j - 1];
      }
    }
    this.table = table;
    // Estimates: the acceptance rate is P(design sum = n) (sum_rank x^-s_rank) e_k / e_(k-1); both
    // from the grand-canonical (Bernoulli) law at the two tilts, its conditional variance for the
    // local limit estimate of P(sum = n).
    const { variance, span } = subsetMoments(this.sizes, this.s, k);
    const hit = Math.min(1, span / Math.sqrt(2 * Math.PI * Math.max(variance, 1e-300)));
    const ratio = this.designRatio();
    let ranks = 0;
    for (let q = 0; q < k; q++) ranks += Math.exp(this.s * (this.sizes[q] - this.sizes[0]));
    this.expectedProposals = k === 1 ? 1 : Math.max(1, 1 / Math.min(1, hit * ratio * ranks));
    this.expectedLength = k;
    this.expectedDistinct = k;
    this.expectedWork = this.expectedProposals * (r + Math.log2(k + 1)) + k;
  }

  /** e_k / e_(k-1) over all of S, times x^-s_1 (the scale the rank weights above use). */
  private designRatio(): number {
    const { k, s, sizes } = this;
    // e_k(0) = e_(k-1)(0) * (sum over T of x^(w) ...): from the definition e_k = sum_i x^(s_i) e_(k-1)(i+1)
    // restricted to i the smallest element, with the normalised table.
    const width = k;
    let ek = 0;
    for (let i = 0; i + k <= sizes.length; i++) {
      // x^(s_i + sum of the k-1 smallest after i) / x^(sum of the k smallest of S), times e_(k-1)(i+1) normalised.
      const base = sizes[i] - sizes[0] + (k >= 2 ? sumRange(sizes, i + 1, k - 1) - sumRange(sizes, 1, k - 1) : 0);
      ek += Math.exp(-s * base) * (k - 1 < width ? this.table[(i + 1) * width + k - 1] : 1);
    }
    // e_(k-1)(0) normalised by x^(sum of the k-1 smallest); e_k by x^(sum of the k smallest): ratio x^(s_k).
    return (ek / this.table[k - 1]) * Math.exp(-s * (sizes[k - 1] - sizes[0]));
  }

  sample(source: RandomSource): Partition {
    const { k, target, sizes, s } = this;
    const r = sizes.length;
    const width = k;
    const chosen = this.chosen;
    if (k === 1) return { sizes: [this.n], multiplicities: [1] }; // the only member (n is allowed)
    for (;;) {
      // A (k-1)-subset from the design, ascending.
      let j = k - 1;
      let count = 0;
      let sum = 0;
      for (let i = 0; i < r && j > 0; i++) {
        const here = this.table[i * width + j];
        const take = this.table[(i + 1) * width + j - 1];
        if (source.nextDouble() * here < take) {
          chosen[count++] = sizes[i];
          sum += sizes[i];
          j--;
        }
      }
      const w = target - sum;
      if (!this.allowed.has(w)) continue;
      let rank = 0;
      let duplicate = false;
      for (let q = 0; q < count; q++) {
        if (chosen[q] < w) rank++;
        else if (chosen[q] === w) duplicate = true;
      }
      if (duplicate) continue;
      if (s > 0 && !(source.nextDouble() < Math.exp(-s * (w - sizes[rank])))) continue;
      const parts: number[] = [];
      for (let q = 0; q < count; q++) parts.push(chosen[q]);
      parts.push(w);
      const out = this.reflect === null ? parts : parts.map((v) => this.reflect! - v);
      out.sort((a, b) => b - a);
      return { sizes: out, multiplicities: out.map(() => 1) };
    }
  }
}

function sumRange(values: readonly number[], from: number, count: number): number {
  let total = 0;
  for (let i = from; i < from + count; i++) total += values[i];
  return total;
}

/**
 * ln x of the two-tilt Bernoulli model over S with mean size n and mean count k (damped Newton
 * on the convex cumulant function, as allowed-length-boltzmann.ts); only speed depends on it.
 */
export function solveSubsetTilt(values: readonly number[], n: number, k: number): number {
  let t = 0;
  let u = Math.log(k / Math.max(values.length - k, 0.5));
  const objective = (tt: number, uu: number) => {
    let f = -tt * n - uu * k;
    for (const v of values) {
      const z = uu + tt * v;
      f += z > 0 ? z + Math.log1p(Math.exp(-z)) : Math.log1p(Math.exp(z));
    }
    return f;
  };
  let f = objective(t, u);
  for (let iter = 0; iter < 100; iter++) {
    let mN = 0;
    let mL = 0;
    let vN = 0;
    let vL = 0;
    let c = 0;
    for (const v of values) {
      const p = 1 / (1 + Math.exp(-(u + t * v)));
      const q = p * (1 - p);
      mN += v * p;
      mL += p;
      vN += v * v * q;
      vL += q;
      c += v * q;
    }
    const gN = mN - n;
    const gL = mL - k;
    if (Math.abs(gN) <= 1e-9 * n && Math.abs(gL) <= 1e-9 * k) break;
    const det = vN * vL - c * c;
    if (!(det > 0)) break;
    const dt = -(vL * gN - c * gL) / det;
    const du = -(vN * gL - c * gN) / det;
    let step = 1;
    let improved = false;
    for (let back = 0; back < 60; back++) {
      const nf = objective(t + step * dt, u + step * du);
      if (nf < f) {
        t += step * dt;
        u += step * du;
        f = nf;
        improved = true;
        break;
      }
      step /= 2;
    }
    if (!improved) break;
  }
  return t;
}

/** Conditional variance of the size given the count (Bernoulli model, count tilt solved) and the lattice span. */
function subsetMoments(sizes: readonly number[], s: number, k: number): { variance: number; span: number } {
  // The count tilt for this x: mean count k, by bisection on u.
  let lo = -800;
  let hi = 800;
  const meanCount = (u: number) => {
    let m = 0;
    for (const v of sizes) m += 1 / (1 + Math.exp(-(u - s * v)));
    return m;
  };
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    if (meanCount(mid) < k) lo = mid;
    else hi = mid;
  }
  const u = (lo + hi) / 2;
  let vN = 0;
  let vL = 0;
  let c = 0;
  for (const v of sizes) {
    const p = 1 / (1 + Math.exp(-(u - s * v)));
    const q = p * (1 - p);
    vN += v * v * q;
    vL += q;
    c += v * q;
  }
  let span = 0;
  for (const v of sizes) span = gcd(span, v - sizes[0]);
  return { variance: vL > 0 ? vN - (c * c) / vL : vN, span: Math.max(span, 1) };
}
