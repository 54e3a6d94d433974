/** One offending parameter, as named in a problem document. */
export interface ProblemParamError {
  readonly param: string;
  readonly message: string;
}

/**
 * An error answer of the service, carrying the RFC 9457 problem fields (type, title, status,
 * detail, errors). Thrown by the client for every non-2xx answer and by the in-process library
 * for the same requests, so callers handle one error type wherever partsmith runs.
 */
export class PartsmithError extends Error {
  override readonly name = 'PartsmithError';
  readonly type: string;
  readonly title: string;
  readonly status: number;
  readonly detail: string;
  readonly errors: readonly ProblemParamError[];
  /** The request that failed (path and query). */
  readonly url: string;

  constructor(problem: { type?: string; title?: string; status: number; detail?: string; errors?: readonly ProblemParamError[] }, url: string) {
    const detail = problem.detail ?? `The service answered ${problem.status}.`;
    super(`${problem.status} ${problem.title ?? 'Error'}: ${detail}`);
    this.type = problem.type ?? 'about:blank';
    this.title = problem.title ?? 'Error';
    this.status = problem.status;
    this.detail = detail;
    this.errors = problem.errors ?? [];
    this.url = url;
  }

  /**
   * Builds the error from a response body: a problem document when it is one, otherwise (a
   * proxy's HTML page, say) the status with the start of the body as detail.
   */
  static fromBody(status: number, contentType: string | undefined, body: string, url: string): PartsmithError {
    if (contentType?.includes('json')) {
      try {
        const problem = JSON.parse(body) as Record<string, unknown>;
        if (problem && typeof problem === 'object' && typeof problem.detail === 'string') {
          return new PartsmithError(
            {
              type: typeof problem.type === 'string' ? problem.type : undefined,
              title: typeof problem.title === 'string' ? problem.title : undefined,
              status,
              detail: problem.detail,
              errors: Array.isArray(problem.errors) ? (problem.errors as ProblemParamError[]) : undefined,
            },
            url,
          );
        }
      } catch {
        // not JSON after all: fall through
      }
    }
    const snippet = body.replace(/\s+/g, ' ').trim().slice(0, 200);
    return new PartsmithError({ status, detail: snippet || undefined }, url);
  }
}
