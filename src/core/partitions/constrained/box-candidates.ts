import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { BoxRotation } from './box-rotation.js';
import { BoxDesign, BoxSubset, type Box } from './box-subset.js';
import { maxPartHint, partsHint, SAMPLE_WORK_CEILING, samplerCandidate, type LengthPlanInput } from './length-candidate.js';
import { planCostNs, type PlanCandidate } from './plan.js';

/**
 * The candidates of one finite or open box (box-subset.ts, box-rotation.ts) with their estimated
 * costs, and the rule that leaves box-subset's design unsolved where box-rotation is cheaper.
 */

/** Setup steps per row of a box design (tilt solving by Newton steps, normaliser). */
const SETUP_STEPS_PER_ROW = 12;

export function boxCandidate(
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

/**
 * An open box's design step (one geometric gap per element) costs this share of a bounded one
 * (thinning over the positions, the work-costs row): process CPU per step, proposals as
 * estimated, 16-26 ns open (k = 791-2500 rows at n = 1e6-1e8, length = sqrt(n)/4) against
 * 29-56 ns bounded (3163 x 6325 and 10000 x 20000 boxes).
 */
const OPEN_STEP_SHARE = 0.4;

/** box-subset's sampler of a box carried onto the family by `map` (the design solved here). */
function boxSubsetSampler(box: Box, map: (rows: Partition) => Partition, expectedLength: number, expectedDistinct: number): PartitionSampler {
  const design = new BoxDesign(box);
  const subset = new BoxSubset(design);
  return {
    method: 'box-subset/1',
    expectedLength,
    expectedDistinct,
    // The maps write the multiplicity form: O(distinct sizes), not O(parts).
    expectedWork: design.expectedProposals * design.proposalCost * (design.b === Infinity ? OPEN_STEP_SHARE : 1) + expectedDistinct,
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
export function rotationCandidate(
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
