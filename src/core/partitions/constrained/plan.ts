import { EmptyFamilyError } from '../../errors.js';
import type { PartitionFamily } from '../../family.js';
import type { PartitionSampler } from '../../sampler.js';
import { BoundedSelfSimilarSampler } from '../bounded-self-similar.js';
import { DistinctBoundedSelfSimilarSampler } from '../distinct-bounded-self-similar.js';
import { DistinctSelfSimilarSampler } from '../distinct-self-similar.js';
import { MinPartSelfSimilarSampler } from '../min-part-self-similar.js';
import { NarrowRangeMixture } from '../narrow-range-mixture.js';
import { DistinctBoltzmann } from './distinct-boltzmann.js';
import { isFeasible } from './feasibility.js';
import { MultisetBoltzmann } from './multiset-boltzmann.js';
import { solveTiltNewton } from './length-law.js';
import { implicitLengthCandidates, lengthCandidates, mostParts } from './plan-length.js';
import { about, refusal, undecidedSubsetHint } from './refusal.js';
import { decidedRange } from './subset-sum-reach.js';
import {
  contradiction,
  emptyFamilyMessage,
  sizeCount,
  sizeList,
  toSpec,
  type ConstrainedSpec,
} from './spec.js';
import { lengthTableSampler, sizeLengthTableSampler, sizeTableSampler, type TableSampler } from './table-sampler.js';
import { solveTilt, tiltMoments } from './tilt.js';
import { nsPerSetupUnit, nsPerStep } from '../../work-costs.js';

/**
 * Planner for constrained partition families: lists the exact methods that apply, estimates
 * each one's time as setup + NOMINAL_SAMPLES x expected work per sample, both priced in
 * nanoseconds per unit of that method (planCostNs, rows in work-costs.ts), and builds the
 * fastest that fits the budgets. The choice depends on the family only (the rows are
 * constants), so sample i stays a function of (seed, i, family, ALGORITHM_VERSION).
 *
 * Limits (for the README):
 * - TABLE_CELL_LIMIT = 5e6 cells (8 bytes each, 40 MB) for any counting table. Hence, roughly:
 *   table-sizes (no length constraint) needs (#sizes + 1)(n + 1) <= 5e6, e.g. distinct or
 *   minPart-only families up to n ~ 2200 this way; table-lengths needs (K + 1)(n + 1), e.g.
 *   distinct parts (K ~ sqrt(2n)) up to n ~ 2.2e4 (plain distinct parts switch to
 *   distinct-self-similar from n ~ 5000, where it is estimated faster), exactly k parts with k = 100 up to n ~ 5e4;
 *   table-sizes-lengths needs (#sizes + 1)(L + 1)(n + 1), e.g. n = 300 with 50 sizes and L = 300.
 * - DISTINCT_BLOCK_CELL_LIMIT = 2e6 cells for distinct-boltzmann's table of the smallest sizes.
 * - SAMPLE_WORK_LIMIT = 1e7 expected steps per sample (one step ~ 0.1-0.3 us measured, so at
 *   most ~3 s per sample): Boltzmann methods whose expected proposals x proposal cost exceed it
 *   are refused. Measured consequences (planner estimates): plain distinct parts up to n = 1e9
 *   (distinct-self-similar: 1.3e5 steps, ~8 ms per sample at 1e9); distinct parts >= a alone
 *   (2 <= a <= 200, and 200 < a <= 5000 where n >= a²/4) up to n = 1e9 (distinct-bounded-self-similar:
 *   0.26 ms per sample at 1e6, 6 ms at 1e9 for a = 7; 14-28 ms at 1e8-1e9 for a = 500, 22-62 ms for
 *   a = √n/8 at load ~3, bench shapes; fewer parts keep table-lengths or distinct-boltzmann, and
 *   a > 5000 at large n is refused); distinct parts with a maxPart (distinct-boltzmann) up to
 *   n ~ 4e7 (1.6e6 steps, 70 ms per sample at n = 1e7), or distinct-bounded-self-similar where
 *   its counts serve every level (also maxPart near the middle of its range, 1.5-3 sqrt(n), by the
 *   middle-regime counts: 2.4 ms at 1e8 and 9 ms at 1e9 for 2 sqrt(n), 8-24 ms for 1.5 and
 *   3 sqrt(n), bench shapes; e.g. maxPart = 1e4 at n = 1e6: 4 ms against 11 ms); parts <= m, "at most K parts" and "exactly k
 *   parts" (conjugated to parts <= K) up to n = 1e9 for m, K, k up to ~1000 (3e4 steps,
 *   ~10-30 ms) by bounded-boltzmann, and for m, K, k near √n or above by bounded-self-similar
 *   (parts in [a, b] with b < n, minPart allowed; its count tables must fit, so b not far below
 *   √n: ~1-2e5 steps, 3-8 ms per sample at 1e9, `npm run bench -- costs`), the faster
 *   estimate chosen (bounded-self-similar from n ~ 1e6 on for b ~ √n, and for "at most" or
 *   "exactly" k ~ √n/4 parts from n ~ 1e7; bounded-boltzmann's sample time grows like r^1.5 over r
 *   sizes, and over a narrow range of large sizes most proposals are wasted: where it is
 *   estimated above 10 ms per sample and few parts fit, box-mixture is built too, e.g. parts in
 *   [n/1000, n/1000 + 29]: 0.3-0.4 ms per sample at 1e7 instead of ~600 ms, bench shapes short:);
 *   parts >= a alone (2 <= a <= 482) up to n = 1e9 by minpart-self-similar (0.3-12 ms
 *   per sample at 1e6-1e9 for a = 2, 7, 100; 19 ms at n = 95,488,108 with a = 481), larger a
 *   by bounded-self-similar with b = n (its upper levels' tables stay unfilled; 6-20 ms CPU per
 *   sample for a = 524-41,380 at 6e7-1e9, scripts/scan-families.ts); allowed
 *   lists such as {1, 2, 5, 10, 20, 50} up to n = 1e9 (0.1 ms), also lists of large sizes (emptiness by
 *   the residue table of the smallest size, feasibility.ts); distinct parts from lists of up to 1000
 *   sizes wherever subset-sum-reach.ts decides that n is reached (distinct-boltzmann, 0.2-9 ms per
 *   sample at 1e4-1e8, `npx tsx scripts/bench/shapes.ts distinct-allowed`). Families with `length` or
 *   `maxLength` are planned by plan-length.ts: any combination up to n = 1e9 while the short side
 *   of their box (number of parts or range of part sizes) is up to ~2e4 (work ~ side^1.5); at most
 *   K parts >= minPart >= 2 (maxPart rarely binding) up to K ~ 5e4 at 1e9 through the conjugate
 *   (conjugate-mixture, ~50-80 ms per sample at K = 2.3e4, n = 9e8, which was refused before).
 * - n <= 1e9, allowed lists <= 1000 sizes (validation, spec.ts).
 * A family no method fits throws LimitExceededError naming the limit. Empty families throw
 * EmptyFamilyError; contradictory bounds (minPart > maxPart, length > n) throw RangeError.
 */
export const TABLE_CELL_LIMIT = 5_000_000;
export const SAMPLE_WORK_LIMIT = 1e7;
/** Samples a plan is costed for (setup is paid once per request). */
export const NOMINAL_SAMPLES = 100;
/**
 * Boltzmann methods are considered (and built) only when the best table's plan is estimated
 * above this many nanoseconds (5 ms for NOMINAL_SAMPLES samples: below it, what they could save
 * is about what building them costs, ~1-2 ms of tilts and candidates measured at n = 1e3-3e3).
 */
const BOLTZMANN_CONSIDERED_ABOVE_NS = 5e6;

/**
 * The union of boxes (implicitLengthCandidates) is also built when every method above is
 * estimated above this (10 ms per sample for NOMINAL_SAMPLES; its setup stays below ~120 ms,
 * plan-length.ts): bounded-boltzmann over a narrow range of large sizes wastes most proposals (its
 * two smallest sizes represent few residuals), e.g. parts in [10000, 10029] at n = 1e7: 265 ms
 * per sample against 1.6 ms for box-mixture (scripts/scan-families.ts).
 */
const IMPLICIT_LENGTH_CONSIDERED_ABOVE_NS = 1e9;

export interface PlanOptions {
  /**
   * Force a method by id without versions, e.g. "distinct-boltzmann" or "box-subset"; composite
   * ids spelled out ("bounded-boltzmann+conjugate") or by their first part (tests and benchmarks).
   */
  readonly method?: string;
}

export interface PlanCandidate {
  readonly method: string;
  readonly setupWork: number;
  readonly sampleWork: number;
  readonly fits: boolean;
  readonly build: () => PartitionSampler;
  /** When it does not fit: what would, in the family's terms (for the refusal message). */
  readonly hint?: string;
}

/** An exact uniform sampler for a constrained partition family (see the limits above). */
export function constrainedPartitionSampler(family: PartitionFamily, options: PlanOptions = {}): PartitionSampler {
  const candidates = planCandidates(family, options.method !== undefined);
  const spec = toSpec(family);
  let chosen: PlanCandidate | undefined;
  if (options.method !== undefined) {
    // The id without versions ("bounded-boltzmann+length-filter"), else the first with that base name.
    const bare = (id: string) => id.replace(/\/\d+/g, '');
    chosen = candidates.find((c) => bare(c.method) === options.method) ?? candidates.find((c) => c.method.split('/')[0] === options.method);
    if (chosen === undefined) {
      throw new RangeError(`method ${options.method} does not apply to this family (applicable: ${candidates.map((c) => c.method).join(', ')})`);
    }
  } else {
    const fitting = candidates.filter((c) => c.fits);
    if (fitting.length === 0) {
      const least = candidates.reduce((a, b) => (steps(b) < steps(a) ? b : a));
      // The hint of the method closest to fitting that knows what would fit.
      const hinted = candidates.filter((c) => c.hint !== undefined);
      const hint = hinted.length === 0 ? undefined : hinted.reduce((a, b) => (b.sampleWork < a.sampleWork ? b : a)).hint;
      throw refusal(family, { setupWork: least.setupWork, sampleWork: least.sampleWork, hint }, TABLE_CELL_LIMIT, SAMPLE_WORK_LIMIT);
    }
    chosen = fitting.reduce((a, b) => (planCostNs(b) < planCostNs(a) ? b : a));
  }
  const sampler = chosen.build();
  if ((sampler as Partial<TableSampler>).total === 0) throw new EmptyFamilyError(emptyFamilyMessage(spec.family));
  return sampler;
}

/**
 * A plan's estimated time in nanoseconds: setup once plus NOMINAL_SAMPLES samples, each method's
 * steps and setup units priced by its measured rows (work-costs.ts; wrapped ids such as
 * "bounded-boltzmann/1+conjugate" or "...+length-filter" by the method they wrap). Steps differ
 * many-fold between methods (a table cell ~8 ns, a Boltzmann step ~100 ns), so counts alone do
 * not compare. The rows are constants: the choice stays a function of the family.
 */
export function planCostNs(c: Pick<PlanCandidate, 'method' | 'setupWork' | 'sampleWork'>): number {
  return c.setupWork * nsPerSetupUnit(c.method) + NOMINAL_SAMPLES * c.sampleWork * nsPerStep(c.method);
}

/** The work a refused family's nearest method would need, in steps (the limits' unit). */
function steps(c: PlanCandidate): number {
  return c.setupWork + NOMINAL_SAMPLES * c.sampleWork;
}

/**
 * The applicable methods with their estimated costs. Throws RangeError for malformed or
 * contradictory families and EmptyFamilyError when a closed form shows the family is empty.
 */
export function planCandidates(family: PartitionFamily, includeAll = false): PlanCandidate[] {
  const spec = toSpec(family);
  const reason = contradiction(family);
  if (reason !== null) throw new RangeError(reason);
  const feasible = isFeasible(spec);
  if (feasible === false) throw new EmptyFamilyError(emptyFamilyMessage(family));
  const { n, distinct, sizes } = spec;
  if (n === 0) {
    const empty: PartitionSampler = {
      method: 'trivial/1',
      expectedLength: 0,
      expectedDistinct: 0,
      expectedWork: 1,
      sample: () => ({ sizes: [], multiplicities: [] }),
    };
    return [{ method: 'trivial/1', setupWork: 0, sampleWork: 1, fits: true, build: () => empty }];
  }
  // A maxLength no member can reach binds nothing: such a family is planned without it.
  const hasLength = spec.length !== undefined || (spec.maxLength !== undefined && spec.maxLength < mostParts(spec));
  const kMin = spec.length ?? 0;
  const kMax = Math.min(spec.length ?? spec.maxLength ?? n, n);
  const open = sizes.kind === 'interval' && sizes.hi >= n;
  const lo = sizes.kind === 'interval' ? sizes.lo : 0;
  const r = sizeCount(sizes);
  // The length branch solves its tilt by Newton steps (length-law.ts; only estimates depend on it).
  const shape = estimateShape(spec, hasLength ? solveTiltNewton : solveTilt);
  const out: PlanCandidate[] = [];
  const table = (method: string, cells: number, sampleWork: number, build: () => PartitionSampler, hint?: string) =>
    out.push({ method, setupWork: cells, sampleWork, fits: cells <= TABLE_CELL_LIMIT, build, ...(hint === undefined ? {} : { hint }) });

  if (!hasLength) {
    // For an allowed list this table can be the only method (distinct parts from a long list at
    // large n: deciding, let alone counting, which subsets reach n is a subset-sum problem), so
    // its refusal says which n, or how many sizes, the table holds.
    const fewer = about(TABLE_CELL_LIMIT / (n + 1) - 1);
    const listHint =
      sizes.kind === 'list'
        ? `with these ${r} sizes the family fits up to n = ${about(TABLE_CELL_LIMIT / (r + 1) - 1)}, and at this n with at most ${fewer} allowed size${fewer === '1' ? '' : 's'}`
        : undefined;
    // Distinct parts whose reachability was left undecided (subset-sum-reach.ts): say which n are decided.
    const undecided = distinct && sizes.kind === 'list' && feasible === undefined;
    const hint = undecided ? undecidedSubsetHint(r, decidedRange(sizes.values)) : listHint;
    table('table-sizes/1', (r + 1) * (n + 1), r + shape.expectedLength, () => sizeTableSampler(sizeList(sizes), n, distinct, shape), hint);
  }
  if (open && (hasLength || distinct || lo > 1)) {
    const top = distinct ? Math.min(kMax, Math.ceil(Math.sqrt(2 * n)) + 1) : Math.min(kMax, Math.floor(n / lo));
    const k = Math.max(1, shape.expectedLength);
    table('table-lengths/1', (top + 1) * (n + 1), top - kMin + 1 + k + n / k, () =>
      lengthTableSampler(n, lo, distinct, kMin, top, shape),
    );
  }
  if (hasLength) {
    // Distinct parts from a list whose reachability was left undecided (length-feasibility.ts): say which n the table holds.
    const undecidedHint =
      distinct && sizes.kind === 'list' && feasible === undefined
        ? `deciding whether ${spec.length !== undefined ? 'exactly' : 'at most'} ${kMax} of these ${r} sizes sum to n takes too long here; with these sizes and this number of parts n up to about ${about(TABLE_CELL_LIMIT / ((r + 1) * (kMax + 1)) - 1)} fits`
        : undefined;
    table('table-sizes-lengths/1', (r + 1) * (kMax + 1) * (n + 1), kMax + r + shape.expectedLength, () =>
      sizeLengthTableSampler(sizeList(sizes), n, distinct, kMin, kMax, shape),
    undecidedHint);
  }

  const bestTable = Math.min(...out.filter((c) => c.fits).map(planCostNs), Infinity);
  if (!includeAll && bestTable <= BOLTZMANN_CONSIDERED_ABOVE_NS) return out;
  // A sampler built while planning, with its own estimates; `setupFits`: whether the memory or
  // setup it holds is within its limit.
  const prepared = (sampler: PartitionSampler & { setupWork?: number }, setupFits: boolean) =>
    out.push({
      method: sampler.method,
      setupWork: sampler.setupWork ?? 0,
      sampleWork: sampler.expectedWork,
      fits: setupFits && sampler.expectedWork <= SAMPLE_WORK_LIMIT,
      build: () => sampler,
    });
  const boltzmann = (make: () => PartitionSampler & { setupWork?: number }) => {
    const sampler = make();
    prepared(sampler, (sampler.setupWork ?? 0) <= TABLE_CELL_LIMIT);
  };
  if (!hasLength && feasible === true) {
    // Plain distinct parts (no bound on the sizes): the self-similar method (distinct-self-similar.ts).
    // It is cheaper than distinct-boltzmann wherever Boltzmann methods are considered (checked in
    // test/constrained/plan-distinct.test.ts), so that one, and its 2e6-cell block table (~40 ms),
    // is only built when all candidates are asked for.
    const plainDistinct = distinct && open && lo <= 1;
    if (plainDistinct) boltzmann(() => new DistinctSelfSimilarSampler(n));
    // Distinct parts in [a, c] (a <= 200, or a <= 5000 with n >= a²/4; a >= 2 or c < n): the same engine with the bounds going
    // down the levels (distinct-bounded-self-similar.ts), where its counts serve every level
    // (`servable`; an upper bound near the middle of its range, e.g. maxPart ~ 2√n, is served
    // by the counts' middle regime). Its setup is time (count tables of a few thousand doubles each), so it fits
    // on the sample-work limit and the memory it holds.
    // distinct-boltzmann stays a candidate: with a in the tens and n <~ 1e5 it is estimated faster.
    const boundedDistinct = distinct && sizes.kind === 'interval' && !plainDistinct && DistinctBoundedSelfSimilarSampler.serves(n, Math.max(1, lo));
    const sampler = boundedDistinct ? new DistinctBoundedSelfSimilarSampler(n, Math.max(1, lo), undefined, undefined, open ? Infinity : sizes.hi) : null;
    if (sampler !== null && sampler.servable) prepared(sampler, sampler.setupCells <= TABLE_CELL_LIMIT);
    // Beyond its smallest-part limit it is not built: if nothing else fits, the refusal says what would.
    const maxA = DistinctBoundedSelfSimilarSampler.MAX_A;
    if (!includeAll && distinct && open && lo > maxA) {
      // serves(n, a): a <= 200, or a <= MAX_A with n >= a²/4.
      const hint = `with distinct parts at this n, minPart up to ${Math.max(200, Math.min(maxA, Math.floor(2 * Math.sqrt(n))))} fits`;
      out.push({ method: 'distinct-bounded-self-similar/1', setupWork: 0, sampleWork: Infinity, fits: false, hint, build: () => { throw new RangeError(hint); } });
    }
    // From n = 1e7 on, distinct-boltzmann is estimated >= 8x the bounded self-similar method's cost
    // wherever that one is servable (a = 3-4918, with and without maxPart), and building it takes
    // ~80 ms (its block table): it is then left out.
    const selfSimilarServes = sampler !== null && sampler.servable && n >= 1e7;
    if (distinct && (!plainDistinct || includeAll) && (includeAll || !selfSimilarServes)) boltzmann(() => new DistinctBoltzmann(sizes, n, undefined, shape.tilt));
    else if (!distinct) boltzmann(() => new MultisetBoltzmann(sizes, n, shape.tilt));
    if (!distinct && open && lo >= 2 && lo <= MinPartSelfSimilarSampler.MAX_A) {
      // Parts >= a and nothing else: the self-similar method with a family per level
      // (min-part-self-similar.ts). Its setup is time (count tables of ~1e4 doubles each), so it
      // fits on the sample-work limit and the memory it holds.
      const sampler = new MinPartSelfSimilarSampler(n, lo);
      prepared(sampler, sampler.setupCells <= TABLE_CELL_LIMIT);
    }
    const largeMinPart = open && lo > MinPartSelfSimilarSampler.MAX_A;
    if (!distinct && sizes.kind === 'interval' && (sizes.hi < n || largeMinPart) && sizes.lo <= sizes.hi) {
      // Parts in [a, b] with b < n (maxPart, with or without minPart): the self-similar method with
      // an upper bound (bounded-self-similar.ts), where its count tables fit (b not far below √n).
      // Parts >= a alone with a above minpart-self-similar's range: the same with b = n (no part
      // exceeds n), its upper levels' counts main-arc integrals over tables left unfilled.
      const sampler = new BoundedSelfSimilarSampler(n, Math.max(1, sizes.lo), Math.min(sizes.hi, n));
      prepared(sampler, sampler.fitsLimits());
    }
    if (!distinct && sizes.kind === 'interval' && NarrowRangeMixture.applies(n, sizes.lo, sizes.hi)) {
      // Parts in a narrow range of large sizes (few numbers of parts): the union over k of boxes,
      // box-rotation near half full and box-subset elsewhere (narrow-range-mixture.ts).
      const sampler = NarrowRangeMixture.within(n, sizes.lo, sizes.hi, TABLE_CELL_LIMIT);
      if (sampler !== null) prepared(sampler, true);
    }
  }
  const fits = (setup: number, work: number) => setup <= TABLE_CELL_LIMIT && work <= SAMPLE_WORK_LIMIT;
  if (hasLength) {
    out.push(...lengthCandidates({ spec, shape, feasible, fits, withoutLength: () => cheapestWithoutLength(family) }));
  } else if (feasible === true && sizes.kind === 'interval' && (distinct || lo > 1) && (includeAll || !out.some((c) => c.fits && planCostNs(c) <= IMPLICIT_LENGTH_CONSIDERED_ABOVE_NS))) {
    // Few parts fit (large minPart, or distinct parts) and no method above fits, or none cheaply: the family is the
    // union over k <= mostParts of boxes, which the length branch samples too (plan-length.ts).
    out.push(...implicitLengthCandidates({ spec, shape, feasible, fits, withoutLength: () => null }));
  }
  if (!hasLength && feasible === true && distinct && sizes.kind === 'interval' && (includeAll || !out.some((c) => c.fits)) && NarrowRangeMixture.applies(n, sizes.lo, sizes.hi, true)) {
    // Distinct parts in a narrow range of large sizes where nothing above fits (the families served
    // before keep their method): the same union of boxes through the staircase (narrow-range-mixture.ts;
    // as fast as box-mixture within 1.5x where both fit, n = 1e6-1e8, parts in [2.69, 3.74] sqrt(n)).
    const sampler = NarrowRangeMixture.within(n, sizes.lo, sizes.hi, TABLE_CELL_LIMIT, true);
    if (sampler !== null) prepared(sampler, true);
  }
  return out;
}

/** The cheapest fitting method for the family with its length constraint dropped (for length filters). */
function cheapestWithoutLength(family: PartitionFamily): PlanCandidate | null {
  const { length: _length, maxLength: _maxLength, ...rest } = family;
  const fitting = planCandidates(rest).filter((c) => c.fits);
  return fitting.length === 0 ? null : fitting.reduce((a, b) => (planCostNs(b) < planCostNs(a) ? b : a));
}

/**
 * Mean length and number of distinct sizes, from the Boltzmann tilt of the family without its
 * length constraint (exact as n grows; an estimate at small n), then the length constraint.
 */
function estimateShape(
  spec: ConstrainedSpec,
  solve: (sizes: ConstrainedSpec['sizes'], n: number, distinct: boolean) => number = solveTilt,
): { expectedLength: number; expectedDistinct: number; tilt?: number } {
  let length = 1;
  let distinctSizes = 1;
  let tilt: number | undefined;
  if (sizeCount(spec.sizes) > 1 && spec.n > 0) {
    tilt = solve(spec.sizes, spec.n, spec.distinct);
    const moments = tiltMoments(spec.sizes, tilt, spec.distinct);
    length = moments.parts;
    distinctSizes = moments.distinctSizes;
  }
  if (spec.length !== undefined) length = spec.length;
  if (spec.maxLength !== undefined) length = Math.min(length, spec.maxLength);
  return { expectedLength: length, expectedDistinct: Math.min(length, distinctSizes), tilt };
}
