/** A count's saddle-point integral at one size m: log c(m) ≈ phi + logI. */
export interface SaddleIntegral {
  /** The real saddle point. */
  readonly t: number;
  /** φ(t). */
  readonly phi: number;
  /** log of (1/2π)∫ exp(φ(t + iy) − φ(t)) dy. */
  readonly logI: number;
}

/**
 * The saddle-point integrals of one count family, remembered per size: at most LIMIT sizes, all
 * forgotten at once when full (a sampler asks for the same few sizes over and over).
 */
export class SaddleMemo {
  static readonly LIMIT = 4096;
  private readonly memo = new Map<number, SaddleIntegral>();

  constructor(private readonly compute: (m: number) => SaddleIntegral) {}

  get(m: number): SaddleIntegral {
    const hit = this.memo.get(m);
    if (hit !== undefined) return hit;
    const s = this.compute(m);
    if (this.memo.size >= SaddleMemo.LIMIT) this.memo.clear();
    this.memo.set(m, s);
    return s;
  }
}
