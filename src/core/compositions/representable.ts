import { LimitExceededError } from '../errors.js';
import { gcd } from './resolve.js';

/** Work limit for deciding whether n is a sum of allowed parts (about 0.1 s). */
export const MAX_REPRESENTABLE_WORK = 2 ** 25;

/**
 * Whether n is a sum of members of `values` (ascending, >= 1, gcd 1), i.e. whether a family with
 * free length is non-empty. Every n >= (a-1)(b-1) is a sum (Schur's bound on the Frobenius
 * number, Brauer 1942 — from memory); below it, the least representable number in each residue
 * class mod a = min(values) decides (round-robin algorithm, Böcker & Lipták, Algorithmica 48,
 * 2007), falling back to a reachability sweep over 0..n.
 */
export function isRepresentable(values: readonly number[], n: number): boolean {
  const a = values[0];
  const b = values[values.length - 1];
  if (n === 0) return true;
  if (n >= (a - 1) * (b - 1)) return true;
  if (a * values.length <= MAX_REPRESENTABLE_WORK) {
    const dist = new Float64Array(a).fill(Infinity);
    dist[0] = 0;
    for (const v of values.slice(1)) {
      const d = gcd(a, v);
      for (let p = 0; p < d; p++) {
        let best = Infinity;
        for (let r = p; r < a; r += d) best = Math.min(best, dist[r]);
        if (best === Infinity) continue;
        for (let i = 1; i < a / d; i++) {
          best += v;
          const r = best % a;
          best = Math.min(best, dist[r]);
          dist[r] = best;
        }
      }
    }
    return dist[n % a] <= n;
  }
  if (n * values.length <= MAX_REPRESENTABLE_WORK) {
    const reach = new Uint8Array(n + 1);
    reach[0] = 1;
    for (let m = 1; m <= n; m++) {
      for (const v of values) {
        if (v > m) break;
        if (reach[m - v]) { reach[m] = 1; break; }
      }
    }
    return reach[n] === 1;
  }
  throw new LimitExceededError(
    `deciding whether ${n} is a sum of the allowed parts would take over ${MAX_REPRESENTABLE_WORK} steps`,
    `representability work <= ${MAX_REPRESENTABLE_WORK}`,
  );
}

/**
 * Whether n is a sum of at most k nonzero members of `values` (ascending, may start with 0):
 * the non-emptiness test for an exact length k when 0 is allowed after the shift. A fewest-parts
 * representation uses fewer than b = max(values) parts other than b (among any b parts some
 * nonempty subset sums to a multiple of b — pigeonhole on prefix sums — and may be replaced by
 * no more copies of b), so those parts sum below b^2 and a coin-change table up to b^2 decides.
 */
export function fitsInParts(values: readonly number[], n: number, k: number): boolean {
  const coins = values.filter((v) => v > 0);
  const b = coins[coins.length - 1];
  const limit = Math.min(n, b * b);
  if ((limit + 1) * coins.length > MAX_REPRESENTABLE_WORK) {
    throw new LimitExceededError(
      `deciding whether ${n} is a sum of at most ${k} allowed parts would take over ${MAX_REPRESENTABLE_WORK} steps`,
      `representability work <= ${MAX_REPRESENTABLE_WORK}`,
    );
  }
  const fewest = new Float64Array(limit + 1).fill(Infinity);
  fewest[0] = 0;
  for (let m = 1; m <= limit; m++) {
    for (const v of coins) {
      if (v > m) break;
      if (fewest[m - v] + 1 < fewest[m]) fewest[m] = fewest[m - v] + 1;
    }
  }
  for (let m = n % b; m <= limit; m += b) {
    if (fewest[m] + (n - m) / b <= k) return true;
  }
  return false;
}
