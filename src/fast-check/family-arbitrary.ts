import { Arbitrary, Stream, toStringMethod, Value, type Random } from 'fast-check';
import type { SampledFamily } from '../library/sampled-family.js';
import { invalidParam } from '../library/validate.js';

/** How a kind of member shrinks and where its corners are (partitions, compositions: lists of parts; set partitions: lists of blocks). */
export interface MemberShape<M extends object = number[]> {
  /** Candidate simplifications of a member, most aggressive first (any may fall outside the family). */
  shrinks(member: M): Iterable<M>;
  /** Whether a is strictly simpler than b (a well-founded order: see simplicity.ts). */
  simpler(a: M, b: M): boolean;
  /** The n of a member (the sum of its parts; the number of items of a set partition); anything but a whole number for a value that is not one. */
  sizeOf(member: M): number;
  /** Corner candidates of a family (any may fall outside it). */
  corners(family: SampledFamily<M>): M[];
}

/** How n is drawn when it ranges: every n equally likely, or in proportion to its number of members. */
export type NWeights = 'uniform' | 'count';

export interface ArbitraryOptions {
  /**
   * The partsmith seed of the samples (default "fast-check"). fast-check's own random generator
   * picks the sample index, so fast-check's seed and path replay a run, and a counterexample
   * names the (seed, index) that gives it from the API, the CLI or `family.sample`.
   */
  readonly seed?: string;
  /**
   * With a range of n: "uniform" (default) draws each n of the range whose family has members
   * equally often; "count" draws n with probability count(n) / (sum of the counts), so every
   * member of the union of the families is equally likely (the counts are computed once, on the
   * first draw; a range of at most MAX_WEIGHTED_SIZES values of n, each within partsmith's
   * counting limits, or the arbitrary refuses with the limit's message).
   */
  readonly nWeights?: NWeights;
  /**
   * Opt-in corners (corners.ts): with `true`, one value in four is a corner member of the drawn
   * family instead of a uniform sample (a number from 0 to 1 sets that share). Not uniform.
   */
  readonly edgeCases?: boolean | number;
}

/** The most values of n a range may span with nWeights: "count". */
export const MAX_WEIGHTED_SIZES = 1000;
/** Families kept per arbitrary (one per n drawn), oldest dropped first. */
const CACHED_SIZES = 512;
/** Tries of a uniform n before listing the n whose family has members (rejection, then an exact list). */
const UNIFORM_TRIES = 64;
/** The most values of n listed when rejection has not found a family with members. */
const MAX_LISTED_SIZES = 100_000;
/** Share of corner members with `edgeCases: true`. */
const DEFAULT_EDGE_SHARE = 0.25;
const DEFAULT_SEED = 'fast-check';
const OPTIONS_PATH = 'partsmith/fast-check';

interface Origin {
  /** What the first value of the chain was: a sample (seed, index) or a corner. */
  readonly text: string;
  readonly shrunk: boolean;
}

/**
 * A fast-check arbitrary over the members of a family of partsmith, with n fixed or in a range.
 *
 * Generation: n is drawn (nWeights), then sample `index` of `seed` of that family, with the
 * index drawn by fast-check's generator: within each n exactly the distribution of
 * `family.sample`, uniform over the family. Shrinking (`shrink`) proposes only members: each
 * candidate is checked to be strictly simpler (MemberShape.simpler) and a member of the family
 * of its own n, with n in the range — so shrinking stays inside the family, never ends on a
 * non-member, and always terminates.
 */
export class FamilyArbitrary<M extends object = number[]> extends Arbitrary<M> {
  private readonly families = new Map<number, SampledFamily<M>>();
  private readonly cornersByN = new Map<number, M[]>();
  private readonly seed: string;
  private readonly weights: NWeights;
  private readonly edgeShare: number;
  private cumulative: bigint[] | undefined;
  private nonEmpty: number[] | undefined;

  constructor(
    private readonly base: SampledFamily<M>,
    private readonly min: number,
    private readonly max: number,
    private readonly shape: MemberShape<M>,
    options: ArbitraryOptions = {},
  ) {
    super();
    this.families.set(base.n, base);
    this.seed = options.seed ?? DEFAULT_SEED;
    // The seed is checked as the API checks it (SEED_PATTERN), by drawing nothing.
    base.samples(this.seed, 0, 0).next();
    this.weights = options.nWeights ?? 'uniform';
    if (this.weights !== 'uniform' && this.weights !== 'count') throw invalidParam('nWeights', 'must be one of: uniform, count', OPTIONS_PATH, options.nWeights);
    if (this.weights === 'count' && max - min + 1 > MAX_WEIGHTED_SIZES) {
      throw invalidParam('nWeights', `"count" needs the count of every n in the range: at most ${MAX_WEIGHTED_SIZES} values of n (got ${max - min + 1}); use "uniform" or a narrower range`, OPTIONS_PATH, options.nWeights);
    }
    const edge = options.edgeCases ?? false;
    this.edgeShare = edge === true ? DEFAULT_EDGE_SHARE : edge === false ? 0 : edge;
    if (!(this.edgeShare >= 0 && this.edgeShare <= 1)) throw invalidParam('edgeCases', 'must be true, false or a share from 0 to 1', OPTIONS_PATH, edge);
    if (min === max && base.empty) base.sample(this.seed); // refused with the library's (the API's) error for an empty family
  }

  generate(mrng: Random): Value<M> {
    const n = this.drawN(mrng);
    const family = this.at(n);
    if (this.edgeShare > 0 && mrng.nextDouble() < this.edgeShare) {
      const corners = this.cornersAt(n);
      if (corners.length > 0) {
        const which = mrng.nextInt(0, corners.length - 1);
        const origin: Origin = { text: `corner ${which} of ${family.key}`, shrunk: false };
        return this.value(structuredClone(corners[which]), family, origin);
      }
    }
    // Sample indices up to 2^48 (the API accepts up to 10^15).
    const index = mrng.nextInt(0, 2 ** 24 - 1) * 2 ** 24 + mrng.nextInt(0, 2 ** 24 - 1);
    const origin: Origin = { text: `sample ${index} of seed ${JSON.stringify(this.seed)} of ${family.key}`, shrunk: false };
    return this.value(family.sample(this.seed, index), family, origin);
  }

  canShrinkWithoutContext(value: unknown): value is M {
    if (!Array.isArray(value)) return false;
    const n = this.shape.sizeOf(value as M);
    return Number.isSafeInteger(n) && n >= this.min && n <= this.max && this.at(n).contains(value);
  }

  shrink(value: M, context: unknown): Stream<Value<M>> {
    const origin: Origin = { text: (context as Origin | undefined)?.text ?? 'a value given to fast-check', shrunk: true };
    return new Stream(this.candidates(value, origin));
  }

  private *candidates(value: M, origin: Origin): Generator<Value<M>> {
    const seen = new Set<string>();
    for (const candidate of this.shape.shrinks(value)) {
      if (!this.shape.simpler(candidate, value)) continue;
      const n = this.shape.sizeOf(candidate);
      if (n < this.min || n > this.max) continue;
      const key = JSON.stringify(candidate);
      if (seen.has(key)) continue;
      seen.add(key);
      const family = this.at(n);
      if (family.contains(candidate)) yield this.value(candidate, family, origin);
    }
  }

  /** The value with its story attached for fast-check's report (a non-enumerable toString method). */
  private value(member: M, family: SampledFamily<M>, origin: Origin): Value<M> {
    Object.defineProperty(member, toStringMethod, {
      value: () => `${JSON.stringify(member)} /* ${describeMember(member, family, origin)} */`,
      enumerable: false,
    });
    return new Value(member, origin);
  }

  /** The family of n (same constraints), made once per n. */
  private at(n: number): SampledFamily<M> {
    let family = this.families.get(n);
    if (family === undefined) {
      if (this.families.size >= CACHED_SIZES) this.families.delete(this.families.keys().next().value!);
      family = this.base.resize(n);
      this.families.set(n, family);
    }
    return family;
  }

  private cornersAt(n: number): M[] {
    let corners = this.cornersByN.get(n);
    if (corners === undefined) {
      const family = this.at(n);
      const seen = new Set<string>();
      corners = this.shape.corners(family).filter((c) => {
        const key = JSON.stringify(c);
        if (seen.has(key) || !family.contains(c)) return false;
        seen.add(key);
        return true;
      });
      if (this.cornersByN.size >= CACHED_SIZES) this.cornersByN.clear();
      this.cornersByN.set(n, corners);
    }
    return corners;
  }

  private drawN(mrng: Random): number {
    if (this.min === this.max) return this.min;
    if (this.weights === 'count') return this.drawWeighted(mrng);
    // Uniform over the n whose family has members: rejection (each try uniform over the range),
    // then, if that found none, a uniform pick from the exact list; both give the same law.
    for (let t = 0; t < UNIFORM_TRIES; t++) {
      const n = mrng.nextInt(this.min, this.max);
      if (!this.at(n).empty) return n;
    }
    const listed = this.listNonEmpty();
    return listed[mrng.nextInt(0, listed.length - 1)];
  }

  private listNonEmpty(): number[] {
    if (this.nonEmpty === undefined) {
      if (this.max - this.min + 1 > MAX_LISTED_SIZES) {
        throw new RangeError(`no family with members found in ${UNIFORM_TRIES} draws of n from ${this.min} to ${this.max}, and the range is too wide to list (at most ${MAX_LISTED_SIZES} values of n)`);
      }
      const listed: number[] = [];
      for (let n = this.min; n <= this.max; n++) if (!this.at(n).empty) listed.push(n);
      if (listed.length === 0) this.base.sample(this.seed); // every family empty: the library's error for the first
      this.nonEmpty = listed;
    }
    return this.nonEmpty;
  }

  /** n with probability count(n) / total: a uniform BigInt below the total, found in the running sums. */
  private drawWeighted(mrng: Random): number {
    if (this.cumulative === undefined) {
      const sums: bigint[] = [];
      let total = 0n;
      for (let n = this.min; n <= this.max; n++) sums.push((total += this.at(n).count));
      if (total === 0n) this.base.sample(this.seed); // every family empty: the library's error
      this.cumulative = sums;
    }
    const sums = this.cumulative;
    const r = mrng.nextBigInt(0n, sums[sums.length - 1] - 1n);
    let lo = 0;
    let hi = sums.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (sums[mid] > r) hi = mid;
      else lo = mid + 1;
    }
    return this.min + lo;
  }
}

/**
 * "partition of 6 (rank 2 of {...}); shrunk from sample 123 of seed "fast-check" of {...}": the
 * member's rank in its own family where the family is rankable (a RankedFamily within the
 * ranking limits; the table is built when the report is written, not while testing).
 */
function describeMember<M>(member: M, family: SampledFamily<M>, origin: Origin): string {
  const ranked = family as SampledFamily<M> & { rank?: (m: M) => bigint };
  let rank = '';
  if (typeof ranked.rank === 'function') {
    try {
      rank = ` (rank ${ranked.rank(member)} of ${family.key})`;
    } catch {
      // past the ranking limits: no rank to show
    }
  }
  const what = family.kind === 'set-partition' ? `set partition of ${family.n} items` : `${family.kind} of ${family.n}`;
  return `${what}${rank}; ${origin.shrunk ? 'shrunk from ' : ''}${origin.text}`;
}
