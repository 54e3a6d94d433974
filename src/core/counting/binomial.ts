/**
 * Exact binomial coefficients in BigInt and their size in bits, for counting compositions
 * (C(n-1, k-1) compositions of n into k parts; Stanley, Enumerative Combinatorics vol. 1, §1.2).
 */

/** Product lo * (lo+1) * ... * hi by binary splitting: balanced operands let V8's fast multiplication help. */
function rangeProduct(lo: bigint, hi: bigint): bigint {
  if (lo > hi) return 1n;
  if (hi - lo < 24n) {
    let p = 1n;
    for (let i = lo; i <= hi; i++) p *= i;
    return p;
  }
  const mid = (lo + hi) >> 1n;
  return rangeProduct(lo, mid) * rangeProduct(mid + 1n, hi);
}

/** C(top, bottom) exactly; 0 when bottom < 0 or bottom > top (top >= 0). */
export function binomial(top: number, bottom: number): bigint {
  if (bottom < 0 || top < 0 || bottom > top) return 0n;
  const k = Math.min(bottom, top - bottom);
  if (k === 0) return 1n;
  return rangeProduct(BigInt(top - k + 1), BigInt(top)) / rangeProduct(1n, BigInt(k));
}

const LN2 = Math.LN2;

/** ln Gamma(z) for z >= 1: exact log-sum below 16, Stirling's series above (A&S 6.1.41). */
export function logGamma(z: number): number {
  if (z < 16) {
    let s = 0;
    for (let i = 2; i < z; i++) s += Math.log(i);
    // Gamma(z) = (z-1)! for integer z; non-integers are not needed here.
    return s;
  }
  const inv = 1 / z;
  return (z - 0.5) * Math.log(z) - z + 0.5 * Math.log(2 * Math.PI) + inv / 12 - inv ** 3 / 360 + inv ** 5 / 1260;
}

/** log2 C(top, bottom), accurate to well under a bit; used to refuse over-size counts before computing them. */
export function log2Binomial(top: number, bottom: number): number {
  if (bottom < 0 || bottom > top) return -Infinity;
  return (logGamma(top + 1) - logGamma(bottom + 1) - logGamma(top - bottom + 1)) / LN2;
}
