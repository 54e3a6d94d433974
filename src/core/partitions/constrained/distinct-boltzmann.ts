import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { sizeCount, sizeGcd, type SizeSet } from './spec.js';
import { visitThinned } from './thinning.js';
import { localProbability, solveTilt, tiltMoments } from './tilt.js';

/** Cells of the small-size block table (8 bytes each): 2e6 cells = 16 MB. */
export const DISTINCT_BLOCK_CELL_LIMIT = 2_000_000;
/** At most this many sizes in the block (its counts stay below 2^900, inside double range). */
const BLOCK_MAX_SIZES = 900;

/**
 * Exact uniform partitions of n into distinct parts from an allowed set S (interval or list):
 * the product-form family prod_{k in S} (1 + q^k).
 *
 * Probabilistic divide-and-conquer (Arratia & DeSalvo 2016, CPC 25, §3) with a counted block:
 * the sizes split into B, the s smallest, and A, the rest. A is proposed from the Boltzmann law,
 * each size k present independently with probability x^k / (1 + x^k); its total R leaves
 * m = n - R for B. B's size under the same law has P(S_B = m) = Q(m) x^m / prod_{b in B}(1 + x^b),
 * Q(m) the number of subsets of B summing to m, tabulated exactly (doubles, additions only). The
 * proposal is accepted with probability P(S_B = m) / max_m' P(S_B = m'), and B is then a uniform
 * subset of sum m drawn from the table (Nijenhuis & Wilf 1978, ch. 10): every distinct
 * partition of n ends up with the same probability. P(accept) = P(N = n) / max P(S_B = m), about
 * sd(S_B) / sd(N): the table of the smallest ~250 sizes raises it from ~1/sd(N) (one size
 * determined) by a factor ~250^1.5 / sqrt(12).
 *
 * Method id "distinct-boltzmann/1". The caller guarantees the family is not empty.
 */
export class DistinctBoltzmann implements PartitionSampler {
  readonly method = 'distinct-boltzmann/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  readonly expectedProposals: number;
  readonly proposalCost: number;
  /** Table cells built at construction. */
  readonly setupWork: number;
  readonly t: number;
  /** Block sizes, ascending, and the sizes of A (list case) or A's interval start. */
  private readonly block: number[];
  private readonly rest: SizeSet | null;
  /** rows[j][m] = subsets of block[0..j) with sum m, m <= min(n, sum of block[0..j)). */
  private readonly rows: Float64Array[];
  /** Acceptance probability by residual m. */
  private readonly accept: Float64Array;
  private readonly denseEnd: number;
  /** For a list: A's sizes descending and their inclusion probabilities. */
  private readonly restDescending: Float64Array = new Float64Array(0);
  private readonly restProbability: Float64Array = new Float64Array(0);

  constructor(
    readonly sizes: SizeSet,
    readonly n: number,
    blockCellLimit: number = DISTINCT_BLOCK_CELL_LIMIT,
    tilt?: number,
  ) {
    const count = sizeCount(sizes);
    if (count < 1) throw new RangeError('distinct Boltzmann sampler needs at least one size');
    this.t = tilt ?? solveTilt(sizes, n, true);
    const t = this.t;
    // Choose the block: the smallest sizes while the table fits.
    const block: number[] = [];
    const at = (i: number) => (sizes.kind === 'list' ? sizes.values[i] : sizes.lo + i);
    let cells = 1;
    let sum = 0;
    while (block.length < count && block.length < BLOCK_MAX_SIZES) {
      const b = at(block.length);
      const width = Math.min(n, sum + b) + 1;
      if (cells + width > blockCellLimit) break;
      block.push(b);
      sum += b;
      cells += width;
    }
    this.block = block;
    this.setupWork = cells;
    if (block.length === count) this.rest = null;
    else if (sizes.kind === 'list') this.rest = { kind: 'list', values: sizes.values.slice(block.length) };
    else this.rest = { kind: 'interval', lo: sizes.lo + block.length, hi: sizes.hi };
    if (this.rest !== null && this.rest.kind === 'list') {
      // Inclusion probabilities of the listed sizes of A, in the (descending) order they are tried.
      const v = this.rest.values;
      this.restDescending = Float64Array.from(v).reverse();
      this.restProbability = this.restDescending.map((k) => 1 / (1 + Math.exp(-this.t * k)));
    }

    const rows: Float64Array[] = [new Float64Array([1])];
    for (let j = 1; j <= block.length; j++) {
      const b = block[j - 1];
      const prev = rows[j - 1];
      const row = new Float64Array(Math.min(n, prev.length - 1 + b) + 1);
      // row[m] = prev[m] + prev[m - b]: a copy, then one shifted addition.
      row.set(prev.length <= row.length ? prev : prev.subarray(0, row.length));
      const end = Math.min(row.length, prev.length + b);
      for (let m = b; m < end; m++) row[m] += prev[m - b];
      rows.push(row);
    }
    this.rows = rows;
    const top = rows[block.length];
    // log P(S_B = m) up to a constant: ln Q(m) + t m.
    let best = -Infinity;
    for (let m = 0; m < top.length; m++) if (top[m] > 0) best = Math.max(best, Math.log(top[m]) + t * m);
    const accept = new Float64Array(top.length);
    for (let m = 0; m < top.length; m++) {
      accept[m] = top[m] > 0 ? (this.rest === null ? 1 : Math.exp(Math.log(top[m]) + t * m - best)) : 0;
    }
    this.accept = accept;
    this.denseEnd = t < 0 ? Math.floor(Math.log(3) / -t) : Infinity; // p_k >= 1/4 iff x^k >= 1/3

    const moments = tiltMoments(sizes, t, true);
    this.expectedLength = moments.parts;
    this.expectedDistinct = moments.parts;
    if (this.rest === null) {
      this.expectedProposals = 1;
      this.proposalCost = 0;
    } else {
      // max_m P(S_B = m) = exp(best) / prod (1 + x^b).
      let logNorm = 0;
      for (const b of block) logNorm += Math.log1p(Math.exp(t * b));
      const maxBlock = Math.exp(best - logNorm);
      const pn = localProbability(moments.variance, sizeGcd(sizes));
      this.expectedProposals = Math.max(1, maxBlock / pn);
      const rest = this.rest;
      if (rest.kind === 'list' || t >= 0) {
        this.proposalCost = sizeCount(rest);
      } else {
        const dense = Math.max(0, Math.min(rest.hi, this.denseEnd) - rest.lo + 1);
        const tail = (2 * Math.exp(t * Math.max(rest.lo, this.denseEnd + 1))) / -Math.expm1(t);
        this.proposalCost = dense + Math.min(tail, rest.hi - rest.lo + 1) + 2;
      }
    }
    this.expectedWork = this.expectedProposals * this.proposalCost + block.length + this.expectedLength;
  }

  sample(source: RandomSource): Partition {
    const { n, t } = this;
    const rest = this.rest;
    const p = (k: number) => 1 / (1 + Math.exp(-t * k));
    // The sizes drawn so far (each at most once); a Map only for the accepted draw.
    const chosen: number[] = [];
    for (;;) {
      chosen.length = 0;
      let total = 0;
      const take = (k: number): boolean => {
        chosen.push(k);
        total += k;
        return total <= n;
      };
      let alive = true;
      if (rest !== null) {
        if (rest.kind === 'list') {
          const v = this.restDescending;
          const q = this.restProbability;
          for (let i = 0; i < v.length && alive; i++) if (source.nextDouble() < q[i]) alive = take(v[i]);
        } else if (t >= 0) {
          for (let k = rest.hi; k >= rest.lo && alive; k--) if (source.nextDouble() < p(k)) alive = take(k);
        } else {
          const denseTop = Math.min(rest.hi, this.denseEnd);
          for (let k = rest.lo; k <= denseTop && alive; k++) if (source.nextDouble() < p(k)) alive = take(k);
          if (alive && rest.hi > denseTop) alive = visitThinned(source, Math.max(rest.lo, denseTop + 1), rest.hi, p, take);
        }
      }
      if (!alive) continue;
      let m = n - total;
      if (m >= this.accept.length) continue;
      if (!(source.nextDouble() < this.accept[m])) continue;
      // B: a uniform subset of the block with sum m, by sequential choice on the table.
      for (let j = this.block.length; j >= 1 && m > 0; j--) {
        const b = this.block[j - 1];
        const prev = this.rows[j - 1];
        const here = this.rows[j][m];
        const without = m < prev.length ? prev[m] : 0;
        if (source.nextDouble() * here >= without) {
          chosen.push(b);
          m -= b;
        }
      }
      const sizes = chosen.sort((a, b) => b - a);
      return { sizes, multiplicities: sizes.map(() => 1) };
    }
  }
}
