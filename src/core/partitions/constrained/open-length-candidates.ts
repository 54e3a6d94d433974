import type { Partition } from '../../partition.js';
import type { PartitionSampler } from '../../sampler.js';
import { BoundedSelfSimilarSampler } from '../bounded-self-similar.js';
import { ConjugateMixture } from './conjugate-mixture.js';
import { conjugated, partsHint, SAMPLE_WORK_CEILING, samplerCandidate, type LengthPlanInput } from './length-candidate.js';
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

/** Setup steps per number of parts of conjugate-mixture (weights, moments; the tilt's sums). */
const CONJUGATE_MIXTURE_SETUP_PER_PART = 12;

/**
 * At most K parts in [lo, hi], lo >= 2, not distinct: by the conjugate (k^lo) ∪ ν with the number
 * of parts k drawn under one tilt (conjugate-mixture.ts). Not built where its O(K) setup alone
 * is over the limit.
 */
export function conjugateMixtureCandidate(input: LengthPlanInput, lo: number, hi: number, K: number): PlanCandidate | null {
  const { n } = input.spec;
  const top = Math.min(K, Math.floor(n / lo));
  if (top < 1 || lo < 2) return null;
  const setupWork = CONJUGATE_MIXTURE_SETUP_PER_PART * top;
  if (!input.fits(setupWork, 0)) {
    return { method: 'conjugate-mixture/2', setupWork, sampleWork: Infinity, fits: false, build: () => { throw new RangeError('conjugate mixture over its setup limit'); }, hint: partsHint(input.fits(0, 0) ? top / 2 : 1) };
  }
  const sampler = new ConjugateMixture(n, lo, hi, K);
  // Work grows like K^1.5 (proposals ~ sqrt(K), each ~ K draws); with a binding maxPart it is
  // step 4's rejections instead, and no number of parts is named.
  const hint = hi >= n ? (work: number) => partsHint(top * Math.pow(SAMPLE_WORK_CEILING / work, 2 / 3)) : undefined;
  return samplerCandidate(input, sampler, sampler.setupWork, hint);
}
