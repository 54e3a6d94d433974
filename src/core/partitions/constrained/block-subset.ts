import type { RandomSource } from '../../random.js';

/** Positions per block. */
export const BLOCK = 64;

/**
 * A uniform k-subset of [0, M) drawn in blocks of BLOCK positions, its sum known before its
 * positions: box-rotation.ts rejects most proposals on the sum alone, so a proposal costs
 * O(M / BLOCK) draws instead of O(k).
 *
 * 1. Block counts: every position is taken independently with probability p = k / M (each
 *    block's count from its binomial law, one alias draw), then uniformly random elements are
 *    removed, or uniformly random free positions added, until k are taken. The law of the set
 *    is invariant under permutations of the positions and its size is k, so it is the uniform
 *    k-subset; only the counts are tracked, since given the counts each block holds a uniform
 *    subset of that size (a uniform element is a uniform position kept with probability
 *    count / length of its block).
 * 2. Internal sums: given its count a, a block's sum of positions minus a(a-1)/2 has the law of
 *    the coefficients of the Gaussian binomial [length choose a]_q (Andrews 1976, Thm 3.1), one
 *    alias draw from exact counts (Walker's alias method, Vose 1991, IEEE TSE 17, 972).
 * 3. Positions, on demand per block: the uniform a-subset of the block with that internal sum,
 *    position by position from the top with the exact counts of the prefixes.
 *
 * The counts of subsets are doubles (exact below 2^53; the largest, near C(64, 32) / 190,
 * rounded to 53 bits).
 */
export class BlockSubset {
  readonly blocks: number;
  /** Elements per block (after draw). */
  readonly counts: Int32Array;
  /** Internal sums per block (after draw). */
  readonly sums: Float64Array;
  /** Expected draws per proposal (block counts, adjustments, internal sums). */
  readonly expectedDraws: number;
  private readonly lastLength: number;
  private readonly countAlias: Alias[];

  private readonly positions: Int32Array;
  private readonly placed: Int32Array;
  private generation = 0;

  constructor(
    readonly M: number,
    readonly k: number,
    private readonly table: PrefixSubsetCounts = PrefixSubsetCounts.shared(),
  ) {
    this.blocks = Math.ceil(M / BLOCK);
    this.lastLength = M - (this.blocks - 1) * BLOCK;
    this.counts = new Int32Array(this.blocks);
    this.sums = new Float64Array(this.blocks);
    const p = k / M;
    this.countAlias = [BLOCK, this.lastLength].map((length) => {
      const weights: number[] = [];
      for (let a = 0; a <= length; a++) weights.push(Math.exp(logChoose(length, a) + a * Math.log(p) + (length - a) * Math.log1p(-p)));
      return new Alias(weights);
    });
    this.positions = new Int32Array(this.blocks * BLOCK);
    this.placed = new Int32Array(this.blocks);
    this.expectedDraws = BlockSubset.expectedDraws(M, k);
  }

  /** Draws per call of draw(): two per block, and E|K - k| ~ 0.8 sd adjustments of 1/p or 1/(1-p) tries. */
  static expectedDraws(M: number, k: number): number {
    const p = k / M;
    const sd = Math.sqrt(M * p * (1 - p));
    return 2 * Math.ceil(M / BLOCK) + (0.8 * sd * (1 / p + 1 / (1 - p))) / 2 + 2;
  }

  private lengthOf(g: number): number {
    return g === this.blocks - 1 ? this.lastLength : BLOCK;
  }

  /** Draws the counts and internal sums; returns the sum of the subset's elements. */
  draw(source: RandomSource): number {
    this.generation++;
    const { blocks, counts, sums, k, M } = this;
    let total = 0;
    const full = this.countAlias[0];
    for (let g = 0; g < blocks - 1; g++) total += counts[g] = full.draw(source);
    total += counts[blocks - 1] = this.countAlias[1].draw(source);
    while (total !== k) {
      const u = Math.floor(source.nextDouble() * M);
      const g = Math.floor(u / BLOCK);
      const taken = u - g * BLOCK < counts[g];
      if (total > k && taken) {
        counts[g]--;
        total--;
      } else if (total < k && !taken) {
        counts[g]++;
        total++;
      }
    }
    let sum = 0;
    const table = this.table;
    for (let g = 0; g < blocks; g++) {
      const a = counts[g];
      const sigma = a === 0 ? 0 : table.sumTable(g === blocks - 1 ? this.lastLength : BLOCK, a).draw(source);
      sums[g] = sigma;
      sum += g * BLOCK * a + (a * (a - 1)) / 2 + sigma;
    }
    return sum;
  }

  /** The positions (absolute, ascending) of block g, drawn once per draw. */
  private place(g: number, source: RandomSource): number {
    const base = g * BLOCK;
    if (this.placed[g] === this.generation) return base;
    this.placed[g] = this.generation;
    this.table.drawPositions(source, this.lengthOf(g), this.counts[g], this.sums[g], this.positions, base);
    return base;
  }

  /** Elements in [from, to), 0 <= from <= to <= M (placing the blocks the ends cut). */
  countRange(source: RandomSource, from: number, to: number): number {
    if (from >= to) return 0;
    let total = 0;
    const first = Math.floor(from / BLOCK);
    const last = Math.floor((to - 1) / BLOCK);
    for (let g = first; g <= last; g++) {
      const start = g * BLOCK;
      const end = start + this.lengthOf(g);
      if (from <= start && end <= to) total += this.counts[g];
      else {
        const base = this.place(g, source);
        for (let i = 0; i < this.counts[g]; i++) {
          const e = this.positions[base + i];
          if (e >= from && e < to) total++;
        }
      }
    }
    return total;
  }

  /** Calls visit(e) for the elements in [from, to), ascending (placing their blocks). */
  forEach(source: RandomSource, from: number, to: number, visit: (e: number) => void): void {
    if (from >= to) return;
    const first = Math.floor(from / BLOCK);
    const last = Math.floor((to - 1) / BLOCK);
    for (let g = first; g <= last; g++) {
      if (this.counts[g] === 0) continue;
      const base = this.place(g, source);
      for (let i = 0; i < this.counts[g]; i++) {
        const e = this.positions[base + i];
        if (e >= from && e < to) visit(e);
      }
    }
  }
}

/**
 * Counts of j-subsets of [0, i) by internal sum (sum of elements - j(j-1)/2, in [0, j(i-j)]),
 * for i <= BLOCK: C(i, j, s) = C(i-1, j, s) + C(i-1, j-1, s - (i - j)) (the second term: i-1
 * taken). With one alias table per (i, j) for i in the block lengths used.
 */
export class PrefixSubsetCounts {
  private static instance: PrefixSubsetCounts | null = null;
  /** One table serves every sampler (constants; built on first use, ~0.7e6 doubles). */
  static shared(): PrefixSubsetCounts {
    return (PrefixSubsetCounts.instance ??= new PrefixSubsetCounts());
  }

  private readonly offsets: Int32Array;
  private readonly counts: Float64Array;
  private readonly alias: Array<Alias | undefined> = [];

  private constructor() {
    const offsets = new Int32Array((BLOCK + 1) * (BLOCK + 1));
    let size = 0;
    for (let i = 0; i <= BLOCK; i++) {
      for (let j = 0; j <= i; j++) {
        offsets[i * (BLOCK + 1) + j] = size;
        size += j * (i - j) + 1;
      }
    }
    const counts = new Float64Array(size);
    counts[0] = 1;
    for (let i = 1; i <= BLOCK; i++) {
      for (let j = 0; j <= i; j++) {
        const at = offsets[i * (BLOCK + 1) + j];
        // i - 1 not taken: C(i-1, j, s), s <= j(i-1-j).
        if (j <= i - 1) {
          const from = offsets[(i - 1) * (BLOCK + 1) + j];
          counts.set(counts.subarray(from, from + j * (i - 1 - j) + 1), at);
        }
        // i - 1 taken: C(i-1, j-1, t) at s = t + (i - j), t <= (j-1)(i-j).
        if (j >= 1) {
          const from = offsets[(i - 1) * (BLOCK + 1) + j - 1];
          const shift = at + i - j;
          const width = (j - 1) * (i - j);
          for (let t = 0; t <= width; t++) counts[shift + t] += counts[from + t];
        }
      }
    }
    this.offsets = offsets;
    this.counts = counts;
  }

  /** C(i, j, s). */
  count(i: number, j: number, s: number): number {
    if (j < 0 || j > i || s < 0 || s > j * (i - j)) return 0;
    return this.counts[this.offsets[i * (BLOCK + 1) + j] + s];
  }

  /** Alias table of the internal sum of a uniform j-subset of [0, i) (built on first use). */
  sumTable(i: number, j: number): Alias {
    const key = i * (BLOCK + 1) + j;
    let table = this.alias[key];
    if (table === undefined) {
      const at = this.offsets[key];
      table = new Alias(this.counts.subarray(at, at + j * (i - j) + 1));
      this.alias[key] = table;
    }
    return table;
  }

  /** Writes a uniform j-subset of [0, i) with internal sum s, plus base, ascending, to out[base..]. */
  drawPositions(source: RandomSource, i: number, j: number, s: number, out: Int32Array, base: number): void {
    let slot = j;
    while (j > 0) {
      if (j === i) {
        for (let e = i - 1; e >= 0; e--) out[base + --slot] = base + e;
        return;
      }
      // Take position i - 1 with probability C(i-1, j-1, s-(i-j)) / C(i, j, s).
      const take = this.count(i - 1, j - 1, s - (i - j));
      if (take > 0 && source.nextDouble() * this.count(i, j, s) < take) {
        out[base + --slot] = base + i - 1;
        s -= i - j;
        j--;
      }
      i--;
    }
  }
}

/** Walker's alias method (Vose's construction, typed arrays): one uniform per draw. */
export class Alias {
  private readonly probability: Float64Array;
  private readonly other: Int32Array;

  constructor(weights: ArrayLike<number>) {
    const n = weights.length;
    let total = 0;
    for (let i = 0; i < n; i++) total += weights[i];
    const scaled = new Float64Array(n);
    for (let i = 0; i < n; i++) scaled[i] = (weights[i] * n) / total;
    const probability = new Float64Array(n);
    const other = new Int32Array(n);
    // Two stacks in one array: small from the front, large from the back.
    const stack = new Int32Array(n);
    let small = 0;
    let large = n;
    for (let i = 0; i < n; i++) {
      if (scaled[i] < 1) stack[small++] = i;
      else stack[--large] = i;
    }
    while (small > 0 && large < n) {
      const s = stack[--small];
      const l = stack[large];
      probability[s] = scaled[s];
      other[s] = l;
      scaled[l] -= 1 - scaled[s];
      if (scaled[l] < 1) {
        large++;
        stack[small++] = l;
      }
    }
    // What remains is 1 up to rounding.
    while (small > 0) {
      const i = stack[--small];
      probability[i] = 1;
      other[i] = i;
    }
    while (large < n) {
      const i = stack[large++];
      probability[i] = 1;
      other[i] = i;
    }
    this.probability = probability;
    this.other = other;
  }

  draw(source: RandomSource): number {
    const x = source.nextDouble() * this.probability.length;
    const i = Math.floor(x);
    return x - i < this.probability[i] ? i : this.other[i];
  }
}

function logChoose(n: number, j: number): number {
  let total = 0;
  for (let i = 1; i <= j; i++) total += Math.log((n - j + i) / i);
  return total;
}

