/**
 * Exact numbers q(0..N) of partitions into distinct parts (OEIS A000009) as BigInt.
 *
 * From Π(1 + x^k) · Π(1 − x^k) = Π(1 − x^{2k}) and Euler's pentagonal number theorem
 * Π(1 − x^k) = Σ_{j∈Z} (−1)^j x^{j(3j−1)/2} (DLMF 27.14.6 / 26.9.8):
 *   q(n) = Σ_{k>=1} (−1)^{k+1} [ q(n − k(3k−1)/2) + q(n − k(3k+1)/2) ] + s(n),
 *   s(n) = (−1)^j if n = j(3j − 1) for some integer j (n = 0, 2, 4, 10, 14, 24, 30, ...), else 0.
 * O(N^1.5) BigInt additions (N = 2000: ~1.5e5). The cancellation makes BigInt necessary.
 */
export class DistinctPartitionNumbers {
  private readonly values: bigint[] = [1n];

  /** Largest n this table computes on request. */
  static readonly MAX_N = 100_000;

  /** q(n), extending the table up to n on first use. */
  get(n: number): bigint {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a non-negative integer, got ${n}`);
    if (n > DistinctPartitionNumbers.MAX_N) {
      throw new RangeError(`exact q(n) is tabulated up to n = ${DistinctPartitionNumbers.MAX_N}, got ${n}`);
    }
    this.extendTo(n);
    return this.values[n];
  }

  /** q(0..n) as a fresh array. */
  upTo(n: number): bigint[] {
    this.get(n);
    return this.values.slice(0, n + 1);
  }

  private extendTo(n: number): void {
    const values = this.values;
    for (let m = values.length; m <= n; m++) {
      let total = pentagonalSign(m);
      for (let k = 1; ; k++) {
        const first = m - (k * (3 * k - 1)) / 2;
        if (first < 0) break;
        const second = m - (k * (3 * k + 1)) / 2;
        const term = second >= 0 ? values[first] + values[second] : values[first];
        total = k % 2 === 1 ? total + term : total - term;
      }
      values.push(total);
    }
  }
}

/** s(n) above: (−1)^j when n = j(3j − 1) for an integer j (j >= 0 or j < 0), else 0. */
function pentagonalSign(n: number): bigint {
  for (let j = 0; j * (3 * j - 1) <= n; j++) {
    if (j * (3 * j - 1) === n || j * (3 * j + 1) === n) return j % 2 === 0 ? 1n : -1n;
  }
  return 0n;
}
