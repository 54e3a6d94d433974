import { IMMUTABLE, matchesIfNoneMatch, NO_STORE, SeedEtags, strongEtag } from './caching.js';
import type { Limits } from './limits.js';
import { deadlineOf, turnClockOf } from './deadline.js';
import type { QueryMemo } from './query.js';
import { completeResponse } from './middleware/complete-response.js';
import { checkJobLimits, contentTypeOf, startBody, type SamplingJob } from './sampling.js';

/**
 * Answers a sampling request: limits first, then caching headers, then the streamed body.
 * `query` is the parsed query with the seed filled in (drawn or given); `memo` is the query's
 * (see QueryMemo), which keeps the ETag's seed-independent part. Synchronous on purpose: a small
 * answer then reaches the Node adapter without a promise turn (see Hardening.route).
 */
export function respondWithSamples<S>(
  request: Request,
  path: string,
  query: Readonly<Record<string, unknown>>,
  job: SamplingJob<S>,
  seeded: boolean,
  limits: Limits,
  memo: QueryMemo,
): Response {
  checkJobLimits(job as SamplingJob<unknown>, limits);
  const headers: Record<string, string> = {
    'content-type': contentTypeOf(job.format),
    'partsmith-seed': job.seed,
    'partsmith-method': job.sampler.method,
  };
  if (seeded) {
    const etag = memo.get('etags', () => new SeedEtags(path, query)).etag(job.seed);
    headers.etag = etag;
    headers['cache-control'] = IMMUTABLE;
    if (matchesIfNoneMatch(request, etag)) {
      return completeResponse(null, 304, { etag, 'cache-control': IMMUTABLE });
    }
  } else {
    headers['cache-control'] = NO_STORE;
  }
  // HEAD gets the headers only: no samples are drawn for a body nobody reads.
  const body = request.method === 'HEAD' ? null : startBody(job, deadlineOf(limits), turnClockOf(limits));
  return completeResponse(body, 200, headers);
}

/** A small JSON document (counts, health): cacheable when it is a pure function of the request. */
export function respondWithJson(request: Request, path: string, query: Record<string, unknown> | null, body: unknown): Response {
  const headers: Record<string, string> = { 'content-type': 'application/json; charset=utf-8' };
  if (query) {
    const etag = strongEtag(path, query);
    headers.etag = etag;
    headers['cache-control'] = IMMUTABLE;
    if (matchesIfNoneMatch(request, etag)) return completeResponse(null, 304, { etag, 'cache-control': IMMUTABLE });
  } else {
    headers['cache-control'] = NO_STORE;
  }
  return completeResponse(JSON.stringify(body), 200, headers);
}
