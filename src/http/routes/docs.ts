import type { ResponseDoc } from '../endpoint.js';

export const SAMPLE_CONTENT_TYPES = ['application/json', 'application/x-ndjson', 'text/plain'] as const;

/** The problem responses every query endpoint can give. */
export const PROBLEM_RESPONSES: Record<string, ResponseDoc> = {
  '400': { description: 'A parameter is malformed, unknown or repeated (problem details name each one).', contentTypes: ['application/problem+json'] },
  '414': { description: 'The query string is too long.', contentTypes: ['application/problem+json'] },
  '422': { description: 'Valid, but the family is empty, the constraints contradict each other, or a stated limit is exceeded.', contentTypes: ['application/problem+json'] },
};

/** Responses of an endpoint that returns samples. */
export const SAMPLE_RESPONSES: Record<string, ResponseDoc> = {
  '200': { description: 'The samples.', contentTypes: SAMPLE_CONTENT_TYPES },
  '304': { description: 'Not modified (If-None-Match matched the ETag of a seeded request).', contentTypes: [] },
  ...PROBLEM_RESPONSES,
};

/** Responses of an endpoint that returns an exact count. */
export const COUNT_RESPONSES: Record<string, ResponseDoc> = {
  '200': { description: '{"family": {...}, "count": "decimal string"}', contentTypes: ['application/json'] },
  ...PROBLEM_RESPONSES,
};
