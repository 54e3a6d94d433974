import { LimitExceededError } from '../errors.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import { BoltzmannProposal, boltzmannLogX } from './boltzmann-proposal.js';
import { uniformPartitionMeans } from './partition-means.js';

/**
 * Probabilistic divide-and-conquer with the 1s determined (Arratia & DeSalvo 2016, §3.3):
 * draw the Boltzmann multiplicities X_k for k >= 2 at x = exp(−π/√(6n)); let r = n − Σ k·X_k;
 * accept with probability x^r and set X_1 = r.
 *
 * Exact: the target law of X_1 given the rest is the Boltzmann law of X_1 conditioned on
 * X_1 = r, and P(X_1 = r) = (1 − x)·x^r ∝ x^r, whose maximum over r >= 0 is 1 (at r = 0). So a
 * proposal for the sizes >= 2 is kept with probability proportional to the chance that X_1 would
 * have completed it to size n, which is the von Neumann rejection form of conditioning on the size.
 * About 4.0·n^{1/4} proposals per sample (measured; see the numerics notes).
 */
export class DivideAndConquerSampler implements PartitionSampler {
  readonly method = 'divide-and-conquer-ones/1';
  /** Work above this many basic steps per sample is refused (n = 10^9 takes ~1 s). */
  static readonly MAX_N = 1_000_000_000;
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  /** Proposals drawn since construction (for the bench). */
  proposals = 0;
  private readonly proposal = new BoltzmannProposal();
  private readonly logX: number;

  constructor(readonly n: number) {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a non-negative integer, got ${n}`);
    if (n > DivideAndConquerSampler.MAX_N) {
      throw new LimitExceededError(`divide-and-conquer serves n <= ${DivideAndConquerSampler.MAX_N}, got ${n}`, `n <= ${DivideAndConquerSampler.MAX_N}`);
    }
    this.logX = n === 0 ? -1 : boltzmannLogX(n);
    const s = Math.sqrt(6 * n) / Math.PI;
    ({ expectedLength: this.expectedLength, expectedDistinct: this.expectedDistinct } = uniformPartitionMeans(n));
    // ~4.0·n^{1/4} proposals of ~1.3·s visited sizes each (measured).
    this.expectedWork = n === 0 ? 1 : 4 * n ** 0.25 * (1.3 * s + 1);
  }

  sample(source: RandomSource): Partition {
    const n = this.n;
    if (n === 0) return { sizes: [], multiplicities: [] };
    const p = this.proposal;
    for (;;) {
      this.proposals++;
      const total = p.draw(source, this.logX, 2, 1, n);
      if (total === BoltzmannProposal.OVER) continue;
      const r = n - total;
      if (r > 0 && !(source.nextDouble() < Math.exp(r * this.logX))) continue;
      const count = p.count;
      const sizes: number[] = [];
      const multiplicities: number[] = [];
      for (let i = count - 1; i >= 0; i--) {
        sizes.push(p.sizes[i]);
        multiplicities.push(p.multiplicities[i]);
      }
      if (r > 0) {
        sizes.push(1);
        multiplicities.push(r);
      }
      return { sizes, multiplicities };
    }
  }
}
