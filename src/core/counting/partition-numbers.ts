/**
 * Exact partition numbers p(0..N) as BigInt, by Euler's pentagonal number theorem:
 *   p(n) = sum_{k>=1} (-1)^{k+1} [ p(n - k(3k-1)/2) + p(n - k(3k+1)/2) ]
 * (DLMF 26.9.8 / Abramowitz & Stegun 24.2.1). The recurrence cancels heavily, so it is run in
 * BigInt: in doubles it loses all accuracy by n = 2000 (see the project's numerics notes).
 * Cost is O(N^1.5) BigInt additions; N = 20,000 takes well under a second.
 */
export class PartitionNumbers {
  private readonly values: bigint[] = [1n];

  /** Largest n this table will compute on request. */
  static readonly MAX_N = 100_000;

  /** p(n), computing the table up to n on first use. */
  get(n: number): bigint {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a non-negative integer, got ${n}`);
    if (n > PartitionNumbers.MAX_N) {
      throw new RangeError(`exact p(n) is tabulated up to n = ${PartitionNumbers.MAX_N}, got ${n}`);
    }
    this.extendTo(n);
    return this.values[n];
  }

  /** p(0..n) as a fresh array. */
  upTo(n: number): bigint[] {
    this.get(n);
    return this.values.slice(0, n + 1);
  }

  private extendTo(n: number): void {
    const values = this.values;
    for (let m = values.length; m <= n; m++) {
      let total = 0n;
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
