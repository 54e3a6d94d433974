import type { Partition } from '../../partition.js';
import type { PartitionSampler } from '../../sampler.js';
import { BoundedSelfSimilarSampler } from '../bounded-self-similar.js';
import { conjugated, samplerCandidate, type LengthPlanInput } from './length-candidate.js';
import { MultisetBoltzmann } from './multiset-boltzmann.js';
import type { PlanCandidate } from './plan.js';
import { addPart, addStaircase, conjugate, shiftParts } from './transforms.js';

/**
 * Length constraints with no upper bound on the parts, by conjugation (Andrews 1976, §1.3): at most
 * K parts <-> parts <= K; exactly k parts <-> parts <= k plus one part k.
 */

/**
 * Exactly k parts >= lo with no upper bound (distinct: subtract the staircase) <-> partitions of
 * N into exactly k parts <-> (conjugate) N - k into parts <= k, plus one part k.
 */
export function openExactCandidates(input: LengthPlanInput, k: number): PlanCandidate[] {
  const { spec, shape } = input;
  const { n, distinct } = spec;
  const lo = spec.sizes.kind === 'interval' ? spec.sizes.lo : 1;
  if (k < 1) return [];
  const N = n - k * (lo - 1) - (distinct ? (k * (k - 1)) / 2 : 0);
  const back = (p: Partition) => {
    const q = shiftParts(conjugate(addPart(p, k)), lo - 1);
    return distinct ? addStaircase(q) : q;
  };
  if (N - k >= 1) {
    const out = [samplerCandidate(input, conjugated(new MultisetBoltzmann({ kind: 'interval', lo: 1, hi: k }, N - k), back, k, shape))];
    const bounded = boundedCandidate(input, N - k, k, back, k);
    if (bounded !== null) out.push(bounded);
    return out;
  }
  if (N === k) {
    // A single member: k equal parts before the maps.
    const only = back({ sizes: [], multiplicities: [] });
    const single: PartitionSampler = {
      method: 'single-member/1',
      expectedLength: k,
      expectedDistinct: only.sizes.length,
      expectedWork: only.sizes.length,
      sample: () => ({ sizes: only.sizes.slice(), multiplicities: only.multiplicities.slice() }),
    };
    return [samplerCandidate(input, single)];
  }
  return [];
}

/**
 * Parts <= b of size m by the self-similar method (bounded-self-similar.ts), conjugated back
 * through `map`; null below b = 2 or n < 2b... (no saving there) and where its tables would not fit.
 * Its setup is time (count tables), so it fits on the memory the tables hold and the work limits.
 */
export function boundedCandidate(input: LengthPlanInput, m: number, b: number, map: (p: Partition) => Partition, length: number): PlanCandidate | null {
  if (b < 2 || b >= m) return null;
  const inner = new BoundedSelfSimilarSampler(m, 1, b);
  const sampler = conjugated(inner, map, length, input.shape);
  const fits = inner.fitsLimits() && input.fits(0, sampler.expectedWork);
  return { method: sampler.method, setupWork: inner.setupWork, sampleWork: sampler.expectedWork, fits, build: () => sampler };
}

/** At most K parts >= 1 with no upper bound: parts <= K by conjugation (Boltzmann and self-similar). */
export function openAtMostCandidates(input: LengthPlanInput, n: number, K: number): PlanCandidate[] {
  const out = [samplerCandidate(input, conjugated(new MultisetBoltzmann({ kind: 'interval', lo: 1, hi: K }, n), conjugate, K, input.shape))];
  const bounded = boundedCandidate(input, n, K, conjugate, K);
  if (bounded !== null) out.push(bounded);
  return out;
}
