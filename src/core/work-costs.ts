/**
 * What one unit of sampler work costs in time, per method: the table that turns a planner's
 * estimate (SamplerEstimate.expectedWork, in the method's own basic steps) into nanoseconds, so
 * that a request's work can be limited by a time budget instead of a step count whose meaning
 * differs 30-fold between methods.
 *
 * A sample's time estimate is
 *
 *   SEEDING_NS + expectedWork × nsPerStep(method) + numbers written × NS_PER_NUMBER
 *
 * The figures are measured by `npm run bench -- costs` (scripts/bench/costs.ts) on a shared
 * 2-core machine under Node: for every method it times samples of families the planners choose
 * that method for, and prints the measured time against this estimate. Steps are counted
 * differently by each method, so each method has its own row; a new sampler method must add one
 * (test/core/work-costs.test.ts fails otherwise).
 */

/** Per sample, whatever the method: deriving the sample's random stream and starting its output. */
export const SEEDING_NS = 3_000;

/** Per number written to the body (a part, or one of a [part, multiplicity] pair; items of a set partition). */
export const NS_PER_NUMBER = 50;

/**
 * Nanoseconds per basic step of each sampler method (the method id without the
 * "+conjugate" / "+length-filter" wrappers, which count their own steps into expectedWork).
 */
export const NS_PER_STEP: Readonly<Record<string, number>> = {
  // Unrestricted partitions (src/core/partitions).
  'self-similar/1': 41,
  'table-recursive/1': 14,
  'plain-rejection/1': 41,
  'recursive-oracle/1': 14,
  'divide-and-conquer-ones/1': 41,
  // Constrained partitions (src/core/partitions/constrained).
  'trivial/1': 10,
  'single-member/1': 14,
  'table-sizes/1': 120,
  'table-lengths/1': 120,
  'table-sizes-lengths/1': 120,
  'bounded-boltzmann/1': 130,
  'allowed-boltzmann/1': 380,
  'distinct-boltzmann/1': 100,
  'box-subset/1': 47,
  'box-mixture/1': 21,
  'allowed-length-boltzmann/1': 130,
  'allowed-subset/1': 130,
  // Compositions (src/core/compositions).
  'single/1': 14,
  'gap-bits/1': 20,
  'gap-subset/1': 20,
  'count-table/1': 50,
  'bars-reject/1': 50,
  'tilted-renewal/1': 130,
  'tilted-last-part/1': 53,
  // Set partitions (src/core/set-partitions).
  'stam/1': 12,
  'table/1': 50,
  'uniform-maps/1': 20,
  'poisson-urns/1': 20,
  'poisson-sizes/1': 20,
};

/** For a method missing from the table (never in a release; the test forbids it): the dearest known step. */
export const UNKNOWN_NS_PER_STEP = Math.max(...Object.values(NS_PER_STEP));

/** The method id a row is kept under: "bounded-boltzmann/1+conjugate" -> "bounded-boltzmann/1". */
export function baseMethod(method: string): string {
  const plus = method.indexOf('+');
  return plus < 0 ? method : method.slice(0, plus);
}

/** Nanoseconds per step of a method, as measured (see the table). */
export function nsPerStep(method: string): number {
  return NS_PER_STEP[baseMethod(method)] ?? UNKNOWN_NS_PER_STEP;
}

/** What the time estimate needs to know of a sampler. */
export interface CostedSampler {
  readonly method: string;
  readonly expectedWork: number;
}

/** Estimated nanoseconds for one sample of `sampler` that writes `numbersPerSample` numbers. */
export function sampleTimeNs(sampler: CostedSampler, numbersPerSample: number): number {
  return SEEDING_NS + sampler.expectedWork * nsPerStep(sampler.method) + numbersPerSample * NS_PER_NUMBER;
}
