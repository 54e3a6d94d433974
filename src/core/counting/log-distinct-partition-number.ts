import { DistinctPartitionNumbers } from './distinct-partition-numbers.js';

/**
 * log q(m), q(m) the number of partitions of m into distinct parts (OEIS A000009), for
 * 0 <= m <= 1e9 in doubles, and numerically stable log-ratios log(q(a)/q(b)).
 *
 * - m <= EXACT_UP_TO: the exact BigInt value (distinct-partition-numbers.ts) rounded once.
 * - m > EXACT_UP_TO: the leading (k = 1) term of Hua's convergent series (Hua 1942, "On the number
 *   of partitions of a number into unequal parts", Trans. AMS 51; the analogue of Rademacher's
 *   series for p(n)):
 *     q(m) ≈ (1/√2) · d/dm I_0(π√(N/3)) = π·I_1(z) / (2√6·√N),   N = m + 1/24,  z = π√(N/3).
 *   The next term (k = 2, modulus 3) carries I_1(z/3): relatively O(e^{−2z/3}), at m = 2000
 *   (z ≈ 81) about e^{−54}, far below double rounding. I_1 comes from its large-z expansion
 *   (DLMF 10.40.1), I_1(z) = e^z/√(2πz) · S(z), S(z) = Σ_k (−1)^k a_k(1)/z^k with
 *   a_k(1) = Π_{j<=k} (4 − (2j − 1)²) / (k!·8^k); 16 terms leave < 1e-20 at z >= 80, and the
 *   e^{−z} part of I_1 is relatively e^{−2z}. Checked against the exact q(m) up to 2e4 in
 *   test/partitions/log-distinct-partition-number.test.ts.
 *
 * The exact table is filled lazily on the first call that needs it, and owned by the instance.
 */
export class LogDistinctPartitionNumbers {
  /** Largest m served from the exact table. */
  static readonly EXACT_UP_TO = 2000;
  /**
   * From here on Hua's leading term is within double rounding of q(m) (z >= 57, e^{−2z/3} < 1e-16);
   * log-ratios across the table's end use it on both sides.
   */
  static readonly HUA_ACCURATE_FROM = 1000;
  /** Largest m accepted (the service's limit on n). */
  static readonly MAX_M = 1_000_000_000;

  private exact: Float64Array | null = null;
  private logExact: Float64Array | null = null;

  /** log q(m). */
  log(m: number): number {
    checkArgument(m);
    if (m <= LogDistinctPartitionNumbers.EXACT_UP_TO) {
      this.table();
      return this.logExact![m];
    }
    return logHua(m);
  }

  /**
   * log(q(a)/q(b)) without subtracting two large logs: in the asymptotic range
   *   log q(a) − log q(b) = (z_a − z_b) − (3/4)·log(N_a/N_b) + log S(z_a) − log S(z_b),
   * with z_a − z_b = (π/√3)(a − b)/(√N_a + √N_b) and the log of N_a/N_b through log1p.
   */
  logRatio(a: number, b: number): number {
    checkArgument(a);
    checkArgument(b);
    const limit = LogDistinctPartitionNumbers.EXACT_UP_TO;
    if (a <= limit && b <= limit) {
      const t = this.table();
      return Math.log(t[a] / t[b]);
    }
    // One side tabulated: the stable form still applies while both are >= HUA_ACCURATE_FROM.
    if (Math.min(a, b) < LogDistinctPartitionNumbers.HUA_ACCURATE_FROM) return this.log(a) - this.log(b);
    const na = a + 1 / 24;
    const nb = b + 1 / 24;
    const ra = Math.sqrt(na);
    const rb = Math.sqrt(nb);
    const dz = (PI_OVER_SQRT3 * (a - b)) / (ra + rb);
    return dz - 0.75 * Math.log1p((a - b) / nb) + logSeries(PI_OVER_SQRT3 * ra) - logSeries(PI_OVER_SQRT3 * rb);
  }

  private table(): Float64Array {
    if (this.exact === null) {
      const big = new DistinctPartitionNumbers().upTo(LogDistinctPartitionNumbers.EXACT_UP_TO);
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

const PI_OVER_SQRT3 = Math.PI / Math.sqrt(3);
/** log(π / (2√6)) + ... constants of logHua. */
const LOG_FRONT = Math.log(Math.PI / (2 * Math.sqrt(6)));
const SERIES_TERMS = 16;
/** (−1)^k a_k(1) for k = 1..SERIES_TERMS (DLMF 10.40.1, ν = 1). */
const SERIES: number[] = (() => {
  const c: number[] = [];
  let a = 1;
  for (let k = 1; k <= SERIES_TERMS; k++) {
    a *= (4 - (2 * k - 1) ** 2) / (8 * k);
    c.push(k % 2 === 0 ? a : -a);
  }
  return c;
})();

/** log S(z), S(z) = I_1(z)·√(2πz)·e^{−z} by its asymptotic series (Horner in 1/z). */
function logSeries(z: number): number {
  const w = 1 / z;
  let s = 0;
  for (let k = SERIES_TERMS - 1; k >= 0; k--) s = (s + SERIES[k]) * w;
  return Math.log1p(s);
}

/** log of the leading term of Hua's series; see the class comment. */
function logHua(m: number): number {
  const n = m + 1 / 24;
  const z = PI_OVER_SQRT3 * Math.sqrt(n);
  return LOG_FRONT + z - 0.5 * Math.log(2 * Math.PI * z) + logSeries(z) - 0.5 * Math.log(n);
}

function checkArgument(m: number): void {
  if (!Number.isInteger(m) || m < 0 || m > LogDistinctPartitionNumbers.MAX_M) {
    throw new RangeError(`m must be an integer in [0, ${LogDistinctPartitionNumbers.MAX_M}], got ${m}`);
  }
}
