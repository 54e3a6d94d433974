/**
 * Logarithms of factorials and of Poisson probabilities, accurate to a few units in the last
 * place even where the naive formula cancels (k·ln λ − λ − ln k! with λ and k near 10^6).
 * The samplers' acceptance tests and tables use them, so their accuracy is the samplers'
 * "up to double rounding".
 *
 * Method: Loader, "Fast and accurate computation of binomial probabilities" (2000): the
 * Poisson log-probability is written −stirlerr(k) − bd0(k, λ) − ½·ln(2πk), with stirlerr the
 * error of Stirling's formula and bd0(k, λ) = k·ln(k/λ) + λ − k computed by a series where the
 * two terms nearly cancel.
 */

const HALF_LN_2PI = 0.5 * Math.log(2 * Math.PI);

/** ln k! for k <= 18 from the exact factorial (18! < 2^53, so each is correctly rounded). */
const SMALL_LOG_FACTORIAL = (() => {
  const out = new Float64Array(19);
  let f = 1;
  for (let k = 1; k <= 18; k++) {
    f *= k;
    out[k] = Math.log(f);
  }
  return out;
})();

/**
 * stirlerr(k) = ln k! − (k·ln k − k + ½·ln(2πk)). For k > 18 the Stirling series
 * 1/(12k) − 1/(360k³) + 1/(1260k⁵) − 1/(1680k⁷) + 1/(1188k⁹) (A&S 6.1.41): the first omitted
 * term, 691/(360360·k¹¹), is below 2e-17 there.
 */
export function stirlingError(k: number): number {
  if (k <= 18) return k === 0 ? 0 : SMALL_LOG_FACTORIAL[k] - (k * Math.log(k) - k + HALF_LN_2PI + 0.5 * Math.log(k));
  const inv = 1 / k;
  const inv2 = inv * inv;
  return inv * (1 / 12 - inv2 * (1 / 360 - inv2 * (1 / 1260 - inv2 * (1 / 1680 - inv2 / 1188))));
}

/** ln k! for whole k >= 0. */
export function logFactorial(k: number): number {
  if (k <= 18) return SMALL_LOG_FACTORIAL[k];
  return k * Math.log(k) - k + HALF_LN_2PI + 0.5 * Math.log(k) + stirlingError(k);
}

/** bd0(k, λ) = k·ln(k/λ) + λ − k >= 0, by Loader's series when k is close to λ. */
function deviance(k: number, lambda: number): number {
  const diff = k - lambda;
  if (Math.abs(diff) < 0.1 * (k + lambda)) {
    let v = diff / (k + lambda);
    let sum = diff * v;
    let term = 2 * k * v;
    v *= v;
    for (let j = 1; j < 1000; j++) {
      term *= v;
      const next = sum + term / (2 * j + 1);
      if (next === sum) return next;
      sum = next;
    }
    return sum;
  }
  return k * Math.log(k / lambda) + lambda - k;
}

/** ln P(X = k) for X ~ Poisson(λ), λ > 0, whole k >= 0. */
export function logPoissonPmf(k: number, lambda: number): number {
  if (k === 0) return -lambda;
  return -stirlingError(k) - deviance(k, lambda) - HALF_LN_2PI - 0.5 * Math.log(k);
}

/** The mode of Poisson(λ) (floor λ; for whole λ, λ − 1 and λ tie) and ln of its probability. */
export function poissonMode(lambda: number): { mode: number; logPmf: number } {
  const mode = Math.floor(lambda);
  return { mode, logPmf: logPoissonPmf(mode, lambda) };
}
