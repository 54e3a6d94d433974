import type { PartitionSampler } from '../../sampler.js';
import { AllowedLengthBoltzmann } from './allowed-length-boltzmann.js';
import { AllowedSubset } from './allowed-subset.js';
import { AllowedSubsetMixture } from './allowed-subset-mixture.js';
import { partsHint, SAMPLE_WORK_CEILING, samplerCandidate, type LengthPlanInput } from './length-candidate.js';
import type { PlanCandidate } from './plan.js';

/**
 * Allowed lists of sizes with a length constraint (`values` ascending): a single size (its one
 * member), k distinct sizes of the list (the subset design, allowed-subset.ts; the one member when
 * the k smallest or k largest sum to n), at most K distinct sizes (one design for every k,
 * allowed-subset-mixture.ts), any multiplicities (allowed-length-boltzmann.ts).
 */
export function listLengthCandidates(input: LengthPlanInput, values: readonly number[]): PlanCandidate[] {
  const { spec } = input;
  const { n, distinct } = spec;
  const out: PlanCandidate[] = [];
  const parts = spec.length ?? spec.maxLength!;
  if (values.length === 1) out.push(samplerCandidate(input, singleSize(values[0], n)));
  else if (distinct && spec.length !== undefined && spec.length <= values.length) {
    // k-subsets of the list: a table of r x k weighted elementary symmetric functions.
    const k = spec.length;
    const v = values;
    const cells = v.length * k;
    const smallest = v.slice(0, k);
    const largest = v.slice(v.length - k);
    const edge = [smallest, largest].find((parts) => parts.reduce((a, b) => a + b, 0) === n);
    // The k smallest or k largest sizes summing to n: the only member (the tilt would diverge).
    if (edge !== undefined) out.push(samplerCandidate(input, singleMember(edge.slice().reverse())));
    else if (input.fits(cells, 0)) out.push(samplerCandidate(input, new AllowedSubset(v, n, k), cells));
  } else if (distinct && spec.maxLength !== undefined && spec.maxLength < values.length) {
    // At most K distinct sizes of the list: one subset design for every k <= K (r x K numbers).
    if (input.fits(values.length * (spec.maxLength + 1), 0)) {
      const sampler = new AllowedSubsetMixture(values, n, 1, spec.maxLength);
      out.push(samplerCandidate(input, sampler, sampler.setupWork));
    }
  } else if (!distinct) {
    // Proposals grow about linearly with the number of parts (2-D local limit).
    const sampler = new AllowedLengthBoltzmann(values, n, parts, spec.length === undefined);
    out.push(samplerCandidate(input, sampler, 0, (work) => partsHint((parts * SAMPLE_WORK_CEILING) / work)));
  }
  return out;
}

/** The only member when a single size is allowed: n / s parts equal to s. */
function singleSize(s: number, n: number): PartitionSampler {
  return {
    method: 'single-member/1',
    expectedLength: n / s,
    expectedDistinct: 1,
    expectedWork: 1,
    sample: () => ({ sizes: [s], multiplicities: [n / s] }),
  };
}

/** A family with one member, the given distinct parts (largest first). */
function singleMember(parts: number[]): PartitionSampler {
  return {
    method: 'single-member/1',
    expectedLength: parts.length,
    expectedDistinct: parts.length,
    expectedWork: parts.length,
    sample: () => ({ sizes: parts.slice(), multiplicities: parts.map(() => 1) }),
  };
}
