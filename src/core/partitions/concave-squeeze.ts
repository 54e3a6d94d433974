import { firstAtLeast } from './falling-differences.js';
/**
 * Bounds on a concave function from the values already computed: the squeeze of a rejection
 * test (Marsaglia 1977, "The squeeze method for generating gamma variates"; for log-concave
 * targets, Gilks & Wild 1992, "Adaptive rejection sampling for Gibbs sampling", whose chords
 * and extended chords are these bounds, here on exact values remembered as they are computed).
 *
 * For f concave on the points held and m between known points l1 < l2 <= m <= r1 < r2:
 *   lower(m) = the chord through (l2, f(l2)) and (r1, f(r1)) at m            (concavity),
 *   upper(m) = min(line through l1, l2 extended to m; line through r1, r2 extended to m).
 * A self-similar level's acceptance test u < exp(w(m) − w(best)) is then decided without
 * computing the count at m whenever u falls outside [exp(lower − margin), exp(upper + margin)];
 * the margin covers the rounding of the remembered values (~1e-11 in log), so the decision is
 * the one the exact count would give, with the same uniform: the stream is unchanged.
 *
 * Points are held in ascending order of m (at most LIMIT; then no more are added).
 */
export class ConcaveSqueeze {
  static readonly LIMIT = 32_768;
  private readonly ms: number[] = [];
  private readonly vs: number[] = [];

  /** Remembers f(m) = v (m an integer in the concave range). */
  add(m: number, v: number): void {
    if (!Number.isFinite(v) || this.ms.length >= ConcaveSqueeze.LIMIT) return;
    const i = this.search(m);
    if (i < this.ms.length && this.ms[i] === m) return;
    this.ms.splice(i, 0, m);
    this.vs.splice(i, 0, v);
  }

  /** Number of points held. */
  get size(): number {
    return this.ms.length;
  }

  /**
   * [lower, upper] bounds on f(m) from the points held (−Infinity / Infinity where a side has
   * too few points); [f(m), f(m)] when m itself is held.
   */
  bounds(m: number): [number, number] {
    const ms = this.ms;
    const vs = this.vs;
    const i = this.search(m); // first index with ms[i] >= m
    if (i < ms.length && ms[i] === m) return [vs[i], vs[i]];
    let lower = -Infinity;
    let upper = Infinity;
    if (i > 0 && i < ms.length) lower = vs[i - 1] + ((vs[i] - vs[i - 1]) * (m - ms[i - 1])) / (ms[i] - ms[i - 1]);
    if (i > 1) upper = vs[i - 1] + ((vs[i - 1] - vs[i - 2]) * (m - ms[i - 1])) / (ms[i - 1] - ms[i - 2]);
    if (i + 1 < ms.length) upper = Math.min(upper, vs[i] - ((vs[i + 1] - vs[i]) * (ms[i] - m)) / (ms[i + 1] - ms[i]));
    return [lower, upper];
  }

  /** First index whose point is >= m (binary search). */
  private search(m: number): number {
    return firstAtLeast(this.ms, m);
  }
}
