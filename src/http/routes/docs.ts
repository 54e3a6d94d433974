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

/** The orders of the rank endpoints, stated in their OpenAPI descriptions. */
export const PARTITION_ORDER =
  'Order: each partition lists its parts largest first, and members are in reverse lexicographic order of that list — n first, then (n-1, 1), (n-2, 2), (n-2, 1, 1), ..., and (1, ..., 1) last (for unrestricted partitions the order of OEIS A080577). Ranks are decimal strings, from 0.';
export const COMPOSITION_ORDER =
  'Order: lexicographic order of the part sequence — (1, ..., 1) first and (n) last when the parts are free; the first part decides, then the second, and so on. Ranks are decimal strings, from 0.';

export const SET_PARTITION_ORDER =
  'Order: lexicographic order of the restricted growth strings (entry i the block of item i + 1, blocks numbered 0, 1, ... in order of their smallest items) — one block (0, ..., 0) first and, when the family has it, all singletons (0, 1, ..., n-1) last. Ranks are decimal strings, from 0.';

/** Responses of a listing. */
export const LIST_RESPONSES: Record<string, ResponseDoc> = {
  '200': { description: 'The members, each with its rank; header Partsmith-Total: the number of members of the family.', contentTypes: SAMPLE_CONTENT_TYPES },
  '304': { description: 'Not modified (If-None-Match matched the ETag).', contentTypes: [] },
  ...PROBLEM_RESPONSES,
};

/** Responses of rank and unrank. */
export const RANK_RESPONSES: Record<string, ResponseDoc> = {
  '200': { description: '{"family": {...}, "rank": "decimal string", "total": "decimal string", "parts": [...]} (set partitions: "blocks" or "rgs")', contentTypes: ['application/json'] },
  '304': { description: 'Not modified (If-None-Match matched the ETag).', contentTypes: [] },
  ...PROBLEM_RESPONSES,
};
