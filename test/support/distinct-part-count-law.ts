/**
 * Exact law of the number of parts of a uniform partition of n into distinct parts >= a, as
 * doubles (additions of positives only): a partition into k distinct parts >= a, minus the
 * staircase (a + k − 1, ..., a + 1, a), is a partition of n − k·a − k(k − 1)/2 into at most k
 * parts, counted by P[k][m] = P[k − 1][m] + P[k][m − k] (parts <= k, conjugated).
 */
export function exactPartCountLaw(n: number, a: number): number[] {
  let kMax = 0;
  while ((kMax + 1) * a + ((kMax + 1) * kMax) / 2 <= n) kMax++;
  let row = new Float64Array(n + 1);
  row[0] = 1;
  const counts: number[] = [n === 0 ? 1 : 0];
  for (let k = 1; k <= kMax; k++) {
    const next = new Float64Array(n + 1);
    for (let m = 0; m <= n; m++) next[m] = row[m] + (m >= k ? next[m - k] : 0);
    row = next;
    counts.push(row[n - k * a - (k * (k - 1)) / 2]);
  }
  const total = counts.reduce((x, y) => x + y, 0);
  if (!Number.isFinite(total)) throw new RangeError(`the counts at n = ${n} overflow doubles`);
  return counts.map((c) => c / total);
}

/** Pools the tail bins so that every expected count is >= 5 (Cochran's rule). */
export function pooled(observed: number[], probabilities: number[], samples: number): { observed: number[]; probabilities: number[] } {
  const o: number[] = [];
  const p: number[] = [];
  let ao = 0;
  let ap = 0;
  for (let i = 0; i < probabilities.length; i++) {
    ao += observed[i] ?? 0;
    ap += probabilities[i];
    if (ap * samples >= 5) {
      o.push(ao);
      p.push(ap);
      ao = 0;
      ap = 0;
    }
  }
  if (ap > 0) {
    o[o.length - 1] += ao;
    p[p.length - 1] += ap;
  }
  return { observed: o, probabilities: p };
}

/**
 * Exact law of the largest part of a uniform partition of n into distinct parts in [a, c], as
 * doubles: P(largest <= L) = Q_{[a,L]}(n) / Q_{[a,c]}(n), the counts Q_{[a,L]}(n) read off the
 * knapsack Π_{a<=k<=L}(1 + q^k) after each factor (additions of positives only). Entry L − a of
 * the result is P(largest = L).
 */
export function exactLargestPartLaw(n: number, a: number, c: number): number[] {
  const q = new Float64Array(n + 1);
  q[0] = 1;
  const upTo: number[] = [];
  for (let k = a; k <= c; k++) {
    for (let m = n; m >= k; m--) q[m] += q[m - k];
    upTo.push(q[n]);
  }
  const total = upTo[upTo.length - 1];
  if (!Number.isFinite(total) || total === 0) throw new RangeError(`no usable counts at n = ${n}`);
  return upTo.map((v, i) => (v - (i === 0 ? 0 : upTo[i - 1])) / total);
}
