import type { Partition } from '../../partition.js';
import type { PartitionSampler } from '../../sampler.js';
import { unrestrictedPartitionSampler } from '../unrestricted.js';
import type { Box } from './box-subset.js';
import { samplerCandidate, type LengthPlanInput } from './length-candidate.js';
import { lengthLaw, normalCdf, solveTiltNewton } from './length-law.js';
import { MultisetBoltzmann } from './multiset-boltzmann.js';
import type { PlanCandidate } from './plan.js';
import { conjugate } from './transforms.js';

/**
 * Boxes one or both of whose sides rarely bind: an exact sampler of the partitions of the box's
 * size under the binding side only, keeping the samples that fit the other (a uniform law
 * restricted to a subset is uniform on it):
 * - neither side binds: the unrestricted sampler; the acceptance rate is estimated with the
 *   Erdős–Lehner law of the largest part and, by conjugation, of the number of parts (Erdős &
 *   Lehner 1941: (lambda_1 - a ln a) / a tends to Gumbel, a = sqrt(6m) / pi);
 * - only "at most `rows` parts" binds: parts <= rows by conjugation, keep those with at most
 *   `cols` parts before conjugating; only "parts <= cols" binds: keep those with at most `rows`
 *   parts. Acceptance from the normal law of the number of parts (length-law.ts).
 * Offered only where the estimate is well inside the bulk of the law.
 */
export function boxFilterCandidates(
  input: LengthPlanInput,
  box: Box,
  map: (rows: Partition) => Partition,
  expectedLength: number,
  expectedDistinct: number,
): PlanCandidate[] {
  const { rows, cols, size } = box;
  if (size < 2 || rows < 1 || cols < 1) return [];
  const out: PlanCandidate[] = [];
  const fitsBox = (p: Partition) => p.sizes[0] <= cols && lengthOfParts(p) <= rows;
  const wrap = (method: string, inner: PartitionSampler, accept: number, transform: (p: Partition) => Partition, keep: (p: Partition) => boolean) => {
    const sampler: PartitionSampler = {
      method,
      expectedLength,
      expectedDistinct: Math.min(expectedDistinct, inner.expectedDistinct + 1),
      expectedWork: inner.expectedWork / accept + expectedDistinct,
      sample: (source) => {
        for (;;) {
          const p = inner.sample(source);
          if (keep(p)) return map(transform(p));
        }
      },
    };
    out.push(samplerCandidate(input, sampler));
  };
  const a = Math.sqrt(6 * size) / Math.PI;
  const gumbel = (r: number) => (r === Infinity ? 1 : Math.exp(-Math.exp(-(r - a * Math.log(a)) / a)));
  const free = gumbel(rows) * gumbel(cols);
  if (free >= 0.5) {
    const inner = unrestrictedPartitionSampler(size);
    wrap(`${inner.method}+box-filter`, inner, free, (p) => p, fitsBox);
  }
  const oneSided = (binding: number, slack: number, conjugateFirst: boolean) => {
    if (slack === Infinity || binding >= size) return;
    // Bounding the parts only adds parts (conjugate: fewer parts, larger largest part), so the mean
    // number of parts is at least the unrestricted one, ~ a ln a (Erdős–Lehner, above): skip the
    // tilt (O(binding) sums per Newton step) when even that exceeds the slack.
    if (a * Math.log(a) > slack) return;
    const sizes = { kind: 'interval', lo: 1, hi: binding } as const;
    const tilt = solveTiltNewton(sizes, size, false);
    const law = lengthLaw(sizes, tilt, false);
    const z = (slack + 0.5 - law.mean) / law.sd;
    if (!(z >= 2.5)) return;
    const inner = new MultisetBoltzmann(sizes, size, tilt);
    // The inner partition has parts <= binding; its number of parts must be <= slack.
    const keep = (p: Partition) => lengthOfParts(p) <= slack;
    wrap(`${inner.method}+${conjugateFirst ? 'conjugate+' : ''}box-filter`, inner, normalCdf(z), conjugateFirst ? conjugate : (p) => p, keep);
  };
  oneSided(rows, cols, true);
  oneSided(cols, rows, false);
  return out;
}

function lengthOfParts(p: Partition): number {
  let total = 0;
  for (const m of p.multiplicities) total += m;
  return total;
}
