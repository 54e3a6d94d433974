import type { Partition } from '../../partition.js';
import { nextBelow, nextOpenDouble, type RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { countsToPartition } from './size-table.js';
import { gcd, sizeCount, sizeGcd, smallestSize, type SizeSet } from './spec.js';
import { visitThinned } from './thinning.js';
import { localProbability, solveTilt, tiltMoments } from './tilt.js';

/**
 * Exact uniform partitions of n with every part in an allowed set S (an interval [lo, hi] or a
 * list), any multiplicities: the product-form family prod_{k in S} 1/(1 - q^k).
 *
 * Boltzmann proposal with probabilistic divide-and-conquer (Arratia & DeSalvo 2016,
 * Combinatorics, Probability and Computing 25, §3): the multiplicities Z_k of every size except
 * the two smallest, a < b, are drawn independently, Z_k geometric with P(Z_k >= j) = x^(kj); their
 * total R leaves m = n - R for a and b. Under the same law P(a Z_a + b Z_b = m) is proportional to
 * Q(m) x^m, with Q(m) the number of solutions of a i + b j = m in non-negative integers (closed
 * form: with g = gcd(a, b), j runs over one residue class mod a/g, Nijenhuis & Wilf 1978, ch. 9 on
 * linear Diophantine equations). The proposal is accepted with probability Q(m) x^m / U, where
 * U = max over real m of (m / lcm(a, b) + 1) x^m >= max Q(m) x^m, and (i, j) is then uniform among
 * the Q(m) solutions. Every partition of n ends with probability proportional to
 * x^R x^m / U = x^n / U: uniform. Compared with determining one size only ("deterministic second
 * half", ibid. §3.3), residues not divisible by the smallest size are no longer wasted.
 *
 * Method ids: "bounded-boltzmann/1" for an interval of sizes, "allowed-boltzmann/1" for a list.
 * The caller guarantees that the family is not empty (a gcd/Frobenius or DP check); otherwise
 * sample() would not terminate.
 */
export class MultisetBoltzmann implements PartitionSampler {
  readonly method: string;
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  /** Mean proposals per sample (estimate from the local limit theorem). */
  readonly expectedProposals: number;
  /** Mean sizes visited per proposal (estimate). */
  readonly proposalCost: number;
  /** ln x. */
  readonly t: number;
  /** The two smallest sizes, determined by the residual (b = 0 when S has one size). */
  private readonly a: number;
  private readonly b: number;
  private readonly pair: PairSolutions | null;
  /** ln U, the bound on Q(m) x^m. */
  private readonly logBound: number;
  /** Interval sizes with x^k >= 1/4 are drawn one by one up to here; thinning beyond. */
  private readonly denseEnd: number;

  constructor(
    readonly sizes: SizeSet,
    readonly n: number,
    tilt?: number,
  ) {
    const count = sizeCount(sizes);
    if (n < 1 || count < 1) throw new RangeError('multiset Boltzmann sampler needs n >= 1 and a size');
    this.method = sizes.kind === 'interval' ? 'bounded-boltzmann/1' : 'allowed-boltzmann/1';
    this.a = smallestSize(sizes);
    this.b = count === 1 ? 0 : sizes.kind === 'list' ? sizes.values[1] : sizes.lo + 1;
    const single = count === 1;
    this.t = single ? -1 : (tilt ?? solveTilt(sizes, n, false));
    const t = this.t;
    this.pair = single ? null : new PairSolutions(this.a, this.b);
    const lcm = single ? 1 : (this.a / gcd(this.a, this.b)) * this.b;
    // max over m >= 0 of (m / L + 1) e^(t m): at m* = -1/t - L when positive.
    const peak = -1 / t - lcm;
    this.logBound = peak > 0 ? Math.log(-1 / (t * lcm)) + t * peak : 0;
    this.denseEnd = Math.floor(Math.log(4) / -t);
    const moments = tiltMoments(sizes, t, false);
    if (single || count === 2) {
      this.expectedProposals = 1;
      this.proposalCost = 1;
    } else {
      const pn = localProbability(moments.variance, sizeGcd(sizes));
      // P(accept) = P(N = n) / ((1 - x^a)(1 - x^b) U).
      const logNorm = Math.log(-Math.expm1(t * this.a)) + Math.log(-Math.expm1(t * this.b)) + this.logBound;
      this.expectedProposals = Math.max(1, Math.exp(logNorm) / pn);
      if (sizes.kind === 'list') {
        this.proposalCost = count - 2;
      } else {
        const dense = Math.max(0, Math.min(sizes.hi, this.denseEnd) - sizes.lo - 1);
        const tail = sizes.hi > this.denseEnd ? (2 * Math.exp(t * (this.denseEnd + 1))) / -Math.expm1(t) : 0;
        this.proposalCost = dense + Math.min(tail, sizes.hi - sizes.lo) + 2;
      }
    }
    this.expectedLength = single ? n / this.a : moments.parts;
    this.expectedDistinct = single ? 1 : moments.distinctSizes;
    this.expectedWork = this.expectedProposals * this.proposalCost + this.expectedDistinct;
  }

  sample(source: RandomSource): Partition {
    const { n, t, sizes, a, b } = this;
    if (this.pair === null) return { sizes: [a], multiplicities: [n / a] };
    const restEmpty = sizeCount(sizes) === 2;
    // The sizes drawn with Z_k >= 1 and their Z_k, in drawing order (plain arrays reused across
    // proposals: a proposal over a wide interval draws thousands of sizes, most of them rejected).
    const drawnSizes: number[] = [];
    const drawnCounts: number[] = [];
    for (;;) {
      drawnSizes.length = 0;
      drawnCounts.length = 0;
      let total = 0;
      let alive = true;
      // Z_k = floor(ln U / (k t)) has P(Z_k >= j) = x^(kj).
      if (sizes.kind === 'list') {
        const values = sizes.values;
        for (let i = values.length - 1; i >= 2 && alive; i--) {
          const k = values[i];
          const z = Math.floor(Math.log(nextOpenDouble(source)) / (k * t));
          if (z > 0) {
            drawnSizes.push(k);
            drawnCounts.push(z);
            total += k * z;
          }
          alive = total <= n;
        }
      } else {
        const denseTop = Math.min(sizes.hi, this.denseEnd);
        for (let k = sizes.lo + 2; k <= denseTop && alive; k++) {
          const z = Math.floor(Math.log(nextOpenDouble(source)) / (k * t));
          if (z > 0) {
            drawnSizes.push(k);
            drawnCounts.push(z);
            total += k * z;
          }
          alive = total <= n;
        }
        if (alive && sizes.hi > denseTop) {
          // Sparse sizes: visit those with Z_k >= 1 (probability x^k), then Z_k = 1 + Geometric.
          alive = visitThinned(
            source,
            Math.max(denseTop + 1, sizes.lo + 2),
            sizes.hi,
            (k) => Math.exp(t * k),
            (k) => {
              const z = 1 + Math.floor(Math.log(nextOpenDouble(source)) / (k * t));
              drawnSizes.push(k);
              drawnCounts.push(z);
              total += k * z;
              return total <= n;
            },
          );
        }
      }
      if (!alive) continue;
      const m = n - total;
      const solutions = this.pair.count(m);
      if (solutions === 0) continue;
      if (!restEmpty && !(source.nextDouble() < Math.exp(Math.log(solutions) + t * m - this.logBound))) continue;
      const j = this.pair.nth(m, solutions === 1 ? 0 : nextBelow(source, solutions));
      const i = (m - b * j) / a;
      const counts = new Map<number, number>();
      for (let d = 0; d < drawnSizes.length; d++) counts.set(drawnSizes[d], drawnCounts[d]);
      if (i > 0) counts.set(a, i);
      if (j > 0) counts.set(b, j);
      return countsToPartition(counts);
    }
  }
}

/**
 * Non-negative solutions (i, j) of a i + b j = m, a < b: with g = gcd(a, b), a' = a/g, b' = b/g,
 * m' = m/g, the j are j0, j0 + a', j0 + 2a', ... <= m'/b' where j0 = m' * inverse(b') mod a'.
 */
export class PairSolutions {
  private readonly g: number;
  private readonly a1: number;
  private readonly b1: number;
  private readonly inverse: number;

  constructor(a: number, b: number) {
    this.g = gcd(a, b);
    this.a1 = a / this.g;
    this.b1 = b / this.g;
    this.inverse = this.a1 === 1 ? 0 : modInverse(this.b1 % this.a1, this.a1);
  }

  private first(m1: number): number {
    if (this.a1 === 1) return 0;
    const r = m1 % this.a1;
    if (this.a1 < 9e7) return (r * this.inverse) % this.a1;
    return Number((BigInt(r) * BigInt(this.inverse)) % BigInt(this.a1));
  }

  /** Number of solutions (0 if none). */
  count(m: number): number {
    if (m < 0 || m % this.g !== 0) return 0;
    const m1 = m / this.g;
    const j0 = this.first(m1);
    if (this.b1 * j0 > m1) return 0;
    return Math.floor((m1 - this.b1 * j0) / (this.a1 * this.b1)) + 1;
  }

  /** The j of the index-th solution. */
  nth(m: number, index: number): number {
    return this.first(m / this.g) + index * this.a1;
  }

  /** Solutions with from <= j <= to (allowed-length-boltzmann.ts). */
  countBetween(m: number, from: number, to: number): number {
    if (m < 0 || m % this.g !== 0 || to < from) return 0;
    const start = this.firstFrom(m, from);
    return start > to ? 0 : Math.floor((to - start) / this.a1) + 1;
  }

  /** The j of the index-th solution with j >= from. */
  nthBetween(m: number, from: number, index: number): number {
    return this.firstFrom(m, from) + index * this.a1;
  }

  private firstFrom(m: number, from: number): number {
    const j0 = this.first(m / this.g);
    return j0 >= from ? j0 : j0 + Math.ceil((from - j0) / this.a1) * this.a1;
  }
}

function modInverse(value: number, modulus: number): number {
  // Extended Euclid; values below 1e9, so the coefficients stay exact in doubles.
  let [r0, r1] = [modulus, value];
  let [s0, s1] = [0, 1];
  while (r1 !== 0) {
    const q = Math.floor(r0 / r1);
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  return ((s0 % modulus) + modulus) % modulus;
}
