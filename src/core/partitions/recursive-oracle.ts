import { PartitionNumbers } from '../counting/partition-numbers.js';
import { partitionFromCounts, type Partition } from '../partition.js';
import { nextBelow, nextBigBelow, type RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';

/**
 * The recursive method of Nijenhuis & Wilf (Combinatorial Algorithms, 1978, ch. 10, "RANPAR"),
 * run in exact integer arithmetic. It rests on the identity
 *   m·p(m) = sum_{d>=1} sum_{j>=1} d·p(m − j·d),
 * read as: a uniform partition of m arises by choosing the pair (d, j) with probability
 * d·p(m − jd) / (m·p(m)), adding j parts of size d, and recursing on m − jd. Every choice is made
 * with an exactly uniform integer, so the output is exactly uniform with no rounding at all —
 * which is why this slow method is the oracle the fast samplers are tested against.
 * Work per sample is O(n log n) integer operations per step; meant for n up to a few thousand.
 */
export class RecursiveOracle implements PartitionSampler {
  static readonly MAX_N = 5000;
  readonly method = 'recursive-oracle/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  private readonly p: bigint[];
  /** p(m) as exact doubles while m·p(m) < 2^53, so small cases avoid BigInt arithmetic. */
  private readonly pSmall: number[];

  constructor(readonly n: number, numbers: PartitionNumbers = new PartitionNumbers()) {
    if (!Number.isInteger(n) || n < 0 || n > RecursiveOracle.MAX_N) {
      throw new RangeError(`the recursive oracle takes integer n from 0 to ${RecursiveOracle.MAX_N}, got ${n}`);
    }
    this.p = numbers.upTo(n);
    this.pSmall = [];
    for (let m = 0; m <= n && this.p[m] * BigInt(Math.max(m, 1)) < 2n ** 53n; m++) this.pSmall.push(Number(this.p[m]));
    // Rough figures: ~sqrt(n) log n parts; each step scans O(m log m) pairs.
    this.expectedLength = Math.max(1, Math.sqrt(n) * Math.log(n + 1));
    this.expectedDistinct = Math.max(1, Math.sqrt(6 * n) / Math.PI);
    this.expectedWork = (n + 1) * Math.log(n + 2) * this.expectedDistinct;
  }

  sample(source: RandomSource): Partition {
    const counts = new Map<number, number>();
    let m = this.n;
    while (m > 0) {
      const [d, j] = m < this.pSmall.length ? this.pickSmall(source, m) : this.pickBig(source, m);
      counts.set(d, (counts.get(d) ?? 0) + j);
      m -= j * d;
    }
    return partitionFromCounts(counts);
  }

  private pickSmall(source: RandomSource, m: number): [number, number] {
    let r = nextBelow(source, m * this.pSmall[m]);
    for (let d = 1; d <= m; d++) {
      for (let j = 1; j * d <= m; j++) {
        r -= d * this.pSmall[m - j * d];
        if (r < 0) return [d, j];
      }
    }
    throw new Error('unreachable: the weights sum to m·p(m)');
  }

  private pickBig(source: RandomSource, m: number): [number, number] {
    let r = nextBigBelow(source, BigInt(m) * this.p[m]);
    for (let d = 1; d <= m; d++) {
      const bigD = BigInt(d);
      for (let j = 1; j * d <= m; j++) {
        r -= bigD * this.p[m - j * d];
        if (r < 0n) return [d, j];
      }
    }
    throw new Error('unreachable: the weights sum to m·p(m)');
  }
}
