import type { RandomSource } from '../random.js';
import type { CompositionSampler } from '../sampler.js';
import { sampleWeakComposition, weakCompositionWork } from './fixed-length.js';
import type { FixedCore } from './reduce.js';

/**
 * k parts in [0, L] summing to n (L < n), by rejection from uniform weak compositions: a uniform
 * weak composition conditioned on every part <= L is uniform over the bounded family, and the
 * acceptance probability is exactly count / C(n+k-1, k-1) (both known exactly, so the planner
 * knows the cost before running). Replacing every part v by L - v maps sum n onto sum kL - n;
 * the smaller sum is sampled, which keeps the parts far from the bound and the acceptance high.
 */
export function barsRejectSampler(core: FixedCore, acceptance: number): CompositionSampler {
  const { k, shift, scale } = core;
  const top = core.parts.kind === 'range' ? core.parts.max : NaN;
  const flipped = core.n > k * top - core.n;
  const m = flipped ? k * top - core.n : core.n;
  return {
    method: 'bars-reject/1',
    expectedLength: k,
    expectedWork: weakCompositionWork(m, k) / acceptance,
    sample(source: RandomSource) {
      for (;;) {
        const parts = sampleWeakComposition(source, m, k);
        let ok = true;
        for (let i = 0; i < k; i++) if (parts[i] > top) { ok = false; break; }
        if (!ok) continue;
        for (let i = 0; i < k; i++) parts[i] = shift + scale * (flipped ? top - parts[i] : parts[i]);
        return parts;
      }
    },
  };
}
