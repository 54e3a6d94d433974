import type { Family } from '../core/family.js';
import type { RandomSource } from '../core/random.js';
import type { SampleStreams } from '../core/seeding.js';
import type { SampleEncoder } from './encode.js';
import type { Limits } from './limits.js';
import { ProblemError } from './problem.js';
import { RequestStopped, type Deadline } from './deadline.js';
import { checkWorkBudget, samplesText } from './work-budget.js';
import type { SampleFormat } from '../schemas/common.js';
import { YieldBudget } from './yield-budget.js';

/** What a sampling endpoint hands to the shared response writer. */
export interface SamplingJob<S> {
  /** The family, canonical (see canonicalFamily). */
  readonly family: Family;
  /** The family's random streams; their familyKey is echoed in the body. */
  readonly streams: SampleStreams;
  readonly sampler: { readonly method: string; readonly expectedWork: number; readonly expectedDistinct?: number; sample(source: RandomSource): S };
  readonly encoder: SampleEncoder<S>;
  /** Expected numbers one sample adds to the body (parts, or 2 per multiplicity pair). */
  readonly numbersPerSample: number;
  readonly seed: string;
  readonly start: number;
  readonly count: number;
  readonly format: SampleFormat;
}

const CONTENT_TYPES: Record<SampleFormat, string> = {
  json: 'application/json; charset=utf-8',
  ndjson: 'application/x-ndjson; charset=utf-8',
  text: 'text/plain; charset=utf-8',
};

/** Bytes gathered before handing a chunk to the network: large enough to amortise, small enough to stream. */
const CHUNK_CHARS = 64 * 1024;

/**
 * Bodies expected to hold at most this many numbers (a few kB) are built as one string in a
 * plain loop (see wholeBody); most requests are this small.
 */
const WHOLE_BODY_NUMBERS = 2000;

/**
 * What the limits look at: how many samples, from where, and their expected size and work; the
 * family and encoder, when given, let a refusal say which parameter to change.
 */
export type JobSize = Pick<SamplingJob<unknown>, 'sampler' | 'numbersPerSample' | 'start' | 'count'> & Partial<Pick<SamplingJob<unknown>, 'family' | 'encoder'>>;

/**
 * Refuses, before any work is done, a job whose count, indices, expected size or estimated time
 * (the work budget, see work-budget.ts) are over the limits.
 */
export function checkJobLimits(job: JobSize, limits: Limits): void {
  if (job.count > limits.maxCount) {
    // The schema admits up to MAX_COUNT so an operator can raise the limit; the configured one is checked here.
    const message = `must be a whole number from 1 to ${limits.maxCount}, written with digits only`;
    throw new ProblemError(400, `Invalid query: count ${message}.`, [{ param: 'count', message }]);
  }
  if (job.start + job.count - 1 > limits.maxIndex) {
    const message = `start + count - 1 must be at most ${limits.maxIndex} (the largest sample index): with count=${job.count}, start at most ${limits.maxIndex - job.count + 1}`;
    throw new ProblemError(422, `${message}.`, [{ param: 'start', message }]);
  }
  checkResponseSize(job, limits);
  checkWorkBudget(job, limits);
}

/** Refuses a job whose response would hold more numbers than the limit, saying what would fit. */
function checkResponseSize(job: JobSize, limits: Limits): void {
  const numbers = job.count * job.numbersPerSample;
  if (numbers <= limits.maxNumbers) return;
  const perSample = Math.ceil(job.numbersPerSample).toLocaleString('en-US');
  const limit = `the limit is ${limits.maxNumbers.toLocaleString('en-US')} per response`;
  const fits = Math.floor(limits.maxNumbers / job.numbersPerSample);
  if (fits >= 1) {
    const next = job.start + fits;
    throw new ProblemError(
      422,
      `This response would hold about ${Math.round(numbers).toLocaleString('en-US')} numbers (${perSample} per sample); ${limit}. Ask for count=${fits}, then page with start=${next}, start=${next + fits}, … for the rest.`,
      [{ param: 'count', message: `at most ${samplesText(fits)} of this family fit in one response (limit: ${limits.maxNumbers} numbers); page with start for more` }],
    );
  }
  const multiplicities = job.family?.kind === 'partition' && job.encoder?.field === 'parts';
  const change = multiplicities ? 'Ask for as=multiplicities (each part size once, with its multiplicity) or a smaller n' : 'Ask for a smaller n';
  throw new ProblemError(
    422,
    `One sample of this family holds about ${perSample} numbers; ${limit}, so not even one sample fits. ${change}.`,
    [{ param: multiplicities ? 'as' : 'n', message: `one sample holds about ${perSample} numbers, over the limit of ${limits.maxNumbers} per response: ${change.charAt(0).toLowerCase()}${change.slice(1)}` }],
  );
}

/**
 * The body of a sampling response as a sequence of text pieces. Sample i uses its own stream
 * (seed, i, family), so the pieces are the same whatever start and count frame them.
 */
export function* bodyPieces<S>(job: SamplingJob<S>, deadline?: Deadline): Generator<string> {
  const end = job.start + job.count;
  if (job.format === 'json') yield jsonHead(job);
  for (let i = job.start; i < end; i++) {
    deadline?.check(i - job.start);
    yield samplePiece(job, i);
  }
  if (job.format === 'json') yield JSON_TAIL;
}

/**
 * The whole body as one string, produced in a plain loop: the same text as joining
 * `bodyPieces`, without a generator's per-piece cost. For bodies that fit in one chunk, and
 * for single samples: one JSON or NDJSON sample goes out as the bytes its encoder wrote, when
 * it writes bytes for a sample that large (see singleSampleBytes).
 */
function wholeBody<S>(job: SamplingJob<S>, deadline?: Deadline): string | Uint8Array<ArrayBuffer> {
  if (job.count === 1 && job.format !== 'text' && job.encoder.jsonBytes !== undefined) {
    deadline?.check(0);
    return singleSampleBytes(job, job.encoder.jsonBytes);
  }
  const end = job.start + job.count;
  let text = job.format === 'json' ? jsonHead(job) : '';
  for (let i = job.start; i < end; i++) {
    deadline?.check(i - job.start);
    text += samplePiece(job, i);
  }
  return job.format === 'json' ? text + JSON_TAIL : text;
}

/** `{"family":…,"seed":…,"start":…,"method":…,"samples":[` — the family is its key, already JSON. */
function jsonHead(job: SamplingJob<unknown>): string {
  return `{"family":${job.streams.familyKey},"seed":${JSON.stringify(job.seed)},"start":${job.start},"method":${JSON.stringify(job.sampler.method)},"samples":[`;
}

const JSON_TAIL = ']}';

/**
 * The body of a one-sample JSON or NDJSON job: the same text as joining `bodyPieces`, written
 * by the encoder into one buffer with the body's head and tail when the sample is large (a
 * partition of 10^9 as=multiplicities: 240 kB), as a string otherwise.
 */
function singleSampleBytes<S>(job: SamplingJob<S>, jsonBytes: NonNullable<SampleEncoder<S>['jsonBytes']>): string | Uint8Array<ArrayBuffer> {
  const i = job.start;
  const sample = job.sampler.sample(job.streams.source(job.seed, i));
  const [open, close] = job.format === 'json' ? [jsonHead(job), JSON_TAIL] : [`{"index":${i},"${job.encoder.field}":`, '}\n'];
  return jsonBytes(sample, open, close) ?? open + job.encoder.json(sample) + close;
}

/** Sample i of the job, encoded for its format (with its separator or line end). */
function samplePiece<S>(job: SamplingJob<S>, i: number): string {
  const sample = job.sampler.sample(job.streams.source(job.seed, i));
  switch (job.format) {
    case 'json':
      return (i > job.start ? ',' : '') + job.encoder.json(sample);
    case 'ndjson':
      return `{"index":${i},"${job.encoder.field}":${job.encoder.json(sample)}}\n`;
    default:
      return `${job.encoder.text(sample)}\n`;
  }
}

/** Text gathered for one network chunk; `stopped` is what ended the body early, if anything. */
export interface Chunk {
  readonly text: string;
  readonly done: boolean;
  readonly stopped?: unknown;
}

function takeChunk(pieces: Iterator<string>): Chunk {
  let buffer = '';
  try {
    while (buffer.length < CHUNK_CHARS) {
      const next = pieces.next();
      if (next.done) return { text: buffer, done: true };
      buffer += next.value;
    }
    return { text: buffer, done: false };
  } catch (error) {
    // A generator that threw is finished; the samples already in the buffer are still good.
    return { text: buffer, done: true, stopped: error };
  }
}

/**
 * The body of a sampling response, with its first chunk produced before the response is
 * committed: a request that runs out of time before its first byte (or whose sampler refuses)
 * still gets a proper status — 503 problem+json with Retry-After for the deadline.
 * Once streaming has begun the status is sent, so a later stop ends the stream with an error
 * (see `bodyStream`).
 */
export function startBody<S>(job: SamplingJob<S>, deadline?: Deadline, turnClock?: () => number): ReadableStream<Uint8Array> | string | Uint8Array<ArrayBuffer> {
  // One sample is drawn whole whatever its size, so its body is one string (or its bytes) too
  // (with a Content-Length, and no stream to pump), however large.
  if (job.count === 1 || job.count * job.numbersPerSample <= WHOLE_BODY_NUMBERS) {
    try {
      return wholeBody(job, deadline);
    } catch (error) {
      throw stoppedProblem(error, job.start);
    }
  }
  const pieces = bodyPieces(job, deadline);
  const first = takeChunk(pieces);
  if (first.stopped !== undefined) throw stoppedProblem(first.stopped, job.start);
  // A body that fits in one chunk goes out as a string: it gets a Content-Length, and Node's
  // adapter writes it directly instead of pumping a stream (most requests are this small).
  if (first.done) return first.text;
  return bodyStream(pieces, { format: job.format, start: job.start, first, turnClock });
}

/** What a stop means for the client: a problem for the deadline, the original error otherwise. */
function stoppedProblem(stopped: unknown, start: number): unknown {
  if (!(stopped instanceof RequestStopped)) return stopped;
  const retryAfter = String(Math.max(1, Math.ceil(stopped.budgetMs / 1000)));
  const resume = stopped.produced > 0 ? ` ${stopped.produced} samples were done in time; continue with start=${start + stopped.produced}.` : '';
  return new ProblemError(
    503,
    `This request ran past the deadline of ${stopped.budgetMs} ms per request (the server's time limit). Ask for fewer samples (count) or a smaller n, or page with start.${resume}`,
    undefined,
    { 'retry-after': retryAfter },
  );
}

/** The problem written into an NDJSON stream that stops early; internals never leak into it. */
function streamProblem(stopped: unknown, start: number): ProblemError {
  const problem = stoppedProblem(stopped, start);
  if (problem instanceof ProblemError) return problem;
  if (problem instanceof RangeError) return new ProblemError(422, problem.message);
  return new ProblemError(500, 'The service failed while streaming this response; the samples before this line are valid.');
}

/** The error a stream ends with once streaming has begun; its message may reach the client. */
export class StreamEndedEarly extends Error {
  override readonly name = 'StreamEndedEarly';
}

export interface StreamOptions {
  readonly format?: SampleFormat;
  /** Index of the first sample, to tell the client where to continue after an early stop. */
  readonly start?: number;
  /** A chunk already produced (by `startBody`), sent first. */
  readonly first?: Chunk;
  /** Clock of the yield budget (see AppOptions.turnClock); performance.now by default. */
  readonly turnClock?: () => number;
}

/**
 * Streams the body, producing text only when the reader asks for more: a client that
 * disconnects cancels the stream (and aborts the request's signal, which the deadline watches
 * between samples), and no further samples are drawn.
 *
 * When sampling stops after the first chunk was sent (deadline, or a failing sampler), the
 * samples finished so far are sent, an NDJSON stream gets one last line
 * `{"error": <problem details>}`, and the stream is then errored, so the response ends without
 * its proper end (no closing chunk, or "]}" missing from JSON): clients see a truncated body,
 * never a short one that looks complete.
 */
export function bodyStream(pieces: Iterator<string>, options: StreamOptions = {}): ReadableStream<Uint8Array> {
  const { format = 'text', start = 0 } = options;
  const encoder = new TextEncoder();
  let pending = options.first;
  // Erroring a stream discards what is still queued, so the stream errors one pull after the
  // last good chunk (and the NDJSON error line) went out.
  let failure: StreamEndedEarly | undefined;
  let cancelled = false;
  const budget = new YieldBudget(options.turnClock);
  return new ReadableStream<Uint8Array>(
    {
      async pull(controller) {
        if (failure) {
          controller.error(failure);
          return;
        }
        // Produced as soon as the reader asks; the event loop gets a turn once the stream has
        // worked for a measured budget (see yield-budget.ts), not after every chunk.
        if (!pending && budget.due()) await budget.giveWay();
        if (cancelled) return;
        const chunk = pending ?? takeChunk(pieces);
        pending = undefined;
        let text = chunk.text;
        if (chunk.stopped !== undefined) {
          if (chunk.stopped instanceof RequestStopped && chunk.stopped.reason === 'disconnected') {
            controller.close(); // nobody is reading any more
            return;
          }
          const problem = streamProblem(chunk.stopped, start);
          if (format === 'ndjson') text += `${JSON.stringify({ error: problem.toProblem() })}\n`;
          failure = new StreamEndedEarly(problem.status === 503 ? 'deadline passed while streaming' : 'sampling failed while streaming');
          if (!text) {
            controller.error(failure);
            return;
          }
        }
        if (text) controller.enqueue(encoder.encode(text));
        if (chunk.done && !failure) controller.close();
      },
      cancel() {
        cancelled = true;
        pieces.return?.(undefined);
      },
    },
    { highWaterMark: 0 },
  );
}

export function contentTypeOf(format: SampleFormat): string {
  return CONTENT_TYPES[format];
}
