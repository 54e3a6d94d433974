import type { PlanCandidate } from './plan.js';
import { BoxMixture, MixtureSetupExceeded, type MixtureEntry, type MixtureOptions } from './box-mixture.js';
import { exactBox, shiftMap, staircaseMap } from './box-maps.js';
import { partsHint, SAMPLE_WORK_CEILING, samplerCandidate, type LengthPlanInput } from './length-candidate.js';

/** The box mixture's entries, its construction limit and its candidate (box-mixture.ts). */

/**
 * Setup steps a box mixture may take (tilts and normalisers: transcendental functions, ~0.1 us
 * each; 7.9e5 steps took 40-60 ms of CPU for the 1464 boxes of n = 15395764, parts in [2, 10368],
 * at most 2948 parts).
 */
const MIXTURE_SETUP_LIMIT = 2e6;
/**
 * ... and while another method of the family fits (conjugate-mixture): a quarter of it, so that
 * planning both stays within ~100 ms once compiled (bench shapes, minPart=7 with maxLength 0.25-0.75 sqrt(n):
 * conjugate-mixture was the faster of the two at every n = 1e4-1e9).
 */
export const MIXTURE_SETUP_LIMIT_WITH_RIVAL = MIXTURE_SETUP_LIMIT / 4;

/** The boxes of "at most K parts in [lo, hi]" (distinct or not), one per feasible number of parts k. */
export function mixtureEntries(n: number, lo: number, hi: number, distinct: boolean, K: number): MixtureEntry[] {
  const entries: MixtureEntry[] = [];
  for (let k = 1; k <= K; k++) {
    if (k * lo + (distinct ? (k * (k - 1)) / 2 : 0) > n) break;
    const box = exactBox(n, lo, hi, distinct, k);
    if (box !== null) entries.push({ parts: k, box });
  }
  return entries;
}

/** The box mixture of "at most K parts in [lo, hi]" with its maps onto the family (tests force its tuning). */
export function mixtureSampler(n: number, lo: number, hi: number, distinct: boolean, K: number, options: MixtureOptions = {}): BoxMixture {
  return new BoxMixture(
    mixtureEntries(n, lo, hi, distinct, K),
    (k, box) => (distinct ? staircaseMap(lo, k) : shiftMap(lo, k))(box),
    (k) => (distinct ? k : Math.min(k, Math.floor(Math.sqrt(2 * n)) + 2)),
    options,
  );
}

/**
 * At most K parts in [lo, hi] (distinct or lo > 1): the union over k of exact-k boxes. Setup is
 * O(1) per k while consecutive boxes keep their tilt (box-mixture.ts), so it is only known by
 * building: construction stops at MIXTURE_SETUP_LIMIT and the refusal names the number of parts
 * reached. Work per sample grows like K^1.5 (box-subset per k).
 */
export function mixtureCandidate(input: LengthPlanInput, lo: number, hi: number, K: number, setupLimit = MIXTURE_SETUP_LIMIT): PlanCandidate | null {
  const { n, distinct } = input.spec;
  const entries = mixtureEntries(n, lo, hi, distinct, K);
  if (entries.length === 0) return null;
  // At least ~20 steps per k (the walk of one box to the next).
  const least = 20 * entries.length;
  const over = (setupWork: number, parts: number): PlanCandidate => ({
    method: 'box-mixture/1',
    setupWork,
    sampleWork: Infinity,
    fits: false,
    build: () => {
      throw new RangeError('box mixture over its setup limit');
    },
    hint: partsHint(parts),
  });
  if (least > setupLimit) return over(least, (K * setupLimit) / least);
  let mixture: BoxMixture;
  try {
    mixture = mixtureSampler(n, lo, hi, distinct, K, { setupLimit });
  } catch (error) {
    if (error instanceof MixtureSetupExceeded) return over(error.setupWork, error.parts - 1);
    throw error;
  }
  const setupWork = mixture.estimates.setupWork;
  return samplerCandidate(input, mixture, setupWork, (work) => partsHint(K * Math.pow(SAMPLE_WORK_CEILING / work, 2 / 3)));
}
