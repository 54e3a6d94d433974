import { canonicalFamily, familyKey, type Family } from '../core/family.js';
import type { RandomSource } from '../core/random.js';
import { sampleSource } from '../core/seeding.js';
import type { SampleEncoder } from './encode.js';
import type { Limits } from './limits.js';
import { ProblemError } from './problem.js';
import type { SampleFormat } from './schemas/common.js';

/** What a sampling endpoint hands to the shared response writer. */
export interface SamplingJob<S> {
  readonly family: Family;
  readonly sampler: { readonly method: string; readonly expectedWork: number; sample(source: RandomSource): S };
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

/** Refuses, before any work is done, a job whose expected size or work is over the limits. */
export function checkJobLimits(job: SamplingJob<unknown>, limits: Limits): void {
  if (job.start + job.count - 1 > limits.maxIndex) {
    throw new ProblemError(422, `start + count - 1 must be at most ${limits.maxIndex}.`, [{ param: 'start', message: `start + count - 1 must be at most ${limits.maxIndex}` }]);
  }
  const numbers = job.count * job.numbersPerSample;
  if (numbers > limits.maxNumbers) {
    const perSample = Math.ceil(job.numbersPerSample);
    const fits = Math.max(0, Math.floor(limits.maxNumbers / job.numbersPerSample));
    throw new ProblemError(
      422,
      `This response would hold about ${Math.round(numbers).toLocaleString('en-US')} numbers (${perSample.toLocaleString('en-US')} per sample); the limit is ${limits.maxNumbers.toLocaleString('en-US')} per response. Ask for at most ${fits} samples per request, or page with start.`,
      [{ param: 'count', message: `at most ${fits} samples of this family fit in one response (limit: ${limits.maxNumbers} numbers)` }],
    );
  }
  const work = job.count * job.sampler.expectedWork;
  if (work > limits.maxWork) {
    const fits = Math.max(0, Math.floor(limits.maxWork / job.sampler.expectedWork));
    throw new ProblemError(
      422,
      `This request needs about ${work.toExponential(2)} steps of work; the limit is ${limits.maxWork.toExponential(2)} per request. Ask for at most ${fits} samples per request, or page with start.`,
      [{ param: 'count', message: `at most ${fits} samples of this family fit in the work limit (${limits.maxWork.toExponential(2)} steps)` }],
    );
  }
}

/**
 * The body of a sampling response as a sequence of text pieces. Sample i uses its own stream
 * (seed, i, family), so the pieces are the same whatever start and count frame them.
 */
export function* bodyPieces<S>(job: SamplingJob<S>): Generator<string> {
  const key = familyKey(job.family);
  const end = job.start + job.count;
  if (job.format === 'json') {
    const head = { family: canonicalFamily(job.family), seed: job.seed, start: job.start, method: job.sampler.method };
    yield `${JSON.stringify(head).slice(0, -1)},"samples":[`;
    for (let i = job.start; i < end; i++) {
      const sample = job.sampler.sample(sampleSource(job.seed, i, key));
      yield (i > job.start ? ',' : '') + JSON.stringify(job.encoder.json(sample));
    }
    yield ']}';
    return;
  }
  for (let i = job.start; i < end; i++) {
    const sample = job.sampler.sample(sampleSource(job.seed, i, key));
    yield job.format === 'ndjson'
      ? `{"index":${i},"${job.encoder.field}":${JSON.stringify(job.encoder.json(sample))}}\n`
      : `${job.encoder.text(sample)}\n`;
  }
}

/**
 * Streams the body, producing text only when the reader asks for more: a client that
 * disconnects cancels the stream, and no further samples are drawn.
 */
export function bodyStream(pieces: Iterator<string>): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  return new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        let buffer = '';
        while (buffer.length < CHUNK_CHARS) {
          const next = pieces.next();
          if (next.done) {
            if (buffer) controller.enqueue(encoder.encode(buffer));
            controller.close();
            return;
          }
          buffer += next.value;
        }
        controller.enqueue(encoder.encode(buffer));
      },
      cancel() {
        pieces.return?.(undefined);
      },
    },
    { highWaterMark: 0 },
  );
}

export function contentTypeOf(format: SampleFormat): string {
  return CONTENT_TYPES[format];
}
