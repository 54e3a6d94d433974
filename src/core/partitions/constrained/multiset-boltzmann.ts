import type { Partition } from '../../partition.js';
import { nextOpenDouble, type RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { countsToPartition } from './size-table.js';
import { sizeCount, sizeGcd, smallestSize, type SizeSet } from './spec.js';
import { visitThinned } from './thinning.js';
import { localProbability, solveTilt, tiltMoments } from './tilt.js';

/**
 * Exact uniform partitions of n with every part in an allowed set S (an interval [lo, hi] or a
 * list), any multiplicities: the product-form family prod_{k in S} 1/(1 - q^k).
 *
 * Boltzmann proposal with probabilistic divide-and-conquer, "deterministic second half"
 * (Arratia & DeSalvo 2016, Combinatorics, Probability and Computing 25, §3.3): the multiplicities
 * Z_k of every size except the smallest, a, are drawn independently, Z_k geometric with
 * P(Z_k >= j) = x^(kj); the residual r = n - sum k Z_k must be >= 0 and divisible by a, and is
 * accepted with probability P(Z_a = r/a) / P(Z_a = 0) = x^r. A proposal with residual r has
 * probability proportional to x^(n - r), so acceptance with x^r makes every partition of n
 * equally likely. P(accept) = P(N = n) / (1 - x^a) where N is the Boltzmann size.
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
  private readonly smallest: number;
  /** Interval sizes with x^k >= 1/4 are drawn one by one up to here; thinning beyond. */
  private readonly denseEnd: number;

  constructor(
    readonly sizes: SizeSet,
    readonly n: number,
  ) {
    if (n < 1 || sizeCount(sizes) < 1) throw new RangeError('multiset Boltzmann sampler needs n >= 1 and a size');
    this.method = sizes.kind === 'interval' ? 'bounded-boltzmann/1' : 'allowed-boltzmann/1';
    this.smallest = smallestSize(sizes);
    const single = sizeCount(sizes) === 1;
    this.t = single ? -1 : solveTilt(sizes, n, false);
    const moments = tiltMoments(sizes, this.t, false);
    const t = this.t;
    this.denseEnd = Math.floor(Math.log(4) / -t);
    if (single) {
      this.expectedProposals = 1;
      this.proposalCost = 1;
    } else {
      const pn = localProbability(moments.variance, sizeGcd(sizes));
      const accept = Math.min(1, pn / -Math.expm1(t * this.smallest));
      this.expectedProposals = 1 / accept;
      if (sizes.kind === 'list') {
        this.proposalCost = sizes.values.length;
      } else {
        const dense = Math.max(0, Math.min(sizes.hi, this.denseEnd) - sizes.lo);
        const tail = sizes.hi > this.denseEnd ? (2 * Math.exp(t * (this.denseEnd + 1))) / -Math.expm1(t) : 0;
        this.proposalCost = dense + Math.min(tail, sizes.hi - sizes.lo) + 2;
      }
    }
    this.expectedLength = single ? n / this.smallest : moments.parts;
    this.expectedDistinct = single ? 1 : moments.distinctSizes;
    this.expectedWork = this.expectedProposals * this.proposalCost + this.expectedDistinct;
  }

  sample(source: RandomSource): Partition {
    const { n, smallest, t, sizes } = this;
    if (sizeCount(sizes) === 1) {
      return { sizes: [smallest], multiplicities: [n / smallest] };
    }
    for (;;) {
      const counts = new Map<number, number>();
      let total = 0;
      // Z_k = floor(ln U / (k t)) has P(Z_k >= j) = x^(kj).
      const drawAll = (k: number): boolean => {
        const z = Math.floor(Math.log(nextOpenDouble(source)) / (k * t));
        if (z > 0) {
          counts.set(k, z);
          total += k * z;
        }
        return total <= n;
      };
      let alive = true;
      if (sizes.kind === 'list') {
        const values = sizes.values;
        for (let i = values.length - 1; i >= 1 && alive; i--) alive = drawAll(values[i]);
      } else {
        const denseTop = Math.min(sizes.hi, this.denseEnd);
        for (let k = sizes.lo + 1; k <= denseTop && alive; k++) alive = drawAll(k);
        if (alive && sizes.hi > denseTop) {
          // Sparse sizes: visit those with Z_k >= 1 (probability x^k), then Z_k = 1 + Geometric.
          alive = visitThinned(
            source,
            Math.max(denseTop + 1, sizes.lo + 1),
            sizes.hi,
            (k) => Math.exp(t * k),
            (k) => {
              const z = 1 + Math.floor(Math.log(nextOpenDouble(source)) / (k * t));
              counts.set(k, z);
              total += k * z;
              return total <= n;
            },
          );
        }
      }
      if (!alive) continue;
      const residual = n - total;
      if (residual % smallest !== 0) continue;
      if (source.nextDouble() >= Math.exp(t * residual)) continue;
      if (residual > 0) counts.set(smallest, residual / smallest);
      return countsToPartition(counts);
    }
  }
}
