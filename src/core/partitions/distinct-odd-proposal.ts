import { nextOpenDouble, type RandomSource } from '../random.js';

/**
 * Boltzmann proposals for sets of distinct odd parts: each odd size k >= start is present
 * independently with probability p_k = x^k / (1 + x^k). A set A drawn this way has probability
 * Π_{k∈A} x^k · Π_k 1/(1 + x^k) ∝ x^{|A|}, so conditioned on its size it is uniform (Fristedt
 * 1993; Duchon, Flajolet, Louchard & Schaeffer 2004). Only the sizes that occur are visited,
 * as in boltzmann-proposal.ts:
 *
 * 1. Direct phase, while p_k > DIRECT_THRESHOLD: one uniform per size.
 * 2. Thinning phase (Lewis & Shedler 1979; Devroye 1986, §VI.2): p_k decreases in k; with the
 *    bound b = p at the next unvisited size, the first success of Bernoulli(b) trials lies a
 *    geometric number G = floor(log U / log(1 − b)) of sizes ahead; that candidate j is kept with
 *    probability p_j / b, which gives exactly Bernoulli(p_j) at j and no part at the skipped
 *    sizes. The bound is renewed at j + step (a stopping time), so the trials stay independent.
 *    The loop ends when the bound is 0 in doubles or the candidate lies beyond 2^52.
 *
 * If the running size exceeds `budget` the draw stops early and returns OVER (every caller
 * rejects such a proposal). The buffer is reused between draws: read it only until the next draw.
 */
export class DistinctOddProposal {
  static readonly OVER = -1;
  /** Phase 1 runs while p_k exceeds this. */
  static readonly DIRECT_THRESHOLD = 0.25;

  /** Part sizes that occurred, ascending; valid for indices < count. */
  sizes: Float64Array = new Float64Array(256);
  /** Number of parts in the last draw. */
  count = 0;
  /** Part sizes visited by the last draw (phase-1 sizes plus phase-2 candidates). */
  visited = 0;

  /**
   * Draws the parts k = start, start + step, ... <= last at x = e^{logX}; returns their sum or
   * OVER. (last = Infinity draws exactly as without it.) x >= 1 is allowed with a finite last:
   * then every p_k >= 1/2 and all sizes are drawn one by one.
   */
  draw(source: RandomSource, logX: number, start: number, step: number, budget: number, last = Infinity): number {
    if (!(logX < 0) && !(logX >= 0 && Number.isFinite(logX) && last !== Infinity)) {
      throw new RangeError(`log x must be negative (or finite with a largest size), got ${logX}`);
    }
    let count = 0;
    let total = 0;
    let visited = 0;
    let k = start;
    // p_k = 1 / (1 + x^{-k}); x^{-k} = e^{-k logX} grows, kept by multiplication, re-anchored.
    let inv = Math.exp(-k * logX);
    const ratio = Math.exp(-step * logX);
    let sinceAnchor = 0;
    let p = 1 / (1 + inv);
    while (p > DistinctOddProposal.DIRECT_THRESHOLD && k <= last) {
      visited++;
      if (source.nextDouble() < p) {
        total += k;
        if (total > budget) return this.over(count, visited);
        if (count === this.sizes.length) this.grow();
        this.sizes[count++] = k;
      }
      k += step;
      if (++sinceAnchor === REANCHOR) {
        inv = Math.exp(-k * logX);
        sinceAnchor = 0;
      } else inv *= ratio;
      p = 1 / (1 + inv);
    }
    let bound = k <= last ? p : 0;
    while (bound > 0) {
      const jump = Math.floor(Math.log(nextOpenDouble(source)) / Math.log1p(-bound));
      k += jump * step;
      if (!(k <= 2 ** 52) || k > last) break;
      visited++;
      const pk = 1 / (1 + Math.exp(-k * logX));
      if (source.nextDouble() * bound < pk) {
        total += k;
        if (total > budget) return this.over(count, visited);
        if (count === this.sizes.length) this.grow();
        this.sizes[count++] = k;
      }
      k += step;
      bound = 1 / (1 + Math.exp(-k * logX));
    }
    this.count = count;
    this.visited = visited;
    return total;
  }

  private over(count: number, visited: number): number {
    this.count = count;
    this.visited = visited;
    return DistinctOddProposal.OVER;
  }

  private grow(): void {
    const sizes = new Float64Array(this.sizes.length * 2);
    sizes.set(this.sizes);
    this.sizes = sizes;
  }
}

const REANCHOR = 32;
