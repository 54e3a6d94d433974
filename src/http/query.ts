import type { z } from 'zod';
import { ProblemError, type ParamError } from './problem.js';

/** Longest accepted query string (characters); longer ones are refused before parsing. */
export const MAX_QUERY_LENGTH = 4096;

/**
 * Reads a query string against an endpoint's schema. Strict on purpose: a repeated parameter is
 * ambiguous and an unknown one is usually a typo (`cout=5`) that would otherwise be silently
 * ignored, so both are errors. Every problem is reported at once, each naming its parameter.
 */
export function parseQuery<S extends z.ZodType>(url: string, schema: S): z.output<S> {
  const queryStart = url.indexOf('?');
  const query = queryStart < 0 ? '' : url.slice(queryStart + 1);
  if (query.length > MAX_QUERY_LENGTH) {
    throw new ProblemError(414, `The query string is ${query.length} characters long; the limit is ${MAX_QUERY_LENGTH}.`);
  }
  // A plain object (zod parses it several times faster than a null-prototype one), so keys are
  // looked up with Object.hasOwn and "__proto__" is defined as an own property, never assigned.
  // (No parameter is named like an Object.prototype member, which zod would read through.)
  const raw: Record<string, string> = {};
  const errors: ParamError[] = [];
  const repeated = new Set<string>();
  let params: URLSearchParams;
  try {
    params = new URLSearchParams(query);
  } catch {
    throw new ProblemError(400, 'The query string could not be decoded.');
  }
  for (const [key, value] of params) {
    if (Object.hasOwn(raw, key)) {
      if (!repeated.has(key)) errors.push({ param: printable(key), message: 'is given more than once; give it once' });
      repeated.add(key);
      continue;
    }
    if (key === '__proto__') Object.defineProperty(raw, key, { value, enumerable: true, writable: true, configurable: true });
    else raw[key] = value;
  }
  const result = schema.safeParse(raw);
  if (!result.success) {
    for (const issue of result.error.issues) {
      if (issue.code === 'unrecognized_keys') {
        for (const key of issue.keys) errors.push({ param: printable(key), message: 'is not a parameter of this endpoint' });
      } else {
        const param = issue.path.length > 0 ? String(issue.path[0]) : '(query)';
        // zod 4 leaves issue.input unset by default, so "absent" is judged from the query itself.
        const message = issue.code === 'invalid_type' && !Object.hasOwn(raw, param) ? 'is required' : issue.message;
        if (!repeated.has(param)) errors.push({ param, message });
      }
    }
  }
  if (errors.length > 0) {
    const detail = errors.map((e) => `${e.param} ${e.message}`).join('; ');
    throw new ProblemError(400, `Invalid query: ${detail}.`, errors);
  }
  return result.data as z.output<S>;
}

/** Parameter names are echoed back; keep them short and free of control characters. */
function printable(key: string): string {
  if (key === '') return '(empty name)'; // from "=5": say so rather than print nothing
  const clean = key.replace(/[\u0000-\u001f\u007f]/g, '?');
  return clean.length > 64 ? `${clean.slice(0, 61)}...` : clean;
}
