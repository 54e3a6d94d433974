import type { MiddlewareHandler } from 'hono';
import { ProblemError } from '../problem.js';

/** Longest accepted URL (path and query, as received); query strings have their own, smaller limit. */
export const MAX_URL_LENGTH = 8192;
/** Longest accepted path: every real path is short, so a long one is refused before routing. */
export const MAX_PATH_LENGTH = 512;

/**
 * Refuses oversized URLs with 414 before routing or parsing, so a huge request costs no more
 * than reading it. (Node itself refuses request heads over 16 KiB with 431.)
 */
export function rejectOversizedUrls(): MiddlewareHandler {
  return async (c, next) => {
    const problem = oversizedUrlProblem(c.req.url);
    if (problem) throw problem;
    await next();
  };
}

/** The 414 problem for a URL (absolute, as a Request carries it) over the limits, if it is. */
export function oversizedUrlProblem(url: string): ProblemError | undefined {
  if (url.length > MAX_URL_LENGTH) {
    return new ProblemError(414, `The URL is ${url.length} characters long; the limit is ${MAX_URL_LENGTH}.`);
  }
  const pathStart = url.indexOf('/', url.indexOf('//') + 2);
  const queryStart = url.indexOf('?');
  const pathLength = (queryStart < 0 ? url.length : queryStart) - Math.max(pathStart, 0);
  if (pathStart >= 0 && pathLength > MAX_PATH_LENGTH) {
    return new ProblemError(414, `The path is ${pathLength} characters long; the limit is ${MAX_PATH_LENGTH}.`);
  }
  return undefined;
}
