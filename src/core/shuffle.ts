import type { RandomSource } from './random.js';

const TWO_TO_32 = 2 ** 32;
const TWO_TO_MINUS_32 = 2 ** -32;

/** Above this bound the multiply-and-shift draw would not be exact in doubles (word × bound >= 2^53). */
const MULTIPLY_UP_TO = 2 ** 21;

/**
 * Shuffles `values` in place uniformly at random: Fisher–Yates (Knuth, TAOCP vol. 2, §3.4.2,
 * Algorithm P), position i swapped with a uniform j in 0..i, for i = n−1 down to 1.
 *
 * The j's come several from one 32-bit word w (Brackett-Rozinsky & Lemire, "Batched ranged
 * random integer generation", Software: Practice and Experience, 2025, whose main use is this
 * shuffle): for the bounds b_1 = i+1, b_2 = i, …, b_k with product P = b_1·…·b_k <= 2^32,
 * x_0 = w and j_t = floor(x_(t−1)·b_t / 2^32), x_t = x_(t−1)·b_t mod 2^32. Then
 * w·P = (j_1·b_2·…·b_k + … + j_k)·2^32 + x_k, so (j_1, …, j_k) are the mixed-radix digits of
 * floor(w·P / 2^32), and redrawing w while x_k < 2^32 mod P (Lemire's rejection, "Fast random
 * integer generation in an interval", ACM TOMACS 29, 2019) makes that exactly uniform on
 * [0, P): the k indices are independent and each exactly uniform on its range. Each product is
 * below 2^32·2^21 = 2^53, exact in doubles; 2^32 mod P is computed only when x_k < P (the
 * paper's shortcut). Bounds above 2^21 take one word each (the modulo of words below the
 * largest multiple of the bound). For n = 1000 that is 3 indices a word; bench: set partitions,
 * the "shuffle" row.
 */
export function shuffleInPlace(source: RandomSource, values: Int32Array): void {
  let i = values.length - 1;
  for (; i > 0 && i + 1 > MULTIPLY_UP_TO; i--) {
    const bound = i + 1;
    const limit = TWO_TO_32 - (TWO_TO_32 % bound);
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    swap(values, i, word % bound);
  }
  // 12! <= 2^32 < 13!: no word gives more than 12 indices.
  const picks = new Int32Array(12);
  while (i > 0) {
    // The bounds i+1, i, …, i+2−k whose product fits in 32 bits (every bound >= 2).
    let product = i + 1;
    let k = 1;
    while (i + 1 - k >= 2 && product * (i + 1 - k) <= TWO_TO_32) {
      product *= i + 1 - k;
      k++;
    }
    for (;;) {
      let x = source.nextUint32();
      for (let t = 0; t < k; t++) {
        const scaled = x * (i + 1 - t);
        const pick = Math.floor(scaled * TWO_TO_MINUS_32);
        picks[t] = pick;
        x = scaled - pick * TWO_TO_32;
      }
      if (x >= product || x >= TWO_TO_32 % product) break;
    }
    for (let t = 0; t < k; t++) swap(values, i - t, picks[t]);
    i -= k;
  }
}

function swap(values: Int32Array, a: number, b: number): void {
  const held = values[a];
  values[a] = values[b];
  values[b] = held;
}
