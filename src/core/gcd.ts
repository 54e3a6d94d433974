/** Greatest common divisor of two integers (Euclid), always >= 0. */
export function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return Math.abs(a);
}
