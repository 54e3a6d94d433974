import { problemOf, type Problem } from '../library/problems.js';
import type { ParamError } from '../schemas/issues.js';
import { completeResponse } from './middleware/complete-response.js';

export type { ParamError } from '../schemas/issues.js';
export type { Problem } from '../library/problems.js';

/** Thrown anywhere in request handling; the app turns it into a problem+json response. */
export class ProblemError extends Error {
  constructor(
    readonly status: number,
    readonly detail: string,
    readonly errors?: readonly ParamError[],
    readonly headers: Record<string, string> = {},
  ) {
    super(detail);
  }

  toProblem(): Problem {
    return problemOf(this.status, this.detail, this.errors);
  }
}

export function problemResponse(error: ProblemError): Response {
  return completeResponse(JSON.stringify(error.toProblem()), error.status, {
    'content-type': 'application/problem+json; charset=utf-8',
    'cache-control': 'no-store',
    ...error.headers,
  });
}
