import { PartitionNumbers } from './partition-numbers.js';

/**
 * log p(m) for 0 <= m <= 1e9 in doubles, and numerically stable log-ratios log(p(a)/p(b)).
 *
 * - m <= EXACT_UP_TO: the exact BigInt value (Euler's pentagonal recurrence, PartitionNumbers)
 *   rounded once to a double. p(2000) ~ 4.7e45 is far inside the double range.
 * - m > EXACT_UP_TO: the leading Hardy–Ramanujan–Rademacher term (Rademacher 1937; DLMF 26.10.12,
 *   k = 1 term with sinh replaced by exp/2):
 *     p(m) ~ e^{C·λ} (C·λ − 1) / (4π√2 · λ³),   λ = √(m − 1/24),  C = π√(2/3).
 *   The dropped terms are relatively O(e^{−Cλ/2}); at m = 2000 (Cλ ≈ 115) that is e^{−57},
 *   far below double rounding, so above the switch the formula is as good as the exact value.
 *
 * The table of exact values is filled lazily, on the first call that needs it, and owned by the
 * instance (no module-level state).
 */
export class LogPartitionNumbers {
  /** Largest m served from the exact table; above it the Rademacher leading term is used. */
  static readonly EXACT_UP_TO = 2000;
  /** Largest m accepted (the service's limit on n). */
  static readonly MAX_M = 1_000_000_000;

  private exact: Float64Array | null = null;
  private logExact: Float64Array | null = null;

  /** p(m) as a double for m <= EXACT_UP_TO (exact value, rounded once). */
  value(m: number): number {
    checkArgument(m);
    if (m > LogPartitionNumbers.EXACT_UP_TO) {
      throw new RangeError(`p(m) as a double is tabulated up to m = ${LogPartitionNumbers.EXACT_UP_TO}, got ${m}`);
    }
    return this.table()[m];
  }

  /** log p(m). */
  log(m: number): number {
    checkArgument(m);
    if (m <= LogPartitionNumbers.EXACT_UP_TO) {
      this.table();
      return this.logExact![m];
    }
    return logRademacher(m);
  }

  /**
   * log(p(a) / p(b)) without the cancellation of subtracting two large logs: in the asymptotic
   * range the exponent difference is C(λa − λb) with λa − λb = (a − b)/(λa + λb), and the other
   * factors go through log1p of small relative differences.
   */
  logRatio(a: number, b: number): number {
    checkArgument(a);
    checkArgument(b);
    const limit = LogPartitionNumbers.EXACT_UP_TO;
    if (a <= limit && b <= limit) {
      const t = this.table();
      return Math.log(t[a] / t[b]);
    }
    if (a <= limit || b <= limit) return this.log(a) - this.log(b);
    const la = Math.sqrt(a - 1 / 24);
    const lb = Math.sqrt(b - 1 / 24);
    const dl = (a - b) / (la + lb);
    return C * dl + Math.log1p((C * dl) / (C * lb - 1)) - 3 * Math.log1p(dl / lb);
  }

  private table(): Float64Array {
    if (this.exact === null) {
      const big = new PartitionNumbers().upTo(LogPartitionNumbers.EXACT_UP_TO);
      const exact = new Float64Array(big.length);
      const logs = new Float64Array(big.length);
      for (let i = 0; i < big.length; i++) {
        exact[i] = Number(big[i]); // correctly rounded BigInt -> double
        logs[i] = Math.log(exact[i]);
      }
      this.exact = exact;
      this.logExact = logs;
    }
    return this.exact;
  }
}

/** C = π√(2/3), the growth constant of log p(m) ~ C√m (Hardy & Ramanujan 1918). */
const C = Math.PI * Math.sqrt(2 / 3);
const LOG_4PI_SQRT2 = Math.log(4 * Math.PI * Math.SQRT2);

/** log of the leading Rademacher term; see the class comment. */
function logRademacher(m: number): number {
  const lambda = Math.sqrt(m - 1 / 24);
  return C * lambda + Math.log(C * lambda - 1) - 3 * Math.log(lambda) - LOG_4PI_SQRT2;
}

function checkArgument(m: number): void {
  if (!Number.isInteger(m) || m < 0 || m > LogPartitionNumbers.MAX_M) {
    throw new RangeError(`m must be an integer in [0, ${LogPartitionNumbers.MAX_M}], got ${m}`);
  }
}
