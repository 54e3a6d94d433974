/**
 * The randomness a sampler consumes. Samplers never call Math.random: the caller injects a
 * source, so every sample is a pure function of the source's seed.
 */
export interface RandomSource {
  /** A uniform double in [0, 1) carrying 53 random bits. */
  nextDouble(): number;
  /** A uniform integer in [0, 2^32). */
  nextUint32(): number;
}

/** A uniform double in (0, 1]: safe to take the logarithm of. */
export function nextOpenDouble(source: RandomSource): number {
  return 1 - source.nextDouble();
}

/** A uniform integer in [0, bound) for 1 <= bound <= 2^53, by rejection (no modulo bias). */
export function nextBelow(source: RandomSource, bound: number): number {
  if (!Number.isInteger(bound) || bound < 1 || bound > 2 ** 53) {
    throw new RangeError(`bound must be an integer in [1, 2^53], got ${bound}`);
  }
  if (bound <= 2 ** 32) {
    // Accept words below the largest multiple of bound that fits in 32 bits.
    const limit = 2 ** 32 - (2 ** 32 % bound);
    for (;;) {
      const word = source.nextUint32();
      if (word < limit) return word % bound;
    }
  }
  const limit = 2 ** 53 - (2 ** 53 % bound);
  for (;;) {
    const value = source.nextUint32() * 2 ** 21 + (source.nextUint32() >>> 11);
    if (value < limit) return value % bound;
  }
}

/** A uniform BigInt in [0, bound) for bound >= 1, drawing 32 bits at a time and rejecting overshoot. */
export function nextBigBelow(source: RandomSource, bound: bigint): bigint {
  if (bound < 1n) throw new RangeError(`bound must be >= 1, got ${bound}`);
  const bits = bound.toString(2).length;
  const words = Math.ceil(bits / 32);
  const excess = BigInt(words * 32 - bits);
  for (;;) {
    let value = 0n;
    for (let i = 0; i < words; i++) value = (value << 32n) | BigInt(source.nextUint32());
    value >>= excess;
    if (value < bound) return value;
  }
}
