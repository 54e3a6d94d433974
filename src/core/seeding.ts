import seedrandom from 'seedrandom';
import { Murmur3x86_128Prefix } from './murmur3.js';
import type { RandomSource } from './random.js';

/**
 * Version of everything that decides what a seed produces. Any change to a sampler, to the
 * stream derivation below or to the planner's choice of method must bump it (and the golden
 * tests: test/partitions/golden.test.ts, test/constrained/golden.test.ts, the recorded
 * compositions in test/compositions/properties.test.ts and test/set-partitions/golden.test.ts).
 *
 * 1: Alea seeded by its own string hash (Mash) of the stream key.
 * 2: Alea's state set from MurmurHash3 of the stream key (same key): Mash costs ~70 ns per
 *    character, three passes over a ~55-character key, and was the largest single cost of a
 *    small request. Unrestricted partitions use the table method up to n = 1000 (was 500), also
 *    as the base of the self-similar recursion, and it draws each distinct size's multiplicity
 *    at once (table-recursive.ts).
 * 3: same stream derivation (the version is part of every stream key, so every stream changed);
 *    the constrained planner serves families with `length` or `maxLength` by new methods
 *    (box-subset, box-mixture, allowed-length-boltzmann, allowed-subset, samplers of the family
 *    without one constraint plus rejection) and plans a maxLength no member can reach as absent
 *    (plan-length.ts).
 * 4: same stream derivation; every stream changed with the version. New large-n methods for
 *    distinct parts and for a smallest-part bound (issue 13) change what the planner picks for
 *    families it already served.
 */
export const ALGORITHM_VERSION = 4;

/** Characters a seed may use: URL-safe without escaping, so a seed pastes into a query string. */
export const SEED_PATTERN = /^[A-Za-z0-9._~:-]{1,64}$/;

/** 2^-32: Alea keeps its three lags as 32-bit fractions in [0, 1). */
const TWO_TO_MINUS_32 = 2 ** -32;

/**
 * The random stream of one sample. It depends on (seed, sample index, family key, algorithm
 * version) only, so sample i is the same whatever count or start a request uses.
 * (`new SampleStreams(familyKey).source(seed, index)`; keep the SampleStreams when drawing
 * many samples of one family.)
 */
export function sampleSource(seed: string, index: number, familyKey: string): RandomSource {
  return new SampleStreams(familyKey).source(seed, index);
}

/**
 * The random streams of one family's samples.
 *
 * The stream key `partsmith/v<version>|<family key>|<seed>|<index>` joins the fields with a
 * separator that occurs in none of them, so distinct tuples have distinct keys. MurmurHash3
 * (x86, 128-bit; murmur3.ts) of the key gives three 32-bit words, which become Alea's lags
 * s0, s1, s2 with carry c = 1 — the same kind of state Alea's own seeding produces (three
 * 32-bit fractions and c = 1), and never the generator's fixed points, which need c = 0 or
 * c = 2091638. Distinct keys share a stream only if 96 hash bits collide (probability ~2^-96 per
 * pair). The generator is seedrandom's Alea (Baagøe), restored through its documented `state`
 * option: pure JavaScript, identical streams on every runtime.
 *
 * The key's prefix `partsmith/v<version>|<family key>|` is the same for every sample of the
 * family, and most of the key: it is hashed once, here (Murmur3x86_128Prefix); the hash of a
 * key is the same either way.
 */
export class SampleStreams {
  private readonly prefix: Murmur3x86_128Prefix;

  constructor(readonly familyKey: string) {
    this.prefix = new Murmur3x86_128Prefix(`partsmith/v${ALGORITHM_VERSION}|${familyKey}|`);
  }

  /** The stream of sample `index` of `seed`. */
  source(seed: string, index: number): RandomSource {
    if (!SEED_PATTERN.test(seed)) {
      throw new RangeError(`seed must be 1-64 characters of A-Z a-z 0-9 . _ ~ : -, got ${JSON.stringify(seed)}`);
    }
    if (!Number.isSafeInteger(index) || index < 0) {
      throw new RangeError(`sample index must be a non-negative safe integer, got ${index}`);
    }
    const [h1, h2, h3] = this.prefix.hash(`${seed}|${index}`);
    const state = { c: 1, s0: h1 * TWO_TO_MINUS_32, s1: h2 * TWO_TO_MINUS_32, s2: h3 * TWO_TO_MINUS_32 };
    return new AleaSource(seedrandom.alea('', { state }));
  }
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
