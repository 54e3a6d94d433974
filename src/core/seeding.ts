import seedrandom from 'seedrandom';
import type { RandomSource } from './random.js';

/**
 * Version of everything that decides what a seed produces. Any change to a sampler, to the
 * stream derivation below or to the planner's choice of method must bump it (and the golden
 * tests in test/golden.test.ts).
 */
export const ALGORITHM_VERSION = 1;

/** Characters a seed may use: URL-safe without escaping, so a seed pastes into a query string. */
export const SEED_PATTERN = /^[A-Za-z0-9._~:-]{1,64}$/;

/**
 * The random stream of one sample. It depends on (seed, sample index, family key, algorithm
 * version) only, so sample i is the same whatever count or start a request uses. Fields are
 * joined with a separator that cannot occur in a seed, so distinct tuples never share a stream.
 * Alea (Baagøe) is fast, pure JavaScript, and gives identical streams on every runtime.
 */
export function sampleSource(seed: string, index: number, familyKey: string): RandomSource {
  if (!SEED_PATTERN.test(seed)) {
    throw new RangeError(`seed must be 1-64 characters of A-Z a-z 0-9 . _ ~ : -, got ${JSON.stringify(seed)}`);
  }
  if (!Number.isSafeInteger(index) || index < 0) {
    throw new RangeError(`sample index must be a non-negative safe integer, got ${index}`);
  }
  return new AleaSource(seedrandom.alea(`partsmith/v${ALGORITHM_VERSION}|${familyKey}|${seed}|${index}`));
}

/**
 * A RandomSource over one alea stream. A class rather than an object of closures: a web request
 * often draws a single sample, so building the source is part of every request's cost.
 */
class AleaSource implements RandomSource {
  constructor(private readonly alea: seedrandom.PRNG) {}

  nextDouble(): number {
    return this.alea.double();
  }

  nextUint32(): number {
    return this.alea.int32() >>> 0;
  }
}
