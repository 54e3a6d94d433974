import { exactLawReport, lnBinomial, type ExactLawReport } from './statistics.js';

/** Largest n the composition check tabulates (one double per possible number of parts). */
export const COMPOSITION_CHECK_MAX_N = 1_000_000;

/**
 * The exact law of the number of parts of a uniform composition of n >= 1: a composition is a
 * choice of cut points among the n − 1 gaps between n units, each of the 2^{n−1} subsets equally
 * likely, so the number of parts is 1 + Binomial(n − 1, 1/2) (Stanley, Enumerative Combinatorics
 * I, 2nd ed., §1.2: C(n−1, k−1) compositions of n have k parts). probabilities[k] = P(k parts).
 */
export function compositionPartsLaw(n: number): Float64Array {
  if (!Number.isInteger(n) || n < 1 || n > COMPOSITION_CHECK_MAX_N) {
    throw new RangeError(`the composition check takes n from 1 to ${COMPOSITION_CHECK_MAX_N}, got ${n}`);
  }
  const probabilities = new Float64Array(n + 1);
  const logHalfPower = (n - 1) * Math.log(2);
  for (let k = 1; k <= n; k++) probabilities[k] = Math.exp(lnBinomial(n - 1, k - 1) - logHalfPower);
  return probabilities;
}

export interface CompositionPartsReport extends ExactLawReport {
  readonly samples: number;
}

/**
 * Chi-square test of the numbers of parts of samples claimed to be uniform compositions of n
 * (unconstrained) against 1 + Binomial(n − 1, 1/2). Takes the part counts, not the compositions,
 * so any sampler (or a deliberately biased one, in the tests) can be fed through it.
 * GET /v1/compositions/check (src/http/routes/composition-check.ts) feeds it the lengths of
 * `sampler.sample(sampleSource(seed, i, familyKey(family)))`, the very samples the API returns.
 */
export function checkCompositionParts(n: number, partCounts: Iterable<number>): CompositionPartsReport {
  const law = compositionPartsLaw(n);
  const tally = new Map<number, number>();
  let total = 0;
  for (const k of partCounts) {
    tally.set(k, (tally.get(k) ?? 0) + 1);
    total++;
  }
  // Trim to the window holding the data and all but 1e-12 of each tail.
  let lo = 1;
  let hi = n;
  while (lo < hi && law[lo] < 1e-12) lo++;
  while (hi > lo && law[hi] < 1e-12) hi--;
  for (const k of tally.keys()) {
    lo = Math.min(lo, k);
    hi = Math.max(hi, k);
  }
  const observed: number[] = [];
  const expected: number[] = [];
  for (let k = lo; k <= hi; k++) {
    observed.push(tally.get(k) ?? 0);
    expected.push(k >= 1 && k <= n ? law[k] : 0);
  }
  return { samples: total, ...exactLawReport(observed, expected, lo) };
}
