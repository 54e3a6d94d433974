/**
 * The service's stated limits (documented in the README). Work is counted in the samplers'
 * own units (basic steps; see SamplerEstimate) so one budget covers every method.
 */
export interface Limits {
  /** Samples in one response. */
  readonly maxCount: number;
  /** Numbers in one response (parts, or two per [part, multiplicity] pair), by expected size. */
  readonly maxNumbers: number;
  /** Expected work of one request, in basic steps (about 10 ns each on a 2-core machine). */
  readonly maxWork: number;
  /** Largest index of a sample (start + count - 1). */
  readonly maxIndex: number;
}

export const DEFAULT_LIMITS: Limits = {
  maxCount: 10_000,
  maxNumbers: 10_000_000,
  maxWork: 2e9,
  maxIndex: 1e15,
};

/** The largest n any family accepts. */
export const MAX_N = 1_000_000_000;
