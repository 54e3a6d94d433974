import { LimitExceededError } from '../errors.js';
import type { SetPartitionFamily } from '../family.js';
import { countBitsBound, MAX_COUNT_WORK } from './counts.js';
import { equalBlocksSampler } from './equal-blocks.js';
import { logPoissonPmf, poissonMode } from './log-poisson.js';
import { poissonSizesSampler } from './poisson-sizes.js';
import { poissonUrnsSampler } from './poisson-urns.js';
import { assertNotEmpty, blockRange, isFree, resolveSetPartitions, type ResolvedSetPartitions } from './resolve.js';
import type { SetPartitionSampler } from './sampler.js';
import type { SizeLaw } from './size-law.js';
import { stamSampler } from './stam.js';
import { tableSampler } from './table-sampler.js';
import { tiltForMeanSize, tiltForTotal } from './tilt.js';
import { sizeLaw } from './size-law.js';
import { uniformMapsSampler } from './uniform-maps.js';

/**
 * The planner for set partitions: lists the exact methods that apply to a family, estimates each
 * one's cost as setup + NOMINAL_SAMPLES × expected work per sample, and builds the cheapest that
 * fits the limits. The choice depends on the family only, so sample i stays a function of
 * (seed, i, family, ALGORITHM_VERSION).
 *
 *  - stam/1           every set partition of n (no constraint): Stam's urn mixture, ~2n steps;
 *  - equal-blocks/1   constraints that force one number of blocks k and every block to n/k
 *                     items: a shuffle of the labels (~n steps; none when k = 1 or k = n);
 *  - table/1          any constraints, while the exact counting table is small
 *                     (<= TABLE_BITS_LIMIT bits, <= MAX_COUNT_WORK word operations to build);
 *  - uniform-maps/1   exactly k blocks: uniform throws into k urns, kept when every urn's size
 *                     fits (cost ~ n × trials; trials ~ 1 once n >> k·ln k without size bounds);
 *  - poisson-urns/1   any constraints: block sizes as independent truncated Poisson variables,
 *                     the blocks labelled urns, exact by rejection (cost ~ blocks × trials);
 *  - poisson-sizes/1  no exact number of blocks: Poisson numbers of blocks of each size
 *                     (cost ~ allowed sizes × trials).
 * A family whose cheapest method needs more than SAMPLE_WORK_LIMIT steps per sample is refused
 * (LimitExceededError naming the limit); so are tables past their limits, when nothing else
 * applies. Empty families throw EmptyFamilyError, contradictions ContradictoryConstraintError.
 */
export const TABLE_BITS_LIMIT = 2 ** 27;
export const SAMPLE_WORK_LIMIT = 1e8;
export const NOMINAL_SAMPLES = 100;

export type SetPartitionMethod = 'stam' | 'equal-blocks' | 'table' | 'uniform-maps' | 'poisson-urns' | 'poisson-sizes';

export interface SetPartitionPlanOptions {
  /** Force a method by name without version (tests and benchmarks). */
  readonly method?: SetPartitionMethod;
}

export interface SetPartitionCandidate {
  readonly method: string;
  readonly setupWork: number;
  readonly sampleWork: number;
  readonly fits: boolean;
  readonly build: () => SetPartitionSampler;
}

export function planSetPartitionSampler(family: SetPartitionFamily, options: SetPartitionPlanOptions = {}): SetPartitionSampler {
  const candidates = setPartitionCandidates(family);
  if (options.method !== undefined) {
    const forced = candidates.find((c) => c.method.split('/')[0] === options.method);
    if (!forced) throw new RangeError(`method ${options.method} does not apply to this family (applicable: ${candidates.map((c) => c.method).join(', ')})`);
    return forced.build();
  }
  const fitting = candidates.filter((c) => c.fits);
  if (fitting.length === 0) {
    const least = candidates.reduce((x, y) => (cost(y) < cost(x) ? y : x));
    throw new LimitExceededError(
      `no exact method samples this family within the limits (tables <= ${TABLE_BITS_LIMIT / 8 / 2 ** 20} MiB, <= ${SAMPLE_WORK_LIMIT.toExponential(0)} steps per sample); ` +
        `the cheapest, ${least.method}, needs about ${least.sampleWork.toExponential(1)} steps per sample. Fewer items, fewer blocks or wider block-size bounds fit`,
      `work per sample <= ${SAMPLE_WORK_LIMIT.toExponential(0)}`,
    );
  }
  return fitting.reduce((x, y) => (cost(y) < cost(x) ? y : x)).build();
}

function cost(c: SetPartitionCandidate): number {
  return c.setupWork + NOMINAL_SAMPLES * c.sampleWork;
}

/** The applicable methods with their estimated costs (RangeError for contradictions, EmptyFamilyError for empty families). */
export function setPartitionCandidates(family: SetPartitionFamily): SetPartitionCandidate[] {
  const resolved = resolveSetPartitions(family);
  assertNotEmpty(resolved);
  const { n } = resolved;
  if (n === 0) {
    const empty: SetPartitionSampler = { method: 'trivial/1', expectedLength: 0, expectedBlocks: 0, expectedWork: 1, sample: () => ({ rgs: new Int32Array(0), blocks: 0 }) };
    return [{ method: 'trivial/1', setupWork: 0, sampleWork: 1, fits: true, build: () => empty }];
  }
  const out: SetPartitionCandidate[] = [];
  if (isFree(resolved)) {
    const work = 2 * n + 20;
    out.push({ method: 'stam/1', setupWork: 100, sampleWork: work, fits: work <= SAMPLE_WORK_LIMIT, build: () => stamSampler(n) });
  }
  const forced = forcedEqualBlocks(resolved);
  if (forced !== null) {
    const sampler = equalBlocksSampler(n, forced);
    out.push({ method: 'equal-blocks/1', setupWork: 0, sampleWork: sampler.expectedWork, fits: true, build: () => sampler });
  }
  out.push(tableCandidate(resolved));
  if (resolved.fixed) out.push(uniformMapsCandidate(resolved), fixedUrnsCandidate(resolved));
  else out.push(...freeBoltzmannCandidates(resolved));
  return out;
}

/**
 * The number of blocks k when the constraints force every block to n/k items (one k fits, and
 * k·minSize = n or k·maxSize = n), else null.
 */
export function forcedEqualBlocks(resolved: ResolvedSetPartitions): number | null {
  const { lo, hi } = blockRange(resolved);
  if (lo !== hi || lo < 1) return null;
  return lo * resolved.minSize === resolved.n || lo * resolved.maxSize === resolved.n ? lo : null;
}

function tableCandidate(resolved: ResolvedSetPartitions): SetPartitionCandidate {
  const { n, minSize: a, maxSize: b } = resolved;
  const { hi } = blockRange(resolved);
  const anyCount = !resolved.fixed && hi >= Math.floor(n / a);
  const bits = countBitsBound(resolved);
  const words = bits / 32 + 1;
  const width = Math.min(b, n) - a + 1;
  const cells = anyCount ? n + 1 : (n + 1) * (hi + 1);
  // Building: the free recurrence costs a Pascal row and `width` products per item; the block
  // table three products per cell.
  const setupWork = anyCount ? n * (2 * width + Math.min(b, n) / 2) * words : cells * words * 4;
  const tableBits = (cells * bits) / 2 + (anyCount ? Math.min(b, n) * n : 0);
  const blocks = Math.max(1, Math.min(hi, n / Math.max(a, Math.min(b, Math.log(n + 1)))));
  const sampleWork = 2 * n + blocks * (1 + words) * (1 + Math.min(width, n / blocks));
  const fits = tableBits <= TABLE_BITS_LIMIT && setupWork <= MAX_COUNT_WORK && sampleWork <= SAMPLE_WORK_LIMIT;
  return { method: 'table/1', setupWork, sampleWork, fits, build: () => tableSampler(resolved, { cells, bits }) };
}

/**
 * The density of a sum of `count` sizes (mean m, variance v each) at n, by the local limit
 * theorem: ~ exp(−(n − count·m)²/(2·count·v)) / sqrt(2π·count·v). For estimates only.
 */
function sumDensity(n: number, count: number, m: number, v: number): number {
  const spread = count * v;
  if (spread < 0.05) return Math.abs(n - count * m) < 0.5 ? 1 : 0;
  return Math.min(1, Math.exp(-((n - count * m) ** 2) / (2 * spread)) / Math.sqrt(2 * Math.PI * spread));
}

/**
 * Rejection from uniform maps keeps a throw when all k urn sizes are in [a, b]. Urn sizes of a
 * uniform throw are independent Poisson(n/k) variables conditioned on their sum n, so
 * P(kept) = q^k · P(sum of k Poisson(n/k) truncated to [a, b] = n) / P(Poisson(n) = n), q the
 * mass of [a, b] under Poisson(n/k) (estimated with the local limit theorem).
 */
function uniformMapsCandidate(resolved: ResolvedSetPartitions): SetPartitionCandidate {
  const { n, kMin: k, minSize: a, maxSize: b } = resolved;
  const lambda = n / k;
  const truncated = sizeLaw(Math.log(lambda), a, b);
  const logQ = truncated.logBlockGf - lambda;
  const logKept = k * logQ + Math.log(Math.max(sumDensity(n, k, truncated.law.mean, truncated.law.variance), 1e-300)) - logPoissonPmf(n, n);
  const trials = Math.max(1, Math.exp(-Math.min(0, logKept)));
  const sampleWork = Math.min(trials, 1e300) * (n + k) + n;
  return {
    method: 'uniform-maps/1',
    setupWork: 20 * truncated.law.pmf.length,
    sampleWork,
    fits: k <= 2 ** 31 && sampleWork <= SAMPLE_WORK_LIMIT,
    build: () => uniformMapsSampler(n, k, a, b, trials),
  };
}

function fixedUrnsCandidate(resolved: ResolvedSetPartitions): SetPartitionCandidate {
  const { n, kMin: k, minSize: a, maxSize: b } = resolved;
  // The tilt is solved here (a few table builds), the sampler's setup.
  const sizes = tiltForMeanSize(n / k, a, b);
  const { law } = sizes;
  const acceptance = k === 1 ? law.probability(n) / law.pmax : Math.min(1, sumDensity(n, k, law.mean, law.variance) / law.pmax);
  const trials = 1 / Math.max(acceptance, 1e-300);
  const sampler = () => poissonUrnsSampler({ n, sizes, blocks: k, expectedTrials: trials, expectedBlocks: k });
  const sampleWork = trials * (2 + k * (1 + Math.log2(law.pmf.length + 1) / 4)) + 3 * n;
  return { method: 'poisson-urns/1', setupWork: 50 * law.pmf.length, sampleWork, fits: sampleWork <= SAMPLE_WORK_LIMIT, build: sampler };
}

export interface FreeTuning {
  readonly sizes: SizeLaw;
  readonly logY: number;
  /** Expected blocks of the model (the Poisson mean y·G). */
  readonly mean: number;
  /**
   * P(the model's size is n, and its k <= K blocks pass the y^(K−k) step): what both
   * Boltzmann methods keep, before dividing by their own largest probability.
   */
  readonly keptMass: number;
}

/**
 * Parameters of the free Boltzmann model: x with E[size] = n at y = 1; when that model's number
 * of blocks would pass maxBlocks = K, x with mean block size n/K and y = K/G(x) instead (then
 * k < K is kept with probability y^(K−k), which can be tiny: the family is then mostly k = K).
 */
export function freeTuning(resolved: ResolvedSetPartitions): FreeTuning {
  const { n, minSize: a, maxSize: b } = resolved;
  const K = blockRange(resolved).hi;
  const free = tiltForTotal(n, a, b);
  const freeMean = Math.exp(free.logBlockGf);
  let sizes = free;
  let logY = 0;
  if (K < Math.floor(n / a) && K < freeMean) {
    sizes = tiltForMeanSize(n / K, a, b);
    logY = Math.min(0, Math.log(K) - sizes.logBlockGf);
  }
  const mean = Math.exp(logY + sizes.logBlockGf);
  // Sum over the likely numbers of blocks k ~ Poisson(mean): P(k)·P(sum of k sizes = n)·y^(K−k).
  const { mean: m, variance: v } = sizes.law;
  const spread = 12 * Math.sqrt(mean) + 12;
  let keptMass = 0;
  for (let k = Math.max(1, Math.floor(mean - spread)); k <= Math.min(K, Math.ceil(mean + spread)); k++) {
    keptMass += Math.exp(logPoissonPmf(k, mean) + logY * (K - k)) * sumDensity(n, k, m, v);
  }
  return { sizes, logY, mean, keptMass: Math.max(keptMass, 1e-300) };
}

function freeBoltzmannCandidates(resolved: ResolvedSetPartitions): SetPartitionCandidate[] {
  const { n, minSize, maxSize } = resolved;
  const { hi: K } = blockRange(resolved);
  const tuning = freeTuning(resolved);
  const { sizes, logY, mean, keptMass } = tuning;
  const law = sizes.law;
  const expectedBlocks = Math.min(mean, K);
  const maxBlocks = K < n ? K : undefined;
  const setupWork = 50 * law.pmf.length;

  const urnsTrials = Math.max(1, law.pmax / keptMass);
  const urnsWork = urnsTrials * (2 + mean * (1 + Math.log2(law.pmf.length + 1) / 4)) + 3 * n;
  const urns: SetPartitionCandidate = {
    method: 'poisson-urns/1',
    setupWork,
    sampleWork: urnsWork,
    fits: urnsWork <= SAMPLE_WORK_LIMIT,
    build: () => poissonUrnsSampler({ n, sizes, maxBlocks, logY, expectedTrials: urnsTrials, expectedBlocks }),
  };

  // The most frequent size has mean y·G·pmax blocks; its count's largest probability bounds the acceptance.
  const top = Math.exp(poissonMode(mean * law.pmax).logPmf);
  const sizesTrials = Math.max(1, top / keptMass);
  const width = law.pmf.length + 2;
  const sizesWork = sizesTrials * (2 + 2 * width) + 3 * n;
  const bySize: SetPartitionCandidate = {
    method: 'poisson-sizes/1',
    setupWork: setupWork + 20 * width,
    sampleWork: sizesWork,
    fits: sizesWork <= SAMPLE_WORK_LIMIT,
    build: () => poissonSizesSampler({ n, sizes, minSize, maxSize, maxBlocks, logY, expectedTrials: sizesTrials, expectedBlocks }),
  };
  return [urns, bySize];
}
