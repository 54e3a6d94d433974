import type { ResponseDoc } from '../endpoint.js';

export const SAMPLE_CONTENT_TYPES = ['application/json', 'application/x-ndjson', 'text/plain'] as const;

/** The problem responses every query endpoint can give. */
export const PROBLEM_RESPONSES: Record<string, ResponseDoc> = {
  '400': { description: 'A parameter is malformed, unknown or repeated (problem details name each one).', contentTypes: ['application/problem+json'] },
  '414': { description: 'The query string is too long.', contentTypes: ['application/problem+json'] },
  '422': { description: 'Valid, but the family is empty, the constraints contradict each other, or a stated limit is exceeded.', contentTypes: ['application/problem+json'] },
};
