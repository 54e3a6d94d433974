/**
 * The numeric bounds the schemas state. They belong to the parameters, not to a server: the
 * HTTP layer's configurable limits (src/http/limits.ts) start from them.
 */
export { MAX_N } from '../core/family.js';

/** The most samples a server can be configured to return in one response (the schema's bound on count). */
export const MAX_COUNT = 10_000_000;

/** Samples per response unless a server is configured otherwise. */
export const DEFAULT_MAX_COUNT = 10_000;

/** Largest index of a sample (start + count - 1, or index). */
export const MAX_INDEX = 1e15;
