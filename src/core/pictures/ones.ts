import { LogDistinctPartitionNumbers } from '../counting/log-distinct-partition-number.js';
import { LogPartitionNumbers } from '../counting/log-partition-number.js';
import type { Partition } from '../partition.js';

/**
 * A statistic whose law is exact at every n, for the check above the reach of the largest-part table.
 *
 * - Unconstrained: X = the multiplicity of the part 1. Removing j ones is a bijection from the
 *   partitions of n with at least j ones onto the partitions of n − j, so P(X >= j) = p(n − j)/p(n)
 *   (Andrews, The Theory of Partitions, 1976, ch. 1).
 * - Distinct parts: X = the sum of the parts that are powers of 2, i.e. the number of ones of the
 *   odd-parts partition Glaisher's bijection maps the partition to (Glaisher 1883, Messenger of
 *   Math. 12; each part 2^e·o becomes 2^e parts o). Partitions into odd parts are counted by q
 *   (Euler), so the same removal argument gives P(X >= j) = q(n − j)/q(n).
 *
 * Both ratios come from the stable log-ratios (accurate to ~2e-16 relative up to n = 1e9), and
 * P(X = j) = P(X >= j)·(−expm1(log P(X >= j+1) − log P(X >= j))) avoids cancellation.
 */
export function onesStatistic(partition: Partition, distinct: boolean): number {
  let total = 0;
  for (let i = 0; i < partition.sizes.length; i++) {
    const s = partition.sizes[i];
    if (!distinct) {
      if (s === 1) total += partition.multiplicities[i];
    } else if ((s & (s - 1)) === 0) total += s * partition.multiplicities[i];
  }
  return total;
}

/** A short name of the statistic, for plot titles and axes. */
export function onesShortQuantity(distinct: boolean): string {
  return distinct ? 'sum of power-of-2 parts' : 'number of 1s';
}

/** The name of the statistic, as reported. */
export function onesQuantity(distinct: boolean): string {
  return distinct ? 'sum of the power-of-2 parts (ones of the Glaisher image)' : 'multiplicity of the part 1';
}

/**
 * probabilities[j] = P(X = j) for j = 0..top, with probabilities[top + 1] = P(X > top); top is the
 * smallest j >= atLeast where P(X > j) < 1e-15 (or n).
 */
export function onesLaw(n: number, distinct: boolean, atLeast: number): Float64Array {
  const logs = distinct ? new LogDistinctPartitionNumbers() : new LogPartitionNumbers();
  const logAtLeast = (j: number): number => (j > n ? Number.NEGATIVE_INFINITY : logs.logRatio(n - j, n));
  const values: number[] = [];
  let j = 0;
  for (;;) {
    const here = logAtLeast(j);
    const next = logAtLeast(j + 1);
    values.push(next === Number.NEGATIVE_INFINITY ? Math.exp(here) : Math.exp(here) * -Math.expm1(next - here));
    if (j >= n) {
      values.push(0);
      break;
    }
    if (j >= atLeast && Math.exp(next) < 1e-15) {
      values.push(Math.exp(next));
      break;
    }
    j++;
  }
  return Float64Array.from(values);
}
