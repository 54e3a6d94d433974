import type { RandomSource } from '../../random.js';
import type { LengthPlanInput } from './length-candidate.js';
import { lengthLaw, normalCdf } from './length-law.js';
import type { PlanCandidate } from './plan.js';
import { sizeCount } from './spec.js';

/** Length filters are offered only when the condition holds with at least this probability (estimate). */
export const FILTER_MIN_ACCEPTANCE = 0.02;
/** ... and, when another method fits, only at this estimated acceptance rate or above. */
export const FILTER_SLACK_ACCEPTANCE = 0.5;

/**
 * The family without its length constraint, keeping the samples that satisfy it: exact
 * (a uniform law restricted to a subset is uniform on it), and cheap when the constraint rarely
 * binds. The acceptance rate is estimated from the normal law of the number of parts
 * (length-law.ts); the filter is offered only where that estimate is not in a far tail.
 */
export function filterCandidate(input: LengthPlanInput, minAcceptance: number): PlanCandidate | null {
  const { spec, shape } = input;
  if (input.feasible !== true) return null;
  let acceptance: number;
  if (sizeCount(spec.sizes) <= 1 || shape.tilt === undefined) acceptance = 1;
  else {
    const law = lengthLaw(spec.sizes, shape.tilt, spec.distinct);
    if (!(law.sd > 0)) return null;
    if (spec.length !== undefined) {
      const z = (spec.length - law.mean) / law.sd;
      if (Math.abs(z) > 2) return null;
      acceptance = Math.min(1, Math.exp((-z * z) / 2) / (Math.sqrt(2 * Math.PI) * law.sd));
    } else {
      const z = (spec.maxLength! + 0.5 - law.mean) / law.sd;
      if (z < -2) return null;
      acceptance = normalCdf(z);
    }
  }
  if (acceptance < minAcceptance) return null;
  const inner = input.withoutLength();
  if (inner === null) return null;
  const sampleWork = inner.sampleWork / acceptance;
  const exact = spec.length;
  const most = spec.maxLength ?? Infinity;
  const length = exact ?? Math.min(most, shape.expectedLength);
  return {
    method: `${inner.method}+length-filter`,
    setupWork: inner.setupWork,
    sampleWork,
    fits: input.fits(inner.setupWork, sampleWork),
    build: () => {
      const sampler = inner.build();
      return {
        method: `${sampler.method}+length-filter`,
        expectedLength: length,
        expectedDistinct: Math.min(length, sampler.expectedDistinct),
        expectedWork: sampleWork,
        sample: (source: RandomSource) => {
          for (;;) {
            const p = sampler.sample(source);
            let parts = 0;
            for (const m of p.multiplicities) parts += m;
            if (exact !== undefined ? parts === exact : parts <= most) return p;
          }
        },
      };
    },
  };
}
