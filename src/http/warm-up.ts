/**
 * Work done once when a server starts, so that its first requests cost what later ones do: a
 * fresh Node process runs new code in its interpreter first and compiles it once it is hot, so
 * without this the first request for a new n took 5-10 times a repeated one (see the serving
 * section of `npm run bench`). Requests go through the app itself (routing, query reading, the
 * samplers and encoders, every response format), for sizes on both sides of the planner's
 * switch from tables to the self-similar method, with n values no client is likely to ask for:
 * the app's caches hold no family a real request would then find ready-made.
 *
 * Only the node entry point calls this; its cost is a few hundred milliseconds of CPU at start.
 */
const PATHS: readonly string[] = [
  '/v1/partitions?n=777&count=3&seed=warm-up',
  '/v1/partitions?n=777&count=3&seed=warm-up&as=multiplicities&format=ndjson',
  '/v1/partitions?n=7777&seed=warm-up&format=text',
  '/v1/partitions?n=777777&seed=warm-up&as=multiplicities',
  '/v1/partitions?n=777777777&seed=warm-up&as=multiplicities',
  '/v1/partitions?n=77777&seed=warm-up',
  '/v1/compositions?n=777&count=3&seed=warm-up',
  '/v1/compositions?n=77777&seed=warm-up&format=ndjson',
  '/v1/set-partitions?n=77&count=3&seed=warm-up',
];

/** Rounds over PATHS: enough calls for V8 to optimise the hot loops. */
const ROUNDS = 12;

export async function warmUp(fetch: (request: Request) => Response | Promise<Response>): Promise<void> {
  for (let round = 0; round < ROUNDS; round++) {
    for (const path of PATHS) {
      // A new seed each round: the same sample would be the same work, but not new draws.
      const response = await fetch(new Request(`http://warm-up.invalid${path}-${round}`));
      await response.arrayBuffer();
    }
  }
}
