import { LimitExceededError } from '../core/errors.js';
import { SampleStreams, SEED_PATTERN } from '../core/seeding.js';
import type { RandomSource } from '../core/random.js';
import { MAX_INDEX } from '../schemas/bounds.js';
import { samplingFields } from '../schemas/common.js';
import { familyError, invalidParam, parseParam } from './validate.js';

/**
 * A family of partitions or compositions of one n, as the library hands it out: exact count,
 * seeded uniform samples (the same as the API's, sample for sample), and membership. The
 * fast-check arbitraries (partsmith/fast-check) are written against this interface only.
 */
export interface SampledFamily<Member> {
  readonly kind: string;
  readonly n: number;
  /** The family in canonical form, as the API echoes it in `family` (absent fields and the default minPart dropped). */
  readonly description: Readonly<{ kind: string; n: number }>;
  /** The canonical family key (JSON of the description): part of every sample's random stream. */
  readonly key: string;
  /** The sampler the planner chose, with its version, as the API reports it in `method`. */
  readonly method: string;
  /** The exact number of members (0n for an empty family). PartsmithError (422) past the counting limits. */
  readonly count: bigint;
  /** Whether the family has no member, as the planner decides it (no counting); PartsmithError (422) when it cannot plan for a limit. */
  readonly empty: boolean;
  /** Sample `index` of `seed`: the same member as sample `index` of the API for this family and seed. */
  sample(seed: string, index?: number): Member;
  /** Samples start, start + 1, ... of `seed` (count of them; without count, until the iterator is dropped). */
  samples(seed: string, start?: number, count?: number): IterableIterator<Member>;
  /** Whether `value` is a member, written as the library writes members. */
  contains(value: unknown): boolean;
  /** The family with the same constraints at another n (checked like n itself). */
  resize(n: number): SampledFamily<Member>;
}

/** What the library needs of a planned core sampler. */
export interface PlannedSampler<Raw> {
  readonly method: string;
  sample(source: RandomSource): Raw;
}

/** The family parameters of a validated query (the API's count endpoint query: n and constraints). */
export type FamilyQuery = Readonly<Record<string, unknown>> & { readonly n: number };

/** The family parameters of a parsed query, in the order given. */
export function pickParams(query: FamilyQuery, params: readonly string[]): FamilyQuery {
  const picked: Record<string, unknown> = {};
  for (const param of params) if (query[param] !== undefined) picked[param] = query[param];
  return picked as FamilyQuery;
}

/**
 * The shared machinery of the library's families: the canonical key and its random streams, the
 * sampler planned once (on first use, so an empty family can still be counted), the count
 * computed once, and the checks of seed and index. Subclasses say how the core describes,
 * plans, counts and writes their members.
 *
 * Also what the HTTP layer serves from (`sampler`, `streams`, `description`): one family object
 * per family key, cached by the app.
 */
export abstract class FamilyBase<Member, Raw, S extends PlannedSampler<Raw>> implements SampledFamily<Member> {
  readonly key: string;
  readonly streams: SampleStreams;
  private planned: S | undefined;
  private planError: unknown;
  private planFoundEmpty = false;
  private counted: bigint | undefined;
  private checkedSeed: string | undefined;

  protected constructor(
    readonly description: Readonly<{ kind: string; n: number }>,
    /** The validated query the family came from (for error messages: which parameters were given). */
    protected readonly query: FamilyQuery,
  ) {
    this.key = JSON.stringify(description); // = familyKey(description): the description is canonical
    this.streams = new SampleStreams(this.key);
  }

  abstract readonly kind: string;
  /** The API endpoint answering the same request as a sample (for error URLs). */
  protected abstract readonly samplesPath: string;
  /** The API endpoint answering the same request as `count`. */
  protected abstract readonly countPath: string;
  /** The family parameters an empty-family error names. */
  protected abstract readonly familyParams: readonly string[];
  protected abstract plan(): S;
  protected abstract countMembers(): bigint;
  protected abstract member(raw: Raw): Member;
  abstract contains(value: unknown): boolean;
  abstract resize(n: number): SampledFamily<Member>;

  get n(): number {
    return this.description.n;
  }

  /** The planned sampler (planned once; PartsmithError when the family is empty or over a limit). */
  get sampler(): S {
    if (this.planned !== undefined) return this.planned;
    if (this.planError !== undefined) throw this.planError;
    try {
      this.planned = this.plan();
      return this.planned;
    } catch (error) {
      // Planning depends on the family only, so a refusal is remembered like a plan.
      this.planFoundEmpty = error instanceof RangeError && !(error instanceof LimitExceededError);
      this.planError = familyError(error, this.query, this.familyParams, this.samplesPath);
      throw this.planError;
    }
  }

  get empty(): boolean {
    try {
      return this.sampler === undefined;
    } catch (error) {
      if (this.planFoundEmpty) return true;
      throw error;
    }
  }

  get method(): string {
    return this.sampler.method;
  }

  get count(): bigint {
    if (this.counted === undefined) {
      try {
        this.counted = this.countMembers();
      } catch (error) {
        throw familyError(error, this.query, this.familyParams, this.countPath);
      }
    }
    return this.counted;
  }

  sample(seed: string, index = 0): Member {
    if (seed !== this.checkedSeed) this.checkSeed(seed);
    if (!isIndex(index)) index = parseParam(samplingFields.start, index, 'index', this.samplesPath);
    return this.draw(seed, index);
  }

  *samples(seed: string, start = 0, count = Infinity): IterableIterator<Member> {
    this.checkSeed(seed);
    if (!isIndex(start)) start = parseParam(samplingFields.start, start, 'start', this.samplesPath);
    const end = count === Infinity ? MAX_INDEX + 1 : start + checkedCount(count, start, this.samplesPath);
    for (let i = start; i < end; i++) yield this.draw(seed, i);
  }

  private draw(seed: string, index: number): Member {
    try {
      return this.member(this.sampler.sample(this.streams.source(seed, index)));
    } catch (error) {
      throw familyError(error, this.query, this.familyParams, this.samplesPath);
    }
  }

  /** The seed checked by the API's seed field (SEED_PATTERN); the last good seed is remembered, as most callers keep one. */
  private checkSeed(seed: string): void {
    if (typeof seed !== 'string' || !SEED_PATTERN.test(seed)) parseParam(samplingFields.seed.unwrap(), seed, 'seed', this.samplesPath);
    this.checkedSeed = seed;
  }
}

/**
 * What the API's start field accepts as a number (a whole number from 0 to MAX_INDEX), checked
 * without a schema call on the hot path; anything else goes to the field itself, which either
 * refuses it with the API's message or reads it (a string of digits) as the API would.
 */
function isIndex(value: unknown): value is number {
  return typeof value === 'number' && Number.isInteger(value) && value >= 0 && value <= MAX_INDEX;
}

/** The library's own parameter (the API's count is bounded by the server's response limits instead). */
function checkedCount(count: unknown, start: number, path: string): number {
  if (typeof count === 'number' && Number.isInteger(count) && count >= 0 && start + count - 1 <= MAX_INDEX) return count;
  throw invalidParam('count', `must be a whole number >= 0 (or Infinity) with start + count - 1 <= ${MAX_INDEX}`, path, count);
}
