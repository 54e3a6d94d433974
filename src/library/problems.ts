import { LimitExceededError, NotAMemberError } from '../core/errors.js';
import { ContradictoryConstraintError } from '../core/set-partitions/resolve.js';
import type { ParamError } from '../schemas/issues.js';

/**
 * RFC 9457 problem details: what the API answers for a request it cannot serve, and what the
 * library's PartsmithError carries for the same call — the same status, type, title, detail and
 * parameter errors wherever partsmith runs.
 */
export interface Problem {
  readonly type: string;
  readonly title: string;
  readonly status: number;
  readonly detail: string;
  readonly errors?: readonly ParamError[];
}

const TITLES: Readonly<Record<number, string>> = {
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
const TYPES: Readonly<Record<number, string>> = {
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

/** The problem document of a status, detail and parameter errors (`errors` left out when empty). */
export function problemOf(status: number, detail: string, errors?: readonly ParamError[]): Problem {
  const problem: Problem = { type: TYPES[status] ?? 'about:blank', title: TITLES[status] ?? 'Error', status, detail };
  return errors && errors.length > 0 ? { ...problem, errors } : problem;
}

/**
 * A limit is always named as one, so callers (and the fuzz contract) can tell "too big for
 * partsmith" from "malformed": "... for n <= 100000, got 1000000000 (limit: n <= 100000)".
 */
export function limitDetail(error: LimitExceededError): string {
  return /\blimit\b/i.test(error.message) ? error.message : `${error.message} (limit: ${error.limit})`;
}

/**
 * The problem of an error the core raised for a well-formed family: a limit (422 naming it), or
 * an empty family or contradictory bounds (a RangeError that is not about a limit: 422 naming
 * every family parameter given, since together they describe a set with no member). Undefined
 * for anything else, which is not the caller's fault.
 */
export function familyProblem(error: unknown, familyParams: readonly string[]): Problem | undefined {
  if (error instanceof LimitExceededError) return problemOf(422, limitDetail(error));
  // A parameter at odds with n or with another one (set partitions: blocks > n, minBlockSize > maxBlockSize): 422 naming it.
  if (error instanceof ContradictoryConstraintError) return problemOf(422, `${error.message}.`, [{ param: error.param, message: error.message }]);
  if (!(error instanceof RangeError)) return undefined;
  return problemOf(
    422,
    error.message,
    familyParams.map((param) => ({ param, message: 'together with the other family parameters, describes no member (see detail)' })),
  );
}

/**
 * The problem of a member given to rank that is not one (422 naming the rank endpoint's member
 * parameter, `parts` or `rgs`, with the core's reason); undefined for any other error.
 */
export function notAMemberProblem(error: unknown, param: string): Problem | undefined {
  if (!(error instanceof NotAMemberError)) return undefined;
  return problemOf(422, `${error.message.charAt(0).toUpperCase()}${error.message.slice(1)}.`, [{ param, message: error.message }]);
}

/** The problem of a rank (`rank`) or a listing's first rank (`start`) past the end of the family. */
export function rankProblem(param: 'rank' | 'start', value: bigint, total: bigint): Problem {
  const fits = param === 'start' ? `from 0 to ${total}` : total === 0n ? 'none: the family has no member' : `from 0 to ${total - 1n}`;
  const message = `must be a rank of this family (${fits}; it has ${total} members)`;
  return problemOf(422, `${param} ${message}, got ${value}.`, [{ param, message }]);
}
