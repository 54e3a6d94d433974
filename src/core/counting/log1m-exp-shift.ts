/**
 * log(1 − e^{−(x + iy)}) − log(1 − e^{−x}) as [Re, Im] (x > 0): one factor of a partition
 * generating function moved off the real axis, formed in place (log1p, atan2) so that nothing
 * of size log(1 − e^{−x}) is subtracted:
 *   1 − e^{−x−iy} = (1 − e^{−x})·(1 + e^{−x}(2 sin²(y/2) + i sin y)/(1 − e^{−x})).
 */
export function log1mExpShift(x: number, y: number): [number, number] {
  const e = Math.exp(-x);
  const den = -Math.expm1(-x);
  const s = Math.sin(y / 2);
  const wr = (e * 2 * s * s) / den;
  const wi = (e * Math.sin(y)) / den;
  return [0.5 * Math.log1p(2 * wr + wr * wr + wi * wi), Math.atan2(wi, 1 + wr)];
}
