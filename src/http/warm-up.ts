import { prepareDefaultTables } from '../core/partitions/unrestricted.js';

/**
 * Work done once when a server starts, so that its first requests cost what later ones do. A
 * fresh Node process runs new code in its interpreter and compiles it once it is hot, and the
 * partition samplers fill their shared tables on first use: without this, the first request
 * for a new n took 5-10 times a repeated one (the serving section of `npm run bench`).
 *
 * 1. The shared tables are filled (prepareDefaultTables: pure caches, no sample changes).
 * 2. Requests go through the server itself (HTTP adapter, routing, query reading, family planning, the samplers
 *    and encoders, each response format), a new n in every round so that the per-family work is
 *    run as often as the per-sample work; sizes on both sides of the planner's switch from
 *    tables to the self-similar method. The n values are ones clients are unlikely to ask for:
 *    the app's family caches (64 entries each) keep nothing a real request would find ready.
 *
 * 3. Then many more rounds of small families only (FAMILY_ROUNDS), one single-sample request
 *    each in the default form and as=multiplicities: what a request for a new family does
 *    beyond a repeated one (the whole query parsed by zod, the family planned, its means and
 *    random-stream prefix, the ETag prefix) runs once per new family, so 12 rounds left it
 *    in the interpreter: in-process, after 24 runs those steps took ~260 µs per new n = 1000,
 *    after 200 runs ~125 µs, against ~350 µs for a whole repeated request (.scratch timing of
 *    the steps, medians of 9 new n each); the first request's CPU in a warmed in-process server
 *    fell from a median of 2.6 to 2.0 ms over 4 servers each (noisy: a machine at load ~8;
 *    bench: serving, "fresh server" rows). Each round costs about two small requests.
 *
 * Only the Node entry point calls this: a few hundred milliseconds of one core at start.
 */
const ROUNDS = 12;

/** The warm-up requests of one round; `r` makes every n new. */
function paths(r: number): string[] {
  return [
    `/v1/partitions?n=${987 - r}&count=3&seed=warm-up`,
    `/v1/partitions?n=${987 - r}&count=3&seed=warm-up&as=multiplicities&format=ndjson`,
    `/v1/partitions?n=${7777 + r}&seed=warm-up&format=text`,
    `/v1/partitions?n=${77777 + r}&seed=warm-up`,
    `/v1/partitions?n=${777777 + r}&seed=warm-up&as=multiplicities`,
    `/v1/partitions?n=${777777777 + r}&seed=warm-up&as=multiplicities`,
    `/v1/compositions?n=${777 + r}&count=3&seed=warm-up`,
    `/v1/compositions?n=${77777 + r}&seed=warm-up&format=ndjson`,
    `/v1/set-partitions?n=${77 + r}&count=3&seed=warm-up`,
  ];
}

/** Rounds of the per-family work alone (step 3), on small n: cheap, so many. */
const FAMILY_ROUNDS = 100;

/** The requests of family round `r`: a new n below the n of `paths` (876 ... 975). */
function familyPaths(r: number): string[] {
  return [`/v1/partitions?n=${975 - r}&seed=warm-up`, `/v1/partitions?n=${975 - r}&seed=warm-up&as=multiplicities`];
}

/**
 * Runs the warm-up; `get` answers one path (and reads the whole body, whatever the status: a
 * server with small limits may refuse some). The Node entry point passes real HTTP requests to
 * itself over loopback, so that its HTTP adapter is warmed as well as the app.
 */
export async function warmUp(get: (path: string) => Promise<unknown>): Promise<void> {
  prepareDefaultTables();
  for (let r = 0; r < ROUNDS; r++) {
    for (const path of paths(r)) await get(path);
  }
  for (let r = 0; r < FAMILY_ROUNDS; r++) {
    for (const path of familyPaths(r)) await get(path);
  }
}
