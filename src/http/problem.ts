import { completeResponse } from './middleware/complete-response.js';

/**
 * RFC 9457 problem details. Every error the service returns is one of these, with
 * `errors: [{ param, message }]` naming each offending parameter where there is one.
 */
export interface ParamError {
  readonly param: string;
  readonly message: string;
}

export interface Problem {
  readonly type: string;
  readonly title: string;
  readonly status: number;
  readonly detail: string;
  readonly errors?: readonly ParamError[];
}

const TITLES: Record<number, string> = {
  400: 'Bad request',
  404: 'Not found',
  405: 'Method not allowed',
  406: 'Not acceptable',
  414: 'URI too long',
  422: 'Request cannot be served',
  429: 'Too many requests',
  500: 'Internal error',
  503: 'Service unavailable',
};

/** Slugs for the `type` URI; relative references resolve against the service's own base. */
const TYPES: Record<number, string> = {
  400: '/problems/invalid-parameters',
  404: '/problems/not-found',
  405: '/problems/method-not-allowed',
  406: '/problems/not-acceptable',
  414: '/problems/uri-too-long',
  422: '/problems/unserviceable',
  429: '/problems/too-many-requests',
  500: '/problems/internal',
  503: '/problems/unavailable',
};

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
    const problem: Problem = {
      type: TYPES[this.status] ?? 'about:blank',
      title: TITLES[this.status] ?? 'Error',
      status: this.status,
      detail: this.detail,
    };
    return this.errors && this.errors.length > 0 ? { ...problem, errors: this.errors } : problem;
  }
}

export function problemResponse(error: ProblemError): Response {
  return completeResponse(JSON.stringify(error.toProblem()), error.status, {
    'content-type': 'application/problem+json; charset=utf-8',
    'cache-control': 'no-store',
    ...error.headers,
  });
}
