/**
 * Exact counts by number of parts for parts in [a, b] summing to n (doubles: additions of
 * positives, exact below 2^53 and correctly ordered above), for the narrow-range-mixture tests.
 */

/**
 * Partitions of n into exactly k parts in [a, b], k = 0..n/a: the parts minus a are a partition of
 * n − k a into at most k parts <= b − a, counted by the knapsack recurrence over exactly j parts
 * in [1, b − a].
 */
export function countsByParts(n: number, a: number, b: number): number[] {
  const K = Math.floor(n / a);
  const w = b - a;
  const E = Math.min(n, K * w);
  const c = Array.from({ length: K + 1 }, () => new Float64Array(E + 1));
  c[0][0] = 1;
  for (let s = 1; s <= w; s++) {
    for (let j = 1; j <= K; j++) {
      const row = c[j];
      const prev = c[j - 1];
      for (let m = s; m <= E; m++) row[m] += prev[m - s];
    }
  }
  const out: number[] = [];
  for (let k = 0; k <= K; k++) {
    const e = n - k * a;
    let total = 0;
    if (e >= 0 && e <= E) for (let j = 0; j <= k; j++) total += c[j][e];
    out.push(total);
  }
  return out;
}

/**
 * Partitions of n into exactly k distinct parts in [a, b], k = 0..n/a: the 0/1 knapsack over the
 * sizes a..b (each size once, taken from the largest count down), c[j][m] = subsets of j sizes
 * with sum m.
 */
export function distinctCountsByParts(n: number, a: number, b: number): number[] {
  const K = Math.floor(n / a);
  const c = Array.from({ length: K + 1 }, () => new Float64Array(n + 1));
  c[0][0] = 1;
  for (let s = a; s <= Math.min(b, n); s++) {
    for (let j = K; j >= 1; j--) {
      const row = c[j];
      const prev = c[j - 1];
      for (let m = n; m >= s; m--) row[m] += prev[m - s];
    }
  }
  return c.map((row) => row[n]);
}
