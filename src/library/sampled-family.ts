import type { z } from 'zod';
import { LimitExceededError } from '../core/errors.js';
import type { Ranker } from '../core/ranks/ranker.js';
import { SampleStreams, SEED_PATTERN } from '../core/seeding.js';
import type { RandomSource } from '../core/random.js';
import { MAX_INDEX } from '../schemas/bounds.js';
import { samplingFields } from '../schemas/common.js';
import { rankValueFields } from '../schemas/rank-values.js';
import { notAMemberProblem, rankProblem } from './problems.js';
import { familyError, invalidParam, parseParam, partsmithError } from './validate.js';

/**
 * A family of partitions or compositions of one n, or of set partitions of n items, as the
 * library hands it out: exact count, seeded uniform samples (the same as the API's, sample for
 * sample), and membership. The fast-check arbitraries (partsmith/fast-check) are written
 * against this interface only (and show a rank when the family is a RankedFamily).
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

/**
 * A family whose members have ranks: positions 0 ... count - 1 in the family's documented order
 * (the order of GET /v1/.../list), as BigInts. The same answers and refusals as the API's
 * list, rank and unrank endpoints for the family.
 */
export interface RankedFamily<Member> extends SampledFamily<Member> {
  /** The member's rank (PartsmithError 422 naming the API's member parameter when it is not a member). */
  rank(member: Member): bigint;
  /** The member at `rank` (a BigInt, or a whole number or decimal string); PartsmithError past the end. */
  unrank(rank: bigint | string | number): Member;
  /** The members from rank `start` on (default 0), `count` of them or to the end, one at a time. */
  list(start?: bigint | string | number, count?: number): IterableIterator<Member>;
  resize(n: number): RankedFamily<Member>;
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

/** A family's ranker with its table's estimated bytes (for the HTTP layer's cache budget). */
export interface RankTable {
  readonly ranker: Ranker;
  readonly bytes: number;
}

/**
 * What differs between kinds of family (partitions, compositions, set partitions): the API
 * endpoints answering the same requests, the schema field of n, and how the core describes,
 * plans, counts, ranks and writes the members. One object per kind.
 */
export interface FamilyKind<D extends { readonly kind: string; readonly n: number }, Raw, S extends PlannedSampler<Raw>, M = number[]> {
  readonly kind: D['kind'];
  /** The API endpoint answering the same request as a sample (for error URLs); its /list, /rank and /unrank answer the rank calls. */
  readonly samplesPath: string;
  /** The API endpoint answering the same request as `count`. */
  readonly countPath: string;
  /** The family parameters of its count endpoint's query (named by an empty-family error). */
  readonly params: readonly string[];
  /** The schema field that checks n (for resize). */
  readonly nField: z.ZodType<number>;
  /** The family a validated query describes, canonical (absent fields and defaults dropped); a core RangeError for contradictions. */
  describe(query: FamilyQuery): D;
  plan(description: D): S;
  count(description: D): bigint;
  /** A sample as the library writes members. */
  member(raw: Raw): M;
  contains(description: D, value: unknown): boolean;
  /** The member parameter of the API's rank endpoint (`parts`, `rgs`): what a refused rank names. */
  readonly memberParam: string;
  rankTable(description: D): RankTable;
  /** A member (as the library writes it, or in the rank endpoint's form) as the ranker takes it; NotAMemberError when it cannot be one. */
  toRanked(value: unknown): readonly number[];
  /** A member as the ranker gives it, written as the library writes members. */
  fromRanked(ranked: number[]): M;
}

/**
 * A family of the library: the canonical key and its random streams, the sampler planned once
 * (on first use, so an empty family can still be counted), the count computed once, the ranker
 * (with its counting table) built once, and the checks of seed, index and ranks; its kind says
 * the rest.
 *
 * Also what the HTTP layer serves from (`sampler`, `streams`, `ranker`, `description`, and the
 * checks): one family object per family key, cached by the app.
 */
export class LibraryFamily<D extends { readonly kind: string; readonly n: number }, Raw, S extends PlannedSampler<Raw>, M = number[]> implements RankedFamily<M> {
  readonly description: D;
  readonly key: string;
  private hashedStreams: SampleStreams | undefined;
  /** The family parameters of the query it came from (for error messages: which were given). */
  private readonly query: FamilyQuery;
  private planned: S | undefined;
  private planError: unknown;
  private planFoundEmpty = false;
  private counted: bigint | undefined;
  private checkedSeed: string | undefined;
  private ranked: RankTable | undefined;
  private rankError: unknown;

  /** From a query its kind's count endpoint schema has accepted, or a sampling or rank endpoint's (only the family fields are kept). */
  constructor(
    private readonly type: FamilyKind<D, Raw, S, M>,
    query: FamilyQuery,
  ) {
    this.query = pickParams(query, type.params);
    try {
      this.description = type.describe(this.query);
    } catch (error) {
      throw familyError(error, this.query, type.params, type.countPath);
    }
    this.key = JSON.stringify(this.description); // = familyKey(description): the description is canonical
  }

  /** The family's random streams (the key's prefix hashed on first use: counting and membership need none). */
  get streams(): SampleStreams {
    return (this.hashedStreams ??= new SampleStreams(this.key));
  }

  get kind(): D['kind'] {
    return this.type.kind;
  }

  get n(): number {
    return this.description.n;
  }

  /** The planned sampler (planned once; PartsmithError when the family is empty or over a limit). */
  get sampler(): S {
    if (this.planned !== undefined) return this.planned;
    if (this.planError !== undefined) throw this.planError;
    try {
      this.planned = this.type.plan(this.description);
      return this.planned;
    } catch (error) {
      // Planning depends on the family only, so a refusal is remembered like a plan.
      this.planFoundEmpty = error instanceof RangeError && !(error instanceof LimitExceededError);
      this.planError = familyError(error, this.query, this.type.params, this.type.samplesPath);
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
        this.counted = this.type.count(this.description);
      } catch (error) {
        throw familyError(error, this.query, this.type.params, this.type.countPath);
      }
    }
    return this.counted;
  }

  sample(seed: string, index = 0): M {
    if (seed !== this.checkedSeed) this.checkSeed(seed);
    if (!isIndex(index)) index = parseParam(samplingFields.start, index, 'index', this.type.samplesPath);
    return this.draw(seed, index);
  }

  *samples(seed: string, start = 0, count = Infinity): IterableIterator<M> {
    this.checkSeed(seed);
    if (!isIndex(start)) start = parseParam(samplingFields.start, start, 'start', this.type.samplesPath);
    const end = count === Infinity ? MAX_INDEX + 1 : start + checkedCount(count, start, this.type.samplesPath);
    for (let i = start; i < end; i++) yield this.draw(seed, i);
  }

  contains(value: unknown): value is M {
    return this.type.contains(this.description, value);
  }

  resize(n: number): LibraryFamily<D, Raw, S, M> {
    return new LibraryFamily(this.type, { ...this.query, n: parseParam(this.type.nField, n, 'n', this.type.countPath) });
  }

  /**
   * The family's core ranker, members in its own form (parts; set partitions: restricted growth
   * strings), built once with its counting table; PartsmithError (422) past the ranking limits.
   * What the HTTP layer lists and unranks with, after the checks below.
   */
  get ranker(): Ranker {
    return this.rankTableFor('list').ranker;
  }

  /** The estimated bytes of the ranker's counting table (builds the ranker). */
  get rankTableBytes(): number {
    return this.rankTableFor('list').bytes;
  }

  rank(member: M | readonly number[]): bigint {
    const param = this.type.memberParam;
    let ranked: readonly number[] | undefined;
    try {
      ranked = this.type.toRanked(member);
      return this.rankTableFor('rank').ranker.rank(ranked);
    } catch (error) {
      const problem = notAMemberProblem(error, param);
      if (problem) throw partsmithError(problem, this.pathOf('rank'), ranked === undefined ? this.query : { [param]: ranked, ...this.query });
      throw error;
    }
  }

  unrank(rank: bigint | string | number): M {
    return this.type.fromRanked(this.ranker.unrank(this.checkedRank(rank)));
  }

  /**
   * Checked eagerly (the first rank as the API's start, count as the library's own parameter),
   * then listed one member at a time, with the order's successor step.
   */
  list(start: bigint | string | number = 0n, count = Infinity): IterableIterator<M> {
    const from = this.checkedStart(start);
    if (!(count === Infinity || (Number.isSafeInteger(count) && count >= 0))) throw invalidParam('count', 'must be a whole number >= 0 (or Infinity)', this.pathOf('list'), count);
    return this.members(this.ranker.list(from), count);
  }

  /** A rank as GET .../unrank checks it (PartsmithError 400 when malformed, 422 past the end), as a BigInt. */
  checkedRank(rank: unknown): bigint {
    const value = BigInt(parseParam(rankValueFields.rank, rankText(rank), 'rank', this.pathOf('unrank')));
    const total = this.rankTableFor('unrank').ranker.count;
    if (value >= total) throw partsmithError(rankProblem('rank', value, total), this.pathOf('unrank'), { ...this.query, rank: String(value) });
    return value;
  }

  /** A listing's first rank as GET .../list checks it (400 when malformed, 422 past the end; start = count lists nothing). */
  checkedStart(start: unknown): bigint {
    const value = BigInt(parseParam(rankValueFields.start, rankText(start), 'start', this.pathOf('list')));
    const total = this.rankTableFor('list').ranker.count;
    if (value > total) throw partsmithError(rankProblem('start', value, total), this.pathOf('list'), { ...this.query, start: String(value) });
    return value;
  }

  private *members(ranked: Iterator<number[]>, count: number): Generator<M> {
    for (let i = 0; i < count; i++) {
      const next = ranked.next();
      if (next.done) return;
      yield this.type.fromRanked(next.value);
    }
  }

  /** The ranker and its table, built once; a refusal is remembered and thrown for the endpoint of the call. */
  private rankTableFor(endpoint: 'list' | 'rank' | 'unrank'): RankTable {
    if (this.ranked !== undefined) return this.ranked;
    if (this.rankError === undefined) {
      try {
        this.ranked = this.type.rankTable(this.description);
        return this.ranked;
      } catch (error) {
        this.rankError = error;
      }
    }
    throw familyError(this.rankError, this.query, this.type.params, this.pathOf(endpoint));
  }

  private pathOf(endpoint: 'list' | 'rank' | 'unrank'): string {
    return `${this.type.samplesPath}/${endpoint}`;
  }

  private draw(seed: string, index: number): M {
    try {
      return this.type.member(this.sampler.sample(this.streams.source(seed, index)));
    } catch (error) {
      throw familyError(error, this.query, this.type.params, this.type.samplesPath);
    }
  }

  /** The seed checked by the API's seed field (SEED_PATTERN); the last good seed is remembered, as most callers keep one. */
  private checkSeed(seed: string): void {
    if (typeof seed !== 'string' || !SEED_PATTERN.test(seed)) parseParam(samplingFields.seed.unwrap(), seed, 'seed', this.type.samplesPath);
    this.checkedSeed = seed;
  }
}

/** A rank given as a BigInt or a number, as the decimal text the API's rank fields read (anything else as it is). */
function rankText(value: unknown): unknown {
  return typeof value === 'bigint' || typeof value === 'number' ? String(value) : value;
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
