import type { Box } from './box-subset.js';
import { boxCandidate, rotationCandidate } from './box-candidates.js';
import { boxFilterCandidates } from './box-filter-candidates.js';
import { distinctBound, exactBox, shiftMap, staircaseMap } from './box-maps.js';
import type { LengthPlanInput } from './length-candidate.js';
import { FILTER_MIN_ACCEPTANCE, FILTER_SLACK_ACCEPTANCE, filterCandidate } from './length-filter-candidate.js';
import { listLengthCandidates } from './list-length-candidates.js';
import { MIXTURE_SETUP_LIMIT_WITH_RIVAL, mixtureCandidate } from './mixture-candidate.js';
import { conjugateMixtureCandidate, openAtMostCandidates, openExactCandidates } from './open-length-candidates.js';
import type { PlanCandidate } from './plan.js';
import { sizeCount, type ConstrainedSpec } from './spec.js';

export type { LengthPlanInput } from './length-candidate.js';
export { exactBox } from './box-maps.js';
export { mixtureEntries, mixtureSampler } from './mixture-candidate.js';

/**
 * The length branch of the constrained planner: exact methods for families with `length`
 * (exactly k parts) or `maxLength` (at most K parts), combined with any of distinct, minPart,
 * maxPart and allowed. Tables stay in plan.ts; this file lists the Boltzmann-type methods with
 * their estimated costs:
 *
 * - "box-subset/1" (box-subset.ts): a part bound with exactly k parts (distinct or not) or with
 *   at most K parts >= 1 is a partition in a box (Andrews 1976, ch. 3) after the maps below;
 * - "box-rotation/1" (box-rotation.ts): a finite box near half full, from uniform subsets shifted
 *   onto the box's size (chosen by cost against box-subset; its design is not solved when
 *   box-rotation is cheaper than box-subset's least work);
 * - "box-mixture/1" (box-mixture.ts): at most K parts with minPart > 1 or distinct parts, as the
 *   union over k of boxes, one tilt kept across consecutive k (setup O(K), measured by building);
 * - "conjugate-mixture/2" (conjugate-mixture.ts): at most K parts >= lo >= 2 (any maxPart), as the
 *   conjugate (k^lo) ∪ ν with ν's parts <= k, the number of parts k drawn under the same tilt;
 * - "allowed-length-boltzmann/1" (allowed lists, any multiplicities), "allowed-subset/1"
 *   (allowed lists, distinct parts, exactly k) and "allowed-subset-mixture/1" (distinct, at most
 *   K): the subset design over the list;
 * - "bounded-boltzmann/1+conjugate" and "bounded-self-similar/1+conjugate": no upper bound on
 *   the parts, by conjugation (parts <= k; the self-similar one is estimated faster for k near √n/4 from n ~ 1e7);
 * - "<method>+length-filter": the family without its length constraint, keeping the samples that
 *   satisfy it, when that constraint rarely binds (restriction of a uniform law is uniform).
 *
 * Files: box-maps.ts (boxes and maps back), box-candidates.ts (box-subset, box-rotation),
 * box-filter-candidates.ts, open-length-candidates.ts (conjugation), mixture-candidate.ts
 * (box-mixture and its construction limit), list-length-candidates.ts (allowed lists),
 * length-filter-candidate.ts, length-candidate.ts (what they share).
 */

export function lengthCandidates(input: LengthPlanInput): PlanCandidate[] {
  const { spec } = input;
  const out: PlanCandidate[] = [];
  const { n, distinct, sizes } = spec;
  if (sizes.kind === 'interval') {
    const { lo } = sizes;
    const hi = Math.min(sizes.hi, n);
    if (spec.length !== undefined) {
      const k = spec.length;
      const box = exactBox(n, lo, hi, distinct, k);
      if (box !== null) {
        const map = distinct ? staircaseMap(lo, k) : shiftMap(lo, k);
        const rotation = rotationCandidate(input, box, map, k, distinct ? k : Math.min(k, distinctBound(box) + 1));
        if (rotation !== null) out.push(rotation);
        out.push(boxCandidate(input, box, map, k, distinct ? k : Math.min(k, distinctBound(box) + 1), (cols) => lo + cols + (distinct ? k - 1 : 0), rotation));
        out.push(...boxFilterCandidates(input, box, map, k, distinct ? k : Math.min(k, distinctBound(box) + 1)));
      }
      if (hi >= n) out.push(...openExactCandidates(input, k));
    } else if (spec.maxLength !== undefined) {
      const K = spec.maxLength;
      if (!distinct && lo === 1) {
        const box: Box = { rows: Math.min(K, n), cols: hi >= n ? Infinity : hi, size: n };
        const rotation = rotationCandidate(input, box, (rows) => rows, Math.min(K, n), distinctBound(box));
        if (rotation !== null) out.push(rotation);
        out.push(boxCandidate(input, box, (rows) => rows, Math.min(K, n), distinctBound(box), (cols) => cols, rotation));
        out.push(...boxFilterCandidates(input, box, (rows) => rows, Math.min(K, n), distinctBound(box)));
        // At most K parts <-> parts <= K, by conjugation (Andrews 1976, §1.3).
        if (hi >= n) out.push(...openAtMostCandidates(input, n, K));
      } else {
        // At most K parts >= lo (lo >= 2): the conjugate has lo equal largest parts (one tilt over k).
        const conjugated = distinct ? null : conjugateMixtureCandidate(input, lo, hi, K);
        const mixture = mixtureCandidate(input, lo, hi, K, conjugated?.fits === true ? MIXTURE_SETUP_LIMIT_WITH_RIVAL : undefined);
        if (mixture !== null) out.push(mixture);
        if (conjugated !== null) out.push(conjugated);
      }
    }
  }
  if (sizes.kind === 'list' && input.feasible === true) out.push(...listLengthCandidates(input, sizes.values));
  // A length filter plans the family without the length constraint (tables, tilts): only worth
  // it when that constraint rarely binds or nothing else fits.
  const filter = filterCandidate(input, out.some((c) => c.fits) ? FILTER_SLACK_ACCEPTANCE : FILTER_MIN_ACCEPTANCE);
  if (filter !== null) out.push(filter);
  return out;
}

/** Families with at most this many parts possible get the length branch's methods without a length constraint. */
const IMPLICIT_LENGTH_CAP = 20_000;

/**
 * A family without a length constraint in which few parts fit (distinct parts or minPart > 1 over
 * an interval of sizes): it equals "at most mostParts parts", which box-mixture samples. Offered
 * when no method of the no-length branch fits.
 */
export function implicitLengthCandidates(input: LengthPlanInput): PlanCandidate[] {
  const { spec } = input;
  if (spec.sizes.kind !== 'interval' || (!spec.distinct && spec.sizes.lo <= 1)) return [];
  const most = mostParts(spec);
  if (most < 1 || most > IMPLICIT_LENGTH_CAP) return [];
  const mixture = mixtureCandidate({ ...input, spec: { ...spec, maxLength: most } }, spec.sizes.lo, Math.min(spec.sizes.hi, spec.n), most);
  return mixture === null ? [] : [mixture];
}

/**
 * The most parts a member can have: n / (smallest size), or for distinct parts the largest k
 * whose k smallest sizes sum to at most n.
 */
export function mostParts(spec: ConstrainedSpec): number {
  const { n, sizes } = spec;
  if (sizeCount(sizes) === 0) return 0;
  if (!spec.distinct) return Math.floor(n / (sizes.kind === 'list' ? sizes.values[0] : sizes.lo));
  if (sizes.kind === 'list') {
    let sum = 0;
    let k = 0;
    while (k < sizes.values.length && sum + sizes.values[k] <= n) sum += sizes.values[k++];
    return k;
  }
  // k lo + k(k-1)/2 <= n and k <= hi - lo + 1.
  const { lo, hi } = sizes;
  const b = lo - 0.5;
  let k = Math.floor(-b + Math.sqrt(b * b + 2 * n));
  while (k * lo + (k * (k - 1)) / 2 > n) k--;
  while ((k + 1) * lo + ((k + 1) * k) / 2 <= n) k++;
  return Math.max(0, Math.min(k, hi - lo + 1));
}

