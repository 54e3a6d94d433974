import type { z } from 'zod';

/** One offending parameter and what is wrong with it. */
export interface ParamError {
  readonly param: string;
  readonly message: string;
}

/**
 * The parameter errors of a failed parse against an endpoint's schema, each naming its
 * parameter: what the API's 400 answers and the library's errors both say. `given` tells
 * whether a parameter was present (zod 4 leaves issue.input unset, so "absent" is judged from
 * the input itself); `skip` leaves out parameters already reported otherwise.
 */
export function paramErrors(error: z.ZodError, given: (param: string) => boolean, skip: (param: string) => boolean = () => false): ParamError[] {
  const errors: ParamError[] = [];
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) errors.push({ param: printableParam(key), message: 'is not a parameter of this endpoint' });
    } else {
      const param = issue.path.length > 0 ? String(issue.path[0]) : '(query)';
      const message = issue.code === 'invalid_type' && !given(param) ? 'is required' : issue.message;
      if (!skip(param)) errors.push({ param, message });
    }
  }
  return errors;
}

/** The one-line detail of a 400 answer: every parameter error, in order. */
export function invalidParamsDetail(errors: readonly ParamError[]): string {
  return `Invalid query: ${errors.map((e) => `${e.param} ${e.message}`).join('; ')}.`;
}

/** Parameter names are echoed back; keep them short and free of control characters. */
export function printableParam(key: string): string {
  if (key === '') return '(empty name)'; // from "=5": say so rather than print nothing
  const clean = key.replace(/[\u0000-\u001f\u007f]/g, '?');
  return clean.length > 64 ? `${clean.slice(0, 61)}...` : clean;
}
