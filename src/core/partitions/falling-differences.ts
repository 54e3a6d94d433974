/**
 * Remembered forward differences D(m) = f(m) − f(m − 1) of a concave f (D falls as m grows), so
 * that the last m with D(m) > θ can be bracketed from earlier searches: a self-similar level's
 * maximiser is asked this for a new θ at every sample (θ = −2 log x of the level's size), and
 * neighbouring θ have neighbouring answers. Points are held ascending in m (at most LIMIT: 32768 × 16 bytes).
 */
export class FallingDifferences {
  static readonly LIMIT = 32_768;
  private readonly ms: number[] = [];
  private readonly ds: number[] = [];

  constructor(private readonly difference: (m: number) => number) {}

  /** D(m), computed once and remembered. */
  at(m: number): number {
    const i = this.search(m);
    if (i < this.ms.length && this.ms[i] === m) return this.ds[i];
    const d = this.difference(m);
    if (this.ms.length < FallingDifferences.LIMIT) {
      this.ms.splice(i, 0, m);
      this.ds.splice(i, 0, d);
    }
    return d;
  }

  /**
   * From the points held: [the largest m whose D(m) rises (D(m) > θ, in the caller's exact
   * form), the smallest m whose D(m) does not] (−Infinity / Infinity where none is held). D
   * falls, so the last m that rises lies between.
   */
  bracket(rises: (d: number) => boolean): [number, number] {
    // First index whose D does not rise (the ds fall along the ms).
    let lo = 0;
    let hi = this.ds.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (rises(this.ds[mid])) lo = mid + 1;
      else hi = mid;
    }
    return [lo > 0 ? this.ms[lo - 1] : -Infinity, lo < this.ms.length ? this.ms[lo] : Infinity];
  }

  private search(m: number): number {
    return firstAtLeast(this.ms, m);
  }
}

/** Brackets this narrow (sizes) are bisected with exact differences (at most ~12 new ones). */
export const NARROW_BRACKET = 4096;

/**
 * The last m in [from, half] whose difference rises (from itself when none), D falling on
 * (from, half], when the remembered differences bracket it within NARROW_BRACKET sizes: a
 * bisection of the bracket with exact (remembered) differences. null when the bracket is wider
 * (the caller searches as it would without them).
 */
export function bracketedLastRise(differences: FallingDifferences, rises: (d: number) => boolean, from: number, half: number): number | null {
  const [g, h] = differences.bracket(rises);
  let good = g > half ? half : Math.max(from, g); // from, or D(good) rises
  let bad = Math.min(half + 1, h); // half + 1, or D(bad) does not rise
  if (bad - good > NARROW_BRACKET) return null;
  while (bad - good > 1) {
    const mid = Math.floor((good + bad) / 2);
    if (rises(differences.at(mid))) good = mid;
    else bad = mid;
  }
  return good;
}

/** First index of the ascending `sorted` whose value is >= m (binary search; sorted.length when none). */
export function firstAtLeast(sorted: readonly number[], m: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < m) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
