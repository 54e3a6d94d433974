import { PartsmithError } from '../client/errors.js';
import { LimitExceededError } from '../core/errors.js';
import type { Partition } from '../core/partition.js';
import type { Ranker } from '../core/ranks/ranker.js';
import { IMMUTABLE, matchesIfNoneMatch, strongEtag } from './caching.js';
import { RequestStopped, deadlineOf, turnClockOf, type Deadline } from './deadline.js';
import { compositionAsParts, partitionAsMultiplicities, type SampleEncoder } from './encode.js';
import type { Limits } from './limits.js';
import { completeResponse } from './middleware/complete-response.js';
import { ProblemError } from './problem.js';
import { bodyStream, contentTypeOf, type Chunk } from './sampling.js';
import { setPartitionAsBlocks, setPartitionAsRgs } from './set-partition-encode.js';
import type { SampleFormat } from '../schemas/common.js';

/**
 * What the rank endpoints share: the per-isolate cache of the library's families they rank with
 * (their counting tables are the expensive part), the limits of a listing, and the listing's
 * body in its three formats.
 */

/**
 * What the rank endpoints need of a library family (LibraryFamily): its ranker, and the
 * library's checks of members, ranks and starts, which answer what the library answers.
 */
export interface RankedSource {
  readonly description: object;
  /** The canonical family as JSON. */
  readonly key: string;
  readonly ranker: Ranker;
  readonly rankTableBytes: number;
  rank(member: readonly number[]): bigint;
  checkedRank(rank: unknown): bigint;
  checkedStart(start: unknown): bigint;
}

/**
 * Values (the library's ranked families) by family key, least recently used first out, within
 * a memory budget: a ranker holds its family's counting table (up to RANK_TABLE_BYTES), so the
 * cache is bounded by the tables' estimated bytes as well as by entries. A family refused for
 * its table size is remembered too (saying what fits takes a search over n), and refused again
 * at once. Entries are pure functions of their key.
 */
export class RankerCache<V = RankedSource> {
  private readonly entries = new Map<string, { readonly value?: V; readonly refused?: unknown; readonly bytes: number }>();
  private bytes = 0;

  constructor(
    readonly budgetBytes: number = 64 * 2 ** 20,
    readonly maxEntries: number = 16,
  ) {}

  /** The value for `key`, made (with its estimated table bytes) the first time. */
  getOrCreate(key: string, make: () => { value: V; bytes: number }): V {
    let entry = this.entries.get(key);
    if (entry) {
      this.entries.delete(key);
      this.entries.set(key, entry);
    } else {
      try {
        entry = make();
      } catch (error) {
        // A limit refusal, raw or as the library's 422: a pure function of the family.
        if (!(error instanceof LimitExceededError || (error instanceof PartsmithError && error.status === 422))) throw error;
        entry = { refused: error, bytes: 0 };
      }
      this.entries.set(key, entry);
      this.bytes += entry.bytes;
      // Never evicts the entry just made (it may be over the budget alone: it fits the table limit).
      while (this.entries.size > 1 && (this.bytes > this.budgetBytes || this.entries.size > this.maxEntries)) {
        const [oldest, value] = this.entries.entries().next().value!;
        this.entries.delete(oldest);
        this.bytes -= value.bytes;
      }
    }
    if (entry.refused !== undefined) throw entry.refused;
    return entry.value!;
  }

  get size(): number {
    return this.entries.size;
  }
}

/** Members as lists of parts (partitions largest first, compositions in order). */
export const membersAsParts: SampleEncoder<number[]> = compositionAsParts;

/** Partitions as [part, multiplicity] pairs, from their parts listed largest first. */
export const membersAsMultiplicities: SampleEncoder<number[]> = {
  field: 'multiplicities',
  json: (parts) => partitionAsMultiplicities.json(runsOf(parts)),
  text: (parts) => partitionAsMultiplicities.text(runsOf(parts)),
};

/** The multiplicity form of parts listed largest first (equal parts are neighbours). */
export function runsOf(parts: readonly number[]): Partition {
  const sizes: number[] = [];
  const multiplicities: number[] = [];
  for (const p of parts) {
    if (sizes.length > 0 && sizes[sizes.length - 1] === p) multiplicities[multiplicities.length - 1]++;
    else {
      sizes.push(p);
      multiplicities.push(1);
    }
  }
  return { sizes, multiplicities };
}

/** Set partitions (as restricted growth strings, the ranker's form) as their blocks. */
export const membersAsBlocks: SampleEncoder<number[]> = {
  field: 'blocks',
  json: (rgs) => setPartitionAsBlocks.json(setPartitionOf(rgs)),
  text: (rgs) => setPartitionAsBlocks.text(setPartitionOf(rgs)),
};

/** Set partitions as their restricted growth strings. */
export const membersAsRgs: SampleEncoder<number[]> = {
  field: 'rgs',
  json: (rgs) => setPartitionAsRgs.json(setPartitionOf(rgs)),
  text: (rgs) => setPartitionAsRgs.text(setPartitionOf(rgs)),
};

function setPartitionOf(rgs: readonly number[]): { rgs: Int32Array; blocks: number } {
  let blocks = 0;
  for (const v of rgs) if (v >= blocks) blocks = v + 1;
  return { rgs: Int32Array.from(rgs), blocks };
}

/** A page of a family's listing. */
export interface ListingJob {
  readonly family: RankedSource;
  /** The first rank, as the query gives it (checked by the family, after the count). */
  readonly start: string;
  readonly count: number;
  readonly format: SampleFormat;
  readonly encoder: SampleEncoder<number[]>;
  /** The most parts (or numbers) one member can have, for the response-size limit. */
  readonly numbersPerMember: number;
}

/** Refuses a listing over the configured limits before any member is listed; the first rank, checked. */
export function checkListingLimits(job: ListingJob, limits: Limits): bigint {
  if (job.count > limits.maxCount) {
    const message = `must be a whole number from 1 to ${limits.maxCount}, written with digits only`;
    throw new ProblemError(400, `Invalid query: count ${message}.`, [{ param: 'count', message }]);
  }
  const start = job.family.checkedStart(job.start);
  const members = Math.min(job.count, Number(job.family.ranker.count - start));
  const numbers = members * job.numbersPerMember;
  if (numbers > limits.maxNumbers) {
    const fits = Math.max(1, Math.floor(limits.maxNumbers / job.numbersPerMember));
    throw new ProblemError(
      422,
      `A member of this family can have up to ${job.numbersPerMember.toLocaleString('en-US')} parts, so ${members.toLocaleString('en-US')} members could hold ${numbers.toLocaleString('en-US')} numbers; the limit is ${limits.maxNumbers.toLocaleString('en-US')} per response. Ask for at most ${fits} members per request and page with start.`,
      [{ param: 'count', message: `at most ${fits} members of this family fit in one response (limit: ${limits.maxNumbers} numbers)` }],
    );
  }
  return start;
}

/** Characters gathered before the first answer is committed (as for samples: one network chunk). */
const FIRST_CHUNK_CHARS = 64 * 1024;

/**
 * Answers a listing: the limits, caching headers (a listing is a pure function of its query:
 * immutable, strong ETag), then the body — whole when it fits one chunk, else streamed with
 * the sampling endpoints' `bodyStream`.
 */
export function respondWithListing(request: Request, path: string, query: Record<string, unknown>, job: ListingJob, limits: Limits): Response {
  const start = checkListingLimits(job, limits);
  const etag = strongEtag(path, query);
  const headers: Record<string, string> = { 'content-type': contentTypeOf(job.format), 'cache-control': IMMUTABLE, etag, 'partsmith-total': String(job.family.ranker.count) };
  if (matchesIfNoneMatch(request, etag)) return completeResponse(null, 304, { etag, 'cache-control': IMMUTABLE });
  if (request.method === 'HEAD') return completeResponse(null, 200, headers);
  const pieces = listingPieces(job, start, deadlineOf(limits));
  let text = '';
  for (;;) {
    const next = pieces.next(); // a stop before the first chunk is thrown: the app answers with its problem
    if (next.done) return completeResponse(text, 200, headers);
    text += next.value;
    if (text.length >= FIRST_CHUNK_CHARS) break;
  }
  const first: Chunk = { text, done: false };
  return completeResponse(bodyStream(pieces, { format: job.format, first, turnClock: turnClockOf(limits) }), 200, headers);
}

/** The body of a listing, one piece per member (plus the JSON head and tail). */
function* listingPieces(job: ListingJob, start: bigint, deadline?: Deadline): Generator<string> {
  const { encoder, format } = job;
  const { ranker } = job.family;
  const field = encoder.field;
  if (format === 'json') yield `{"family":${job.family.key},"total":"${ranker.count}","start":"${start}","members":[`;
  const members = ranker.list(start);
  let rank = start;
  for (let i = 0; i < job.count; i++) {
    if (deadline) checkDeadline(deadline, i, rank, start);
    const next = members.next();
    if (next.done) break;
    const member = next.value;
    if (format === 'json') yield `${i > 0 ? ',' : ''}{"rank":"${rank}","${field}":${encoder.json(member)}}`;
    else if (format === 'ndjson') yield `{"rank":"${rank}","${field}":${encoder.json(member)}}\n`;
    else yield `${rank}\t${encoder.text(member)}\n`;
    rank++;
  }
  if (format === 'json') yield ']}';
}

/**
 * The deadline between two members. A listing that runs out of time says where to continue with
 * its exact next rank (a BigInt, which the samples' stop message cannot carry); a disconnect is
 * passed on as it is, so the stream just ends.
 */
function checkDeadline(deadline: Deadline, listed: number, rank: bigint, start: bigint): void {
  try {
    deadline.check(listed);
  } catch (error) {
    if (!(error instanceof RequestStopped) || error.reason !== 'deadline') throw error;
    const resume = listed > 0 ? ` ${listed} members were listed in time; continue with start=${rank}.` : '';
    throw new ProblemError(
      503,
      `This listing ran past the deadline of ${error.budgetMs} ms per request (the server's time limit). Ask for fewer members (count), or page with start from ${start}.${resume}`,
      undefined,
      { 'retry-after': String(deadline.retryAfterSeconds()) },
    );
  }
}
