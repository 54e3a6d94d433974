import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { BoundedSelfSimilarSampler } from '../bounded-self-similar.js';
import { unrestrictedPartitionSampler } from '../unrestricted.js';
import { AllowedLengthBoltzmann } from './allowed-length-boltzmann.js';
import { AllowedSubset } from './allowed-subset.js';
import { BoxMixture, MixtureSetupExceeded, type MixtureEntry, type MixtureOptions } from './box-mixture.js';
import { BoxRotation } from './box-rotation.js';
import { BoxDesign, BoxSubset, type Box } from './box-subset.js';
import { lengthLaw, normalCdf, solveTiltNewton } from './length-law.js';
import { MultisetBoltzmann } from './multiset-boltzmann.js';
import { planCostNs, type PlanCandidate } from './plan.js';
import { about } from './refusal.js';
import { sizeCount, type ConstrainedSpec } from './spec.js';
import { addPart, addStaircase, conjugate, shiftParts } from './transforms.js';

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
 * - "allowed-length-boltzmann/1" (allowed lists, any multiplicities) and "allowed-subset/1"
 *   (allowed lists, distinct parts, exactly k): the subset design over the list;
 * - "bounded-boltzmann/1+conjugate" and "bounded-self-similar/1+conjugate": no upper bound on
 *   the parts, by conjugation (parts <= k; the self-similar one is estimated faster for k near √n/4 from n ~ 1e7);
 * - "<method>+length-filter": the family without its length constraint, keeping the samples that
 *   satisfy it, when that constraint rarely binds (restriction of a uniform law is uniform).
 *
 * Maps (all bijections, Andrews 1976, §1.3): k parts in [lo, hi] <-> the k x (hi - lo) box by
 * subtracting lo from every part (zero rows are parts equal to lo); k distinct parts in [lo, hi]
 * <-> the k x (hi - lo - k + 1) box by subtracting lo and the staircase (k-1, ..., 1, 0); at most K
 * parts <= hi is the K x hi box itself.
 */

/** What the length branch needs from the planner. */
export interface LengthPlanInput {
  readonly spec: ConstrainedSpec;
  readonly shape: { readonly expectedLength: number; readonly expectedDistinct: number; readonly tilt?: number };
  /** isFeasible's answer: methods that cannot detect an empty family need true. */
  readonly feasible: boolean | undefined;
  /** The cheapest fitting candidate for the same family without its length constraint. */
  readonly withoutLength: () => PlanCandidate | null;
  /** Whether a sampler's figures are within the planner's limits. */
  readonly fits: (setupWork: number, sampleWork: number) => boolean;
}

/** Setup steps per row of a box design (tilt solving by Newton steps, normaliser). */
const SETUP_STEPS_PER_ROW = 12;
/** No box design is solved whose work per sample would certainly exceed this (the planner's limit). */
const SAMPLE_WORK_CEILING = 1e7;
/**
 * Setup steps a box mixture may take (tilts and normalisers: transcendental functions, ~0.1 us
 * each; 7.9e5 steps took 40-60 ms of CPU for the 1464 boxes of n = 15395764, parts in [2, 10368],
 * at most 2948 parts).
 */
const MIXTURE_SETUP_LIMIT = 2e6;
/** Length filters are offered only when the condition holds with at least this probability (estimate). */
const FILTER_MIN_ACCEPTANCE = 0.02;
/** ... and, when another method fits, only at this estimated acceptance rate or above. */
const FILTER_SLACK_ACCEPTANCE = 0.5;

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
        if (hi >= n) {
          // At most K parts <-> parts <= K, by conjugation (Andrews 1976, §1.3).
          out.push(samplerCandidate(input, conjugated(new MultisetBoltzmann({ kind: 'interval', lo: 1, hi: K }, n), conjugate, K, input.shape)));
          const bounded = boundedCandidate(input, n, K, conjugate, K);
          if (bounded !== null) out.push(bounded);
        }
      } else {
        const mixture = mixtureCandidate(input, lo, hi, K);
        if (mixture !== null) out.push(mixture);
      }
    }
  }
  if (sizes.kind === 'list' && input.feasible === true) {
    const parts = spec.length ?? spec.maxLength!;
    if (sizes.values.length === 1) out.push(samplerCandidate(input, singleSize(sizes.values[0], n)));
    else if (distinct && spec.length !== undefined && spec.length <= sizes.values.length) {
      // k-subsets of the list: a table of r x k weighted elementary symmetric functions.
      const k = spec.length;
      const v = sizes.values;
      const cells = v.length * k;
      const smallest = v.slice(0, k);
      const largest = v.slice(v.length - k);
      const edge = [smallest, largest].find((parts) => parts.reduce((a, b) => a + b, 0) === n);
      // The k smallest or k largest sizes summing to n: the only member (the tilt would diverge).
      if (edge !== undefined) out.push(samplerCandidate(input, singleMember(edge.slice().reverse())));
      else if (input.fits(cells, 0)) out.push(samplerCandidate(input, new AllowedSubset(v, n, k), cells));
    } else if (!distinct) {
      // Proposals grow about linearly with the number of parts (2-D local limit).
      const sampler = new AllowedLengthBoltzmann(sizes.values, n, parts, spec.length === undefined);
      out.push(samplerCandidate(input, sampler, 0, (work) => partsHint((parts * SAMPLE_WORK_CEILING) / work)));
    }
  }
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

/** The box of "exactly k parts in [lo, hi]" (distinct or not), or null when there is no member. */
export function exactBox(n: number, lo: number, hi: number, distinct: boolean, k: number): Box | null {
  const cols = distinct ? hi - lo - (k - 1) : hi - lo;
  const size = n - k * lo - (distinct ? (k * (k - 1)) / 2 : 0);
  if (k < 1 || cols < 0 || size < 0 || size > k * cols) return null;
  // More rows or columns than the size can fill bind nothing.
  return { rows: Math.min(k, Math.max(size, 1)), cols: cols >= size ? Infinity : cols, size };
}

/** k parts: the box rows plus lo, zero rows becoming parts equal to lo. */
function shiftMap(lo: number, k: number): (rows: Partition) => Partition {
  return (rows) => {
    let used = 0;
    for (const m of rows.multiplicities) used += m;
    const sizes = rows.sizes.map((s) => s + lo);
    const multiplicities = rows.multiplicities.slice();
    if (used < k) {
      sizes.push(lo);
      multiplicities.push(k - used);
    }
    return { sizes, multiplicities };
  };
}

/** k distinct parts: the box rows (zeros included) plus lo and the staircase k-1, ..., 0. */
function staircaseMap(lo: number, k: number): (rows: Partition) => Partition {
  return (rows) => {
    const sizes: number[] = [];
    let rank = k - 1;
    for (let i = 0; i < rows.sizes.length; i++) {
      for (let j = 0; j < rows.multiplicities[i]; j++) sizes.push(rows.sizes[i] + lo + rank--);
    }
    while (rank >= 0) sizes.push(lo + rank--);
    return { sizes, multiplicities: sizes.map(() => 1) };
  };
}

/** An upper bound on the number of distinct part sizes of a box partition. */
function distinctBound(box: Box): number {
  return Math.min(box.rows, box.cols, Math.floor(Math.sqrt(2 * box.size)) + 1);
}

function samplerCandidate(input: LengthPlanInput, sampler: PartitionSampler, setupWork = 0, hint?: (work: number) => string): PlanCandidate {
  const fits = input.fits(setupWork, sampler.expectedWork);
  return {
    method: sampler.method,
    setupWork,
    sampleWork: sampler.expectedWork,
    fits,
    build: () => sampler,
    ...(fits || hint === undefined ? {} : { hint: hint(sampler.expectedWork) }),
  };
}

/** "at this n the family fits with at most about 24000 parts". */
function partsHint(parts: number): string {
  return `at this n the family fits with at most about ${about(parts)} parts`;
}

/** "... when maxPart is at most about 24000". */
function maxPartHint(maxPart: number): string {
  return `at this n the family fits with maxPart at most about ${about(maxPart)}`;
}

function boxCandidate(
  input: LengthPlanInput,
  box: Box,
  map: (rows: Partition) => Partition,
  expectedLength: number,
  expectedDistinct: number,
  /** The maxPart whose box has this many columns. */
  maxPartOf: (cols: number) => number,
  /** box-rotation's candidate for the same box, if any. */
  rotation: PlanCandidate | null = null,
): PlanCandidate {
  // The work grows like k^1.5 in the short side k of the box: the side to shrink, and by how much.
  const hint = (work: number) => {
    const fit = Math.min(box.rows, box.cols) * Math.pow(SAMPLE_WORK_CEILING / work, 2 / 3);
    return box.cols < box.rows ? maxPartHint(maxPartOf(fit)) : partsHint(fit);
  };
  // At least ~0.7 sqrt(k) proposals of 3k steps (x = 1; box-subset.ts): skip hopeless designs unsolved.
  const k = Math.min(box.rows, box.cols);
  if (k > 64 && 0.5 * k * Math.sqrt(k) > SAMPLE_WORK_CEILING) {
    const work = 0.5 * k * Math.sqrt(k);
    return { method: 'box-subset/1', setupWork: SETUP_STEPS_PER_ROW * k, sampleWork: work, fits: false, build: () => { throw new RangeError('box design over the work limit'); }, hint: hint(work) };
  }
  // Solving the design takes ~12 k steps of transcendental functions (tens of ms at k ~ 3e4): not
  // done while planning when box-rotation fits and costs less than box-subset's least work; the
  // candidate then carries that least work (it is built only when forced).
  if (k > 64 && rotation !== null && rotation.fits) {
    const least = 0.5 * k * Math.sqrt(k);
    const candidate = { method: 'box-subset/1', setupWork: SETUP_STEPS_PER_ROW * k, sampleWork: least };
    if (planCostNs(candidate) > planCostNs(rotation)) {
      return { ...candidate, fits: input.fits(candidate.setupWork, least), build: () => boxSubsetSampler(box, map, expectedLength, expectedDistinct) };
    }
  }
  const sampler = boxSubsetSampler(box, map, expectedLength, expectedDistinct);
  return samplerCandidate(input, sampler, SETUP_STEPS_PER_ROW * k, hint);
}

/** box-subset's sampler of a box carried onto the family by `map` (the design solved here). */
function boxSubsetSampler(box: Box, map: (rows: Partition) => Partition, expectedLength: number, expectedDistinct: number): PartitionSampler {
  const design = new BoxDesign(box);
  const subset = new BoxSubset(design);
  return {
    method: 'box-subset/1',
    expectedLength,
    expectedDistinct,
    // The maps write the multiplicity form: O(distinct sizes), not O(parts).
    expectedWork: design.expectedProposals * design.proposalCost + expectedDistinct,
    sample: (source: RandomSource) => map(subset.sample(source)),
  };
}

/** Boxes with more positions (rows + columns) are left to box-subset (box-rotation's proposals clear and hold them). */
const ROTATION_MAX_POSITIONS = 1 << 21;

/**
 * A finite box near half full by box-rotation.ts (uniform subsets shifted onto the size); null
 * for boxes with one row or column, open boxes, boxes of more than ROTATION_MAX_POSITIONS
 * positions, and where its estimate is hopeless (the uniform sum far from the box's).
 */
function rotationCandidate(
  input: LengthPlanInput,
  box: Box,
  map: (rows: Partition) => Partition,
  expectedLength: number,
  expectedDistinct: number,
): PlanCandidate | null {
  if (box.cols === Infinity || Math.min(box.rows, box.cols) < 2 || box.rows + box.cols > ROTATION_MAX_POSITIONS) return null;
  const estimate = BoxRotation.estimate(box);
  const work = estimate.expectedProposals * estimate.proposalCost + estimate.placeCost + expectedDistinct;
  if (!(work <= 100 * SAMPLE_WORK_CEILING)) return null;
  return {
    method: 'box-rotation/1',
    setupWork: 0,
    sampleWork: work,
    fits: input.fits(0, work),
    build: () => {
      const rotation = new BoxRotation(box);
      return {
        method: 'box-rotation/1',
        expectedLength,
        expectedDistinct,
        expectedWork: work,
        sample: (source: RandomSource) => map(rotation.sample(source)),
      };
    },
  };
}

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
function boxFilterCandidates(
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

/**
 * Exactly k parts >= lo with no upper bound (distinct: subtract the staircase) <-> partitions of
 * N into exactly k parts <-> (conjugate) N - k into parts <= k, plus one part k.
 */
function openExactCandidates(input: LengthPlanInput, k: number): PlanCandidate[] {
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
function boundedCandidate(input: LengthPlanInput, m: number, b: number, map: (p: Partition) => Partition, length: number): PlanCandidate | null {
  if (b < 2 || b >= m) return null;
  const inner = new BoundedSelfSimilarSampler(m, 1, b);
  const sampler = conjugated(inner, map, length, input.shape);
  const fits = inner.fitsLimits() && input.fits(0, sampler.expectedWork);
  return { method: sampler.method, setupWork: inner.setupWork, sampleWork: sampler.expectedWork, fits, build: () => sampler };
}

/** Wraps a sampler of the conjugate family. */
function conjugated(
  inner: PartitionSampler,
  map: (p: Partition) => Partition,
  length: number,
  shape: { expectedDistinct: number },
): PartitionSampler {
  return {
    method: `${inner.method}+conjugate`,
    expectedLength: length,
    // Conjugation keeps the number of distinct sizes (corners of the Ferrers diagram).
    expectedDistinct: Math.min(length, Math.max(inner.expectedDistinct, shape.expectedDistinct)),
    expectedWork: inner.expectedWork + 2 * inner.expectedDistinct,
    sample: (source) => map(inner.sample(source)),
  };
}

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
function mixtureCandidate(input: LengthPlanInput, lo: number, hi: number, K: number): PlanCandidate | null {
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
  if (least > MIXTURE_SETUP_LIMIT) return over(least, (K * MIXTURE_SETUP_LIMIT) / least);
  let mixture: BoxMixture;
  try {
    mixture = mixtureSampler(n, lo, hi, distinct, K, { setupLimit: MIXTURE_SETUP_LIMIT });
  } catch (error) {
    if (error instanceof MixtureSetupExceeded) return over(error.setupWork, error.parts - 1);
    throw error;
  }
  const setupWork = mixture.estimates.setupWork;
  return samplerCandidate(input, mixture, setupWork, (work) => partsHint(K * Math.pow(SAMPLE_WORK_CEILING / work, 2 / 3)));
}

/**
 * The family without its length constraint, keeping the samples that satisfy it: exact
 * (a uniform law restricted to a subset is uniform on it), and cheap when the constraint rarely
 * binds. The acceptance rate is estimated from the normal law of the number of parts
 * (length-law.ts); the filter is offered only where that estimate is not in a far tail.
 */
function filterCandidate(input: LengthPlanInput, minAcceptance: number): PlanCandidate | null {
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
