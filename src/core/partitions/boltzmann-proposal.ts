import type { RandomSource } from '../random.js';

/**
 * Boltzmann proposals for partitions: independent multiplicities X_k with
 *   P(X_k = j) = (1 − x^k) x^{jk},  j = 0, 1, 2, ...
 * for the part sizes k = start, start + step, start + 2·step, ... (step 1: all sizes from start;
 * start 1, step 2: the odd sizes). A partition drawn this way has probability proportional to
 * x^{size}, so conditioned on its size it is uniform (Fristedt 1993; Duchon, Flajolet, Louchard &
 * Schaeffer 2004).
 *
 * Only the sizes that occur are visited, in two phases:
 *
 * 1. Direct phase, while q = x^k > DIRECT_THRESHOLD: one uniform U in (0, 1] per size.
 *    X = 0 if U >= q, X = 1 if q² <= U < q, else X = floor(log U / log q). Exact because
 *    P(floor(log U / log q) >= j) = P(U <= q^j) = q^j = P(X >= j) for every j, and the first
 *    two comparisons are that same event for j = 1, 2 (so the logarithm is only taken when X >= 2).
 *
 * 2. Thinning phase (Lewis & Shedler 1979, for Bernoulli events): the events "size k occurs"
 *    are independent with probabilities q_k = x^k, decreasing in k. Holding a bound b >= q_j for
 *    all j still ahead (b = q at the next position), the first success of Bernoulli(b) trials is a
 *    geometric jump G = floor(log U / log(1 − b)); the candidate size j is accepted with
 *    probability q_j / b, giving exactly Bernoulli(q_j) at j and no event in between (each skipped
 *    position had a Bernoulli(b) failure, hence no event). The bound is then renewed at j + step;
 *    it depends only on the past, so the events stay independent. Given that size j occurs, X_j is
 *    1 + Geometric by memorylessness: P(X_j >= 1 + i | X_j >= 1) = q_j^i, drawn as in phase 1.
 *    The loop ends when the bound is 0 in doubles, or the next candidate lies beyond 2^52, where
 *    x^j underflows to exactly 0 for every x this service uses (|log x| >= π/√(6e9) > 745/2^52).
 *
 * If the running size exceeds `budget` the draw stops early and returns OVER: every caller rejects
 * such a proposal, so stopping early does not change what an accepted proposal looks like.
 *
 * The buffers are reused between draws (one instance per sampler call chain); read them only
 * until the next draw.
 */
export class BoltzmannProposal {
  /** Returned by draw() when the size went over the budget. */
  static readonly OVER = -1;
  /** Phase 1 runs while x^k exceeds this (chosen by measurement: logs vs uniforms per size). */
  static readonly DIRECT_THRESHOLD = 0.3;

  constructor(readonly directThreshold: number = BoltzmannProposal.DIRECT_THRESHOLD) {}

  /** Part sizes that occurred, ascending; valid for indices < count. */
  sizes: Float64Array = new Float64Array(256);
  /** Their multiplicities (>= 1). */
  multiplicities: Float64Array = new Float64Array(256);
  /** Number of distinct sizes in the last draw. */
  count = 0;
  /** Number of part sizes visited by the last draw (phase-1 sizes plus phase-2 candidates). */
  visited = 0;

  /**
   * Draws X_k for k = start + i·step <= end at parameter x = e^{logX} (logX < 0). Returns the
   * size Σ k·X_k, or OVER as soon as it exceeds budget. With end = Infinity (the default) the
   * uniforms consumed are those of the unbounded draw; a finite end stops both phases there
   * (the thinning phase does not start when phase 1 already passed end).
   */
  draw(source: RandomSource, logX: number, start: number, step: number, budget: number, end = Infinity): number {
    if (!(logX < 0)) throw new RangeError(`log x must be negative, got ${logX}`);
    let count = 0;
    let total = 0;
    let visited = 0;
    let k = start;
    let logq = k * logX;
    let q = Math.exp(logq);
    const ratio = Math.exp(step * logX);
    let sinceAnchor = 0;
    const threshold = this.directThreshold;
    // Phase 1: one uniform per size.
    while (q > threshold && k <= end) {
      visited++;
      const u = 1 - source.nextDouble(); // uniform in (0, 1]
      if (u < q) {
        let mult = 1;
        if (u < q * q) {
          mult = Math.floor(Math.log(u) / logq);
          if (mult < 2) mult = 2; // only rounding can push it below; the event says X >= 2
        }
        total += k * mult;
        if (total > budget) {
          this.count = count;
          this.visited = visited;
          return BoltzmannProposal.OVER;
        }
        if (count === this.sizes.length) this.grow();
        this.sizes[count] = k;
        this.multiplicities[count] = mult;
        count++;
      }
      k += step;
      logq = k * logX;
      // x^k by one multiplication per size, re-anchored with exp every REANCHOR sizes so the
      // relative error stays below REANCHOR rounding steps (~1e-14).
      if (++sinceAnchor === REANCHOR) {
        q = Math.exp(logq);
        sinceAnchor = 0;
      } else q *= ratio;
    }
    // Phase 2: thinning with the bound b = q at the next unvisited size k.
    let bound = k <= end ? q : 0;
    const last = Math.min(2 ** 52, end);
    while (bound > 0) {
      const u = 1 - source.nextDouble();
      const jump = Math.floor(Math.log(u) / Math.log1p(-bound));
      k += jump * step;
      if (!(k <= last)) break;
      visited++;
      logq = k * logX;
      q = Math.exp(logq);
      if (source.nextDouble() * bound < q) {
        const v = 1 - source.nextDouble();
        let mult = 1;
        if (v < q) {
          mult = 1 + Math.floor(Math.log(v) / logq);
          if (mult < 2) mult = 2;
        }
        total += k * mult;
        if (total > budget) {
          this.count = count;
          this.visited = visited;
          return BoltzmannProposal.OVER;
        }
        if (count === this.sizes.length) this.grow();
        this.sizes[count] = k;
        this.multiplicities[count] = mult;
        count++;
      }
      k += step;
      bound = q * ratio; // x^{k+step}: one rounding from the exact q at the candidate
    }
    this.count = count;
    this.visited = visited;
    return total;
  }

  private grow(): void {
    const sizes = new Float64Array(this.sizes.length * 2);
    sizes.set(this.sizes);
    const mults = new Float64Array(this.multiplicities.length * 2);
    mults.set(this.multiplicities);
    this.sizes = sizes;
    this.multiplicities = mults;
  }
}

const REANCHOR = 32;

/** The Boltzmann parameter log x = −π/√(6n) that makes the mean size ≈ n (Fristedt 1993). */
export function boltzmannLogX(n: number): number {
  return -Math.PI / Math.sqrt(6 * n);
}
