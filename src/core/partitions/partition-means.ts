/** Euler's constant γ. */
const EULER_GAMMA = 0.5772156649015329;

/**
 * Mean number of parts and of distinct part sizes of a uniform partition of n, for size and
 * work estimates. With x = e^{−t}, t = π/√(6n): E[parts] ≈ Σ_k x^k/(1 − x^k) = (ln(1/t) + γ)/t
 * + 1/4 + O(t) (Lambert series of the divisor function) and E[distinct sizes] ≈ Σ_k x^k =
 * 1/t − 1/2 + O(t); both agree with the uniform law to leading order (Erdős & Lehner 1941;
 * Fristedt 1993).
 */
export function uniformPartitionMeans(n: number): { readonly expectedLength: number; readonly expectedDistinct: number } {
  if (n === 0) return { expectedLength: 0, expectedDistinct: 0 };
  const s = Math.sqrt(6 * n) / Math.PI;
  return { expectedLength: s * (Math.log(s) + EULER_GAMMA) + 0.25, expectedDistinct: Math.max(1, s - 0.5) };
}
