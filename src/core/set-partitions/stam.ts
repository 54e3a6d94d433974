import type { SetPartitionSampler } from './sampler.js';
import { stamLaw } from './stam-law.js';
import { throwIntoUrns } from './urns.js';

/**
 * Stam's algorithm for a uniform set partition of n items (A. J. Stam, "Generation of a random
 * partition of a finite set by an urn model", J. Combin. Theory A 35, 1983): draw M with
 * P(M = m) = m^n/(m!·e·B_n) (stam-law.ts), throw the n items into M urns uniformly, and keep
 * the non-empty urns as the blocks. A partition with k blocks arises from m(m−1)…(m−k+1) of
 * the m^n throws into m urns, so its probability is
 *   sum_m m^n/(m!·e·B_n) · m!/((m−k)!·m^n) = (1/(e·B_n)) · sum_(m>=k) 1/(m−k)! = 1/B_n,
 * the same for every partition: exactly uniform, up to the double rounding of M's table.
 * Cost: n uniform urns (urns.ts: several from one 32-bit word while M <= 2^16, e.g. 4 per word
 * for the ~190 urns of n = 1000, one per word for the ~88,000 of n = 10^6) and one pass to number
 * the blocks.
 */
export function stamSampler(n: number): SetPartitionSampler {
  const { law } = stamLaw(n);
  return {
    method: 'stam/1',
    expectedLength: n,
    // E[blocks] = E[M] − 1 = B_(n+1)/B_n − 1 (the mean of M is B_(n+1)/B_n; see stam-law.ts).
    expectedBlocks: law.mean - 1,
    // At most one word per item (rejection is rare), one step per item to number blocks.
    expectedWork: 2 * n + Math.log2(law.pmf.length + 1),
    sample: (source) => throwIntoUrns(source, n, law.sample(source)),
  };
}
