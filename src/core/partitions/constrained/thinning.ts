import { nextOpenDouble, type RandomSource } from '../../random.js';

/**
 * Visits each integer k in [from, to] independently with probability q(k), where q is
 * non-increasing, in time proportional to the number of candidates rather than to to - from.
 * Candidates come from Bernoulli(qb) trials skipped over geometrically, qb = q at the first
 * untried position, and each candidate k is kept with probability q(k) / qb (thinning; Devroye
 * 1986, "Non-Uniform Random Variate Generation", §VI.2 and §X.3). Changing qb only at
 * candidates (stopping times) keeps every position's trial independent with success q(k).
 * Dense stretches (q >= 1/4) are tried one by one. `visit` returns false to abandon the pass
 * (then this returns false as well).
 */
export function visitThinned(
  source: RandomSource,
  from: number,
  to: number,
  q: (k: number) => number,
  visit: (k: number) => boolean,
): boolean {
  let k = from;
  while (k <= to) {
    const bound = q(k);
    if (bound <= 0) return true;
    if (bound >= 0.25) {
      if (source.nextDouble() < bound && !visit(k)) return false;
      k++;
      continue;
    }
    // Failures before the first success of Bernoulli(bound) trials: floor(ln U / ln(1 - bound)).
    const skip = Math.floor(Math.log(nextOpenDouble(source)) / Math.log1p(-bound));
    k += skip;
    if (k > to) return true;
    if (source.nextDouble() * bound < q(k) && !visit(k)) return false;
    k++;
  }
  return true;
}
