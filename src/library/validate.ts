import type { z } from 'zod';
import { PartsmithError } from '../client/errors.js';
import { toQueryString } from '../client/params.js';
import { invalidParamsDetail, paramErrors } from '../schemas/issues.js';
import { familyProblem, problemOf, type Problem } from './problems.js';

/**
 * The library's checks are the endpoints' own: a call is validated by the zod schema of the
 * endpoint that answers the same request, and a failure is thrown as PartsmithError carrying
 * the problem the API would answer (same status, detail and parameter errors). `path` is that
 * endpoint; the error's `url` is the equivalent request, so it can be replayed with curl or the CLI.
 */
export function parseParams<S extends z.ZodType>(schema: S, params: unknown, path: string): z.output<S> {
  const result = schema.safeParse(params);
  if (result.success) return result.data;
  const given = (param: string) => typeof params === 'object' && params !== null && Object.hasOwn(params, param) && (params as Record<string, unknown>)[param] !== undefined;
  const errors = paramErrors(result.error, given);
  throw partsmithError(problemOf(400, invalidParamsDetail(errors), errors), path, params);
}

/**
 * One parameter of a call checked by the schema field that checks it in the API. `name` is the
 * parameter's name in the call (the library's positional `index` is checked by the field of `start`).
 */
export function parseParam<S extends z.ZodType>(field: S, value: unknown, name: string, path: string): z.output<S> {
  const result = field.safeParse(value);
  if (result.success) return result.data;
  const errors = paramErrors(result.error, () => value !== undefined).map((e) => ({ param: name, message: e.message }));
  throw partsmithError(problemOf(400, invalidParamsDetail(errors), errors), path, { [name]: value });
}

/** A parameter of the library's own (not an API parameter), refused with a 400 like the API's. */
export function invalidParam(name: string, message: string, path: string, value: unknown): PartsmithError {
  const errors = [{ param: name, message }];
  return partsmithError(problemOf(400, invalidParamsDetail(errors), errors), path, { [name]: value });
}

/**
 * What the core raised for a family, as the API reports it (422 for a limit, an empty family or
 * contradictory bounds), thrown as PartsmithError; anything else is rethrown as it is.
 */
export function familyError(error: unknown, params: Readonly<Record<string, unknown>>, familyParams: readonly string[], path: string): unknown {
  if (error instanceof PartsmithError) return error;
  const problem = familyProblem(error, familyParams.filter((param) => params[param] !== undefined));
  return problem ? partsmithError(problem, path, params) : error;
}

/** The error the library throws for a problem, naming the equivalent API request (path and parameters). */
export function partsmithError(problem: Problem, path: string, params: unknown): PartsmithError {
  let query = '';
  try {
    query = typeof params === 'object' && params !== null ? toQueryString(params) : '';
  } catch {
    // parameters that cannot be written as a query (a symbol, say): name the endpoint alone
  }
  return new PartsmithError(problem, path + query);
}
