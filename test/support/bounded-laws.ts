import { chiSquareTest } from './chi-square.js';
import type { Partition } from '../../src/core/partition.js';

/**
 * Exact counts c_{[a,b]}(m), m <= n, as BigInts (the generating function Π_{k=a}^{b} 1/(1 − q^k)
 * multiplied in factor by factor; OEIS A026820 for a = 1 gives the same numbers).
 */
export function exactBoundedCounts(a: number, b: number, n: number): bigint[] {
  const c = new Array<bigint>(n + 1).fill(0n);
  c[0] = 1n;
  for (let k = a; k <= Math.min(b, n); k++) for (let m = k; m <= n; m++) c[m] += c[m - k];
  return c;
}

/**
 * The exact law of the multiplicity X_k of part k in a uniform partition of n into parts in
 * [a, b] (k in [a, b]): #{X_k >= j} = c(n − jk) (remove j parts k), so
 * P(X_k = j) = (c(n − jk) − c(n − (j + 1)k))/c(n). Returned as bins 0..last−1 and a tail bin
 * ">= last", last chosen so that every bin expects >= 5 of `samples` draws.
 */
export function multiplicityLaw(c: bigint[], n: number, k: number, samples: number): number[] {
  const scale = 10n ** 18n;
  const atLeast = (j: number) => (n - j * k < 0 ? 0 : Number((c[n - j * k] * scale) / c[n]) / 1e18);
  const probs: number[] = [];
  let j = 0;
  while (atLeast(j + 1) * samples >= 5 && (atLeast(j) - atLeast(j + 1)) * samples >= 5) {
    probs.push(atLeast(j) - atLeast(j + 1));
    j++;
  }
  probs.push(atLeast(j));
  return probs;
}

/** Multiplicity of size k in a partition (0 when absent). */
export function multiplicityOf(p: Partition, k: number): number {
  const i = p.sizes.indexOf(k);
  return i < 0 ? 0 : p.multiplicities[i];
}

/** Chi-square p-value of the observed multiplicities of k against multiplicityLaw's bins. */
export function multiplicityPValue(observed: number[], law: number[]): number {
  const bins = new Array<number>(law.length).fill(0);
  for (const x of observed) bins[Math.min(x, law.length - 1)]++;
  return chiSquareTest(bins, law).pValue;
}
