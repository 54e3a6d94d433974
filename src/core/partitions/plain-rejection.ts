import { LimitExceededError } from '../errors.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import { BoltzmannProposal, boltzmannLogX } from './boltzmann-proposal.js';
import { uniformPartitionMeans } from './partition-means.js';

/**
 * Baseline for the bench: whole Boltzmann proposals at x = exp(−π/√(6n)) until the size is
 * exactly n (Fristedt 1993; Duchon et al. 2004). Exact, because a Boltzmann partition conditioned
 * on its size is uniform; but it needs about (96·n³)^{1/4} ≈ 3.13·n^{3/4} proposals (size spread
 * ~ n^{3/4}), so it is refused above MAX_N.
 */
export class PlainRejectionSampler implements PartitionSampler {
  readonly method = 'plain-rejection/1';
  /** At 10^6 one sample already takes seconds. */
  static readonly MAX_N = 10_000_000;
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  proposals = 0;
  private readonly proposal = new BoltzmannProposal();
  private readonly logX: number;

  constructor(readonly n: number) {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a non-negative integer, got ${n}`);
    if (n > PlainRejectionSampler.MAX_N) {
      throw new LimitExceededError(`plain rejection serves n <= ${PlainRejectionSampler.MAX_N}, got ${n}`, `n <= ${PlainRejectionSampler.MAX_N}`);
    }
    this.logX = n === 0 ? -1 : boltzmannLogX(n);
    const s = Math.sqrt(6 * n) / Math.PI;
    ({ expectedLength: this.expectedLength, expectedDistinct: this.expectedDistinct } = uniformPartitionMeans(n));
    this.expectedWork = n === 0 ? 1 : 3.13 * n ** 0.75 * (1.3 * s + 1);
  }

  sample(source: RandomSource): Partition {
    if (this.n === 0) return { sizes: [], multiplicities: [] };
    const p = this.proposal;
    for (;;) {
      this.proposals++;
      if (p.draw(source, this.logX, 1, 1, this.n) !== this.n) continue;
      const sizes: number[] = [];
      const multiplicities: number[] = [];
      for (let i = p.count - 1; i >= 0; i--) {
        sizes.push(p.sizes[i]);
        multiplicities.push(p.multiplicities[i]);
      }
      return { sizes, multiplicities };
    }
  }
}
