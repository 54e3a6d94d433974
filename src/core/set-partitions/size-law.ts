import { DiscreteLaw, windowAround } from './discrete-law.js';
import { logFactorial } from './log-poisson.js';

/**
 * The law of one block's size in the Boltzmann model of set partitions at parameter x = e^t:
 * P(size = s) ∝ x^s / s! for minSize <= s <= maxSize, a Poisson(x) law truncated to the allowed
 * sizes (the exponential generating function of one block is sum x^s/s!; Flajolet & Sedgewick,
 * Analytic Combinatorics 2009, §II.3 and the labelled Boltzmann models of Duchon, Flajolet,
 * Louchard & Schaeffer 2004, §4).
 */
export interface SizeLaw {
  readonly law: DiscreteLaw;
  /** ln of sum over the allowed sizes of x^s / s! (the block generating function at x). */
  readonly logBlockGf: number;
  readonly t: number;
}

export function sizeLaw(t: number, minSize: number, maxSize: number): SizeLaw {
  const x = Math.exp(t);
  const mode = Math.min(maxSize, Math.max(minSize, Math.floor(x)));
  // ln(x^(s+1)/(s+1)!) - ln(x^s/s!) = t - ln(s + 1).
  const { lo, logWeights } = windowAround(mode, minSize, maxSize, (s) => t - Math.log(s + 1));
  const law = new DiscreteLaw(lo, logWeights);
  return { law, logBlockGf: law.logTotal + mode * t - logFactorial(mode), t };
}
