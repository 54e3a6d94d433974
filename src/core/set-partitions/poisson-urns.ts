import type { RandomSource } from '../random.js';
import { PoissonVariate } from './poisson-variate.js';
import type { SetPartitionSampler } from './sampler.js';
import type { SetPartition } from './set-partition.js';
import type { SizeLaw } from './size-law.js';
import { assignSizes } from './urns.js';

/**
 * Boltzmann sampling of set partitions with the blocks as labelled urns (Duchon, Flajolet,
 * Louchard & Schaeffer, "Boltzmann samplers for the random generation of combinatorial
 * structures", Combin. Probab. Comput. 13, 2004, §4: a labelled SET of blocks), made exact in
 * size by probabilistic divide-and-conquer (Arratia & DeSalvo, "Probabilistic divide-and-
 * conquer: a new exact simulation method", Combin. Probab. Comput. 25, 2016).
 *
 * The urn sizes s_1, …, s_k are independent with P(s) = x^s/(s!·G), G = sum over the allowed
 * sizes of x^s/s! (size-law.ts). With exactly k blocks, k is fixed; otherwise k ~ Poisson(y·G).
 * The first k − 1 sizes are drawn, the last is what is left, r = n − (s_1 + … + s_(k−1)), and
 * the draw is kept with probability P(r)/max P (Arratia–DeSalvo's deterministic second half).
 * A kept draw of k urns with sizes s has probability proportional to
 *   P(k) · prod_i x^(s_i)/(s_i!·G) = c · y^k/k! · x^n / prod_i s_i!,
 * and the items are spread over the urns uniformly (urns.ts: n!/prod s_i! equally likely
 * ways), so each labelled assignment has probability c · y^k · x^n/(k!·n!). Forgetting the
 * labels (k! labelled assignments — surjections onto k urns — per set partition) leaves
 * c · y^k · x^n/n! per set partition with k blocks: uniform for exactly k blocks, and uniform
 * over "at most K blocks" after keeping the draw with probability y^(K − k) (y <= 1).
 * Exact up to the double rounding of the size table, for every x and y; the tuning
 * (tilt.ts) makes E[size] = n, or the mean block size n/k, so that few draws are rejected.
 */
export interface UrnsOptions {
  readonly n: number;
  readonly sizes: SizeLaw;
  /** Exactly this many urns; absent: a Poisson number of urns, at most maxBlocks. */
  readonly blocks?: number;
  readonly maxBlocks?: number;
  /** ln y <= 0 (0 unless a bound on the number of blocks is tuned for). */
  readonly logY?: number;
  /** Expected draws per kept sample (from the planner's estimate), for expectedWork. */
  readonly expectedTrials: number;
  readonly expectedBlocks: number;
}

export function poissonUrnsSampler(options: UrnsOptions): SetPartitionSampler {
  const { n, sizes, blocks } = options;
  const law = sizes.law;
  const logY = options.logY ?? 0;
  const maxBlocks = options.maxBlocks ?? Infinity;
  const count = blocks === undefined ? new PoissonVariate(Math.exp(logY + sizes.logBlockGf)) : null;
  const minSize = law.lo;
  const urnsPerTrial = blocks ?? count!.mean;
  return {
    method: 'poisson-urns/1',
    expectedLength: n,
    expectedBlocks: options.expectedBlocks,
    // Per trial: the number of urns (one table draw, ~ a binary search, each) and two uniforms;
    // per kept sample: the shuffle (one word per item) and numbering the blocks.
    expectedWork: options.expectedTrials * (2 + urnsPerTrial * (1 + Math.log2(law.pmf.length + 1) / 4)) + 3 * n,
    sample(source: RandomSource): SetPartition {
      let urns: Int32Array = new Int32Array(0);
      for (;;) {
        const k = blocks ?? count!.sample(source);
        if (k < 1 || k > maxBlocks) continue;
        if (urns.length < k) urns = new Int32Array(Math.max(k, 2 * urns.length));
        let used = 0;
        // The k − 1 drawn urns must leave at least the smallest size for the last one.
        const budget = n - minSize;
        let i = 0;
        for (; i < k - 1 && used <= budget; i++) used += urns[i] = law.sample(source);
        if (used > budget) continue;
        const rest = n - used;
        const p = law.probability(rest);
        if (p === 0 || source.nextDouble() * law.pmax >= p) continue;
        if (logY < 0 && k < maxBlocks && source.nextDouble() >= Math.exp(logY * (maxBlocks - k))) continue;
        urns[k - 1] = rest;
        return assignSizes(source, n, urns, k);
      }
    },
  };
}
