/**
 * What one unit of sampler work costs in time, per method: the table that turns a planner's
 * estimate (SamplerEstimate.expectedWork, in the method's own basic steps) into nanoseconds, so
 * that a request's work can be limited by a time budget instead of a step count whose meaning
 * differs many-fold between methods.
 *
 * A sample's time estimate is
 *
 *   SEEDING_NS + expectedWork × nsPerStep(method) + numbers written × NS_PER_NUMBER
 *
 * The figures are measured by `npm run bench -- costs` (scripts/bench/costs.ts) on a 2-core
 * machine under Node 20: for every method it times whole NDJSON requests of families the
 * planners choose that method for, and prints the measured time against this estimate. The rows
 * were fitted to the process's CPU time (best of 5 rounds), which other processes on a shared
 * machine hardly change (wall-clock there, at a load average of ~7 on 2 cores, was 1-10x more). Steps are counted
 * differently by each method, so each method has its own row; a new sampler method must add one
 * (test/core/work-costs.test.ts fails otherwise). The estimate is a planner's mean, not a bound:
 * in the bench, CPU time was 0.08-2.0x the estimate (0.5-1.5x for the middle 80% of families;
 * it is high where a method's expectedWork is a loose upper estimate), and the request deadline
 * stops what it misses.
 */

/** Per sample, whatever the method: deriving the sample's random stream and writing its NDJSON line. */
export const SEEDING_NS = 2_000;

/**
 * Per number written to the body (a part, or one of a [part, multiplicity] pair; items of a set
 * partition): about 10 ns of CPU to write it, and about as much again for the turn of the event
 * loop the stream takes per 64 KiB chunk (see bodyStream).
 */
export const NS_PER_NUMBER = 30;

/**
 * Nanoseconds per basic step of each sampler method (the method id without the
 * "+conjugate" / "+length-filter" wrappers, which count their own steps into expectedWork).
 */
export const NS_PER_STEP: Readonly<Record<string, number>> = {
  // Unrestricted partitions (src/core/partitions).
  'self-similar/1': 55,
  'table-recursive/1': 20,
  'plain-rejection/1': 40,
  'recursive-oracle/1': 2,
  'divide-and-conquer-ones/1': 70,
  // Constrained partitions (src/core/partitions/constrained).
  'trivial/1': 10,
  'single-member/1': 10,
  'table-sizes/1': 65,
  'table-lengths/1': 160,
  'table-sizes-lengths/1': 55,
  'bounded-boltzmann/1': 100,
  'allowed-boltzmann/1': 320,
  'distinct-boltzmann/1': 95,
  'distinct-self-similar/1': 60,
  'distinct-bounded-self-similar/1': 40,
  // The two self-similar rows below are kept; their cost functions (min-part-self-similar.ts,
  // bounded-self-similar.ts) were refitted to them: `npm run bench -- plan-fit` (process CPU time
  // after a warm-up, every eligible method of every shapes.ts family forced and timed beside its
  // estimate) and a sweep at n = 3e3-1e9 measured 0.6-1.5x the estimate for minpart-self-similar
  // (a = 2, 7, 30, 100) and 0.5-2.3x for bounded-self-similar (b = √n/4, √n, 2√n); before, the
  // min-part estimate was 2-50x high at n <= 1e6 (a count per proposal and a maximiser per level
  // charged that the tables and the remembered counts now serve), so the planner took
  // bounded-boltzmann for parts >= 7 at n = 1e4 (measured 0.44 ms against 0.033 ms).
  'minpart-self-similar/1': 60,
  'bounded-self-similar/1': 30,
  'box-subset/1': 50,
  'box-mixture/1': 20,
  // Per random draw (block counts, internal sums, placed positions): 41-70 ns of CPU, median ~46,
  // n = 1e5-1e9 with maxPart = 2 sqrt(n) and length or maxLength sqrt(n) (loaded 2-core machine).
  'box-rotation/1': 50,
  // Per estimated step (one geometric draw per size <= k, a logarithm each): 65-85 ns of CPU
  // per sample / expectedWork at n = 1e6 (parts >= 10, at most 500) and 1e8 (parts >= 2 and >= 50,
  // at most 5000; proposals 53-74 against 65 estimated), loaded 2-core machine. /2 with its block
  // of smallest sizes: 35-68 ns (n = 1e8-9.4e8, K = 5000-52671; its table counted at 1/20 unit per addition).
  'conjugate-mixture/2': 75,
  // In box-rotation draws (box-subset's steps converted, narrow-range-mixture.ts).
  'narrow-range-mixture/1': 50,
  'allowed-length-boltzmann/1': 70,
  'allowed-subset/1': 30,
  'allowed-subset-mixture/1': 30,
  // Compositions (src/core/compositions).
  'single/1': 10,
  'gap-bits/1': 30,
  'gap-subset/1': 30,
  'count-table/1': 40,
  'bars-reject/1': 25,
  'tilted-renewal/1': 100,
  'tilted-last-part/1': 35,
  // Set partitions (src/core/set-partitions).
  'stam/1': 30,
  'table/1': 20,
  'uniform-maps/1': 30,
  'poisson-urns/1': 30,
  'poisson-sizes/1': 35,
  'equal-blocks/1': 20,
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

/**
 * Nanoseconds per unit of a method's setupWork (what its constructor reports: table cells, count
 * additions, tilt steps), for planners that weigh setup against samples. Methods missing here
 * count setup in their own steps (nsPerStep). Measured with process CPU time, Node 20 on the
 * 2-core machine (build time / setupWork; tables freshly allocated, as a request builds them):
 * - table-sizes 12-28, taken as 20 (first builds; 8-9 rebuilt: n = 2000 distinct, 4e6 cells;
 *   n = 1e4 distinct parts <= 200; 3e6 cells for n = 3000 from 1000 distinct sizes); table-lengths
 *   8-17, taken as 12 (n = 2e4 distinct parts >= 7, n = 8000 at most 100 parts >= 5);
 *   table-sizes-lengths 9-11 rebuilt, taken as 15 (n = 600 parts <= 50 with 60 parts; n = 1000,
 *   13 allowed sizes, at most 300 parts);
 * - allowed-subset 32-73 per cell (1000 sizes, k = 400 and 100; the tilt dominates small tables);
 * - distinct-boltzmann 17-27 per block-table cell, tilt included (1e6-2e6 cells, n = 1e4-1e6);
 * - minpart-self-similar and bounded-self-similar ~1.4 per count addition (their files' figure;
 *   bounded-self-similar's constructor measured 0.2-4 once compiled, n = 1e5-1e8, b = 791-1e4);
 * - distinct-bounded-self-similar 6-67 per unit of its setupWork (0.05 per addition; constructor,
 *   n = 1e5-1e9, a = 7, 9, 50, with and without maxPart; median ~30);
 * - box-mixture ~60 per setup step (7.9e5 steps in 40-60 ms, plan-length.ts);
 * - distinct-self-similar 48 per unit (before: its 60 ns sample step): fresh tables (40,401
 *   cells + the exact BigInt counts, setupWork 160,401) filled by the first sample at n = 1e4,
 *   after two warm-up fills, 7.6-15 ms CPU over 8 rounds (best 7.6, median ~10.6). The fill is
 *   once per process (the tables are shared), and with the best-of-rounds figure the planner
 *   takes it over box-mixture for plain distinct parts at n = 1e4 (plan-fit: 0.031 ms per sample
 *   against 0.123 ms).
 */
export const NS_PER_SETUP_UNIT: Readonly<Record<string, number>> = {
  'table-sizes/1': 20,
  'table-lengths/1': 12,
  'table-sizes-lengths/1': 15,
  'allowed-subset/1': 40,
  'allowed-subset-mixture/1': 40,
  'distinct-boltzmann/1': 25,
  'minpart-self-similar/1': 1.4,
  'bounded-self-similar/1': 1.4,
  'distinct-bounded-self-similar/1': 30,
  'box-mixture/1': 60,
  'narrow-range-mixture/1': 60,
  'distinct-self-similar/1': 48,
  // The tilt's Newton sums and the weights over k: 55-220 ns per unit (n = 8e8-9e8, K = 1.9e4-5.3e4).
  'conjugate-mixture/2': 100,
};

/** Nanoseconds per unit of setupWork of a method (wrapped ids by their base; else its step). */
export function nsPerSetupUnit(method: string): number {
  return NS_PER_SETUP_UNIT[baseMethod(method)] ?? nsPerStep(method);
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
