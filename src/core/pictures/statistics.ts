/**
 * The distribution functions the distribution check needs, written out here because the core
 * takes no runtime dependency on a statistics library (the tests compare every function below
 * with @stdlib's implementations).
 */

/**
 * ln Γ(x) for x > 0 by Lanczos' approximation with g = 7 and 9 coefficients (the widely
 * published Godfrey coefficients; measured within ~1e-12 relative of mathjs' lgamma, far finer
 * than any p-value needs), using the reflection formula
 * Γ(x)Γ(1−x) = π / sin(πx) (DLMF 5.5.3) below 1/2.
 */
const LANCZOS_G = 7;
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

export function lnGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - lnGamma(1 - x);
  const z = x - 1;
  let sum = LANCZOS[0];
  for (let i = 1; i < LANCZOS.length; i++) sum += LANCZOS[i] / (z + i);
  const t = z + LANCZOS_G + 0.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** ln C(n, k) through ln Γ (DLMF 26.3.1 with 5.2.1). */
export function lnBinomial(n: number, k: number): number {
  return lnGamma(n + 1) - lnGamma(k + 1) - lnGamma(n - k + 1);
}

const EPS = 1e-15;
const TINY = 1e-300;

/**
 * The regularized upper incomplete gamma function Q(a, x) = Γ(a, x)/Γ(a) (DLMF 8.2.4).
 * For x < a + 1 the series of P(a, x) converges fast (A&S 6.5.29, DLMF 8.7.1) and Q = 1 − P;
 * otherwise the continued fraction of Γ(a, x) (A&S 6.5.31, DLMF 8.9.2) is evaluated by the
 * modified Lentz method. This is the standard split (Numerical Recipes, 3rd ed., §6.2).
 */
export function regularizedGammaQ(a: number, x: number): number {
  if (!(a > 0) || !(x >= 0)) throw new RangeError(`regularizedGammaQ needs a > 0 and x >= 0, got a = ${a}, x = ${x}`);
  if (x === 0) return 1;
  const logPrefix = -x + a * Math.log(x) - lnGamma(a);
  if (x < a + 1) {
    let term = 1 / a;
    let sum = term;
    for (let k = 1; k < 10_000; k++) {
      term *= x / (a + k);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * EPS) break;
    }
    return Math.max(0, 1 - sum * Math.exp(logPrefix));
  }
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 10_000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < EPS) break;
  }
  return Math.min(1, Math.exp(logPrefix) * h);
}

/** P(X > x) for X chi-square with k degrees of freedom: Q(k/2, x/2) (A&S 26.4.19). */
export function chiSquareSurvival(x: number, degreesOfFreedom: number): number {
  if (x <= 0) return 1;
  return regularizedGammaQ(degreesOfFreedom / 2, x / 2);
}

/**
 * Kolmogorov's limiting survival function Q(λ) = P(sup|B| > λ) = 2 Σ_{j≥1} (−1)^{j−1} e^{−2j²λ²}
 * (Kolmogorov 1933). For small λ that alternating series converges slowly, so the equivalent
 * theta-function form of the CDF, (√(2π)/λ) Σ_{j≥1} e^{−(2j−1)²π²/(8λ²)}, is used instead.
 */
export function kolmogorovSurvival(lambda: number): number {
  if (lambda <= 0) return 1;
  if (lambda < 1.18) {
    const factor = -(Math.PI * Math.PI) / (8 * lambda * lambda);
    let cdf = 0;
    for (let j = 1; j <= 20; j++) cdf += Math.exp(factor * (2 * j - 1) ** 2);
    return Math.min(1, Math.max(0, 1 - (Math.sqrt(2 * Math.PI) / lambda) * cdf));
  }
  let sum = 0;
  for (let j = 1; j <= 100; j++) {
    const term = Math.exp(-2 * j * j * lambda * lambda);
    sum += j % 2 === 1 ? term : -term;
    if (term < 1e-17) break;
  }
  return Math.min(1, Math.max(0, 2 * sum));
}

/**
 * p-value of a one-sample Kolmogorov–Smirnov statistic D from N observations, with Stephens'
 * (1970) finite-N correction λ = (√N + 0.12 + 0.11/√N)·D (as in Numerical Recipes, 3rd ed., §14.3.3).
 */
export function kolmogorovSmirnovPValue(d: number, sampleSize: number): number {
  const root = Math.sqrt(sampleSize);
  return kolmogorovSurvival((root + 0.12 + 0.11 / root) * d);
}

/** The standard Gumbel (maximum) CDF exp(−e^{−x}). */
export function gumbelCdf(x: number): number {
  return Math.exp(-Math.exp(-x));
}

/** One cell of a binned chi-square test: the values from..to (inclusive) pooled. */
export interface ChiSquareCell {
  readonly from: number;
  readonly to: number;
  readonly observed: number;
  readonly expected: number;
}

export interface ChiSquareResult {
  readonly statistic: number;
  readonly degreesOfFreedom: number;
  /** null when fewer than two cells could be formed (too few samples to test anything). */
  readonly pValue: number | null;
  readonly cells: readonly ChiSquareCell[];
}

/**
 * Pearson's chi-square goodness-of-fit test (Pearson 1900) of counts of the values
 * offset, offset+1, ... against their exact probabilities. Adjacent values are pooled, in order,
 * until each cell expects at least `minExpected` observations (5 is common practice), so the
 * chi-square approximation to the statistic's law is sound; a short last cell joins its neighbour.
 * An observation of a value of probability 0 makes the statistic infinite and the p-value 0.
 */
export function binnedChiSquare(observed: readonly number[], probabilities: readonly number[], minExpected = 5): ChiSquareResult {
  if (observed.length !== probabilities.length) throw new RangeError('binnedChiSquare: observed and probabilities differ in length');
  const total = observed.reduce((a, b) => a + b, 0);
  // A value the law gives probability 0 cannot occur at all: one such observation fails the test.
  const impossible = observed.some((count, v) => count > 0 && !(probabilities[v] > 0));
  const cells: { from: number; to: number; observed: number; expected: number }[] = [];
  let current: { from: number; to: number; observed: number; expected: number } | null = null;
  for (let v = 0; v < probabilities.length; v++) {
    if (current === null) current = { from: v, to: v, observed: 0, expected: 0 };
    current.to = v;
    current.observed += observed[v];
    current.expected += total * probabilities[v];
    if (current.expected >= minExpected) {
      cells.push(current);
      current = null;
    }
  }
  if (current !== null) {
    if (cells.length > 0) {
      const last = cells[cells.length - 1];
      last.to = current.to;
      last.observed += current.observed;
      last.expected += current.expected;
    } else {
      cells.push(current);
    }
  }
  // Drop leading/trailing cells with zero expectation and zero observations (outside the support).
  const useful = cells.filter((c) => c.expected > 0 || c.observed > 0);
  let statistic = 0;
  for (const cell of useful) {
    statistic += cell.expected > 0 ? (cell.observed - cell.expected) ** 2 / cell.expected : Number.POSITIVE_INFINITY;
  }
  const degreesOfFreedom = useful.length - 1;
  if (impossible) return { statistic: Number.POSITIVE_INFINITY, degreesOfFreedom, pValue: 0, cells: useful };
  const pValue = degreesOfFreedom >= 1 ? (Number.isFinite(statistic) ? chiSquareSurvival(statistic, degreesOfFreedom) : 0) : null;
  return { statistic, degreesOfFreedom, pValue, cells: useful };
}

export interface KolmogorovSmirnovResult {
  readonly statistic: number;
  readonly pValue: number | null;
}

/**
 * One-sample Kolmogorov–Smirnov test of integer observations against a continuous CDF F. The
 * empirical CDF at each integer m is compared with F(m + 1/2) (a continuity correction): for a
 * discrete variable whose law is well approximated by F on the half-integer grid this is the
 * fair comparison, and the Kolmogorov p-value is then conservative (discrete data; from memory:
 * Noether 1963). `counts[v]` is the number of observations equal to offset + v.
 */
export function integerKolmogorovSmirnov(counts: readonly number[], offset: number, cdf: (x: number) => number): KolmogorovSmirnovResult {
  const total = counts.reduce((a, b) => a + b, 0);
  if (total === 0) return { statistic: 0, pValue: null };
  let cumulative = 0;
  let d = cdf(offset - 0.5);
  for (let v = 0; v < counts.length; v++) {
    cumulative += counts[v];
    d = Math.max(d, Math.abs(cumulative / total - cdf(offset + v + 0.5)));
  }
  d = Math.max(d, 1 - cdf(offset + counts.length - 0.5));
  return { statistic: d, pValue: kolmogorovSmirnovPValue(d, total) };
}

/** A chi-square comparison of counts of offset, offset+1, ... with their exact law, as reported by the check endpoints. */
export interface ExactLawReport {
  readonly law: 'exact';
  readonly test: 'chi-square';
  readonly statistic: number;
  readonly pValue: number | null;
  readonly degreesOfFreedom: number;
  readonly offset: number;
  readonly observed: number[];
  readonly expected: number[];
  readonly cells: readonly ChiSquareCell[];
}

/** binnedChiSquare of the counts against the law, with the cells labelled by their values. */
export function exactLawReport(observed: number[], expected: number[], offset: number): ExactLawReport {
  const result = binnedChiSquare(observed, expected);
  return {
    law: 'exact',
    test: 'chi-square',
    statistic: result.statistic,
    pValue: result.pValue,
    degreesOfFreedom: result.degreesOfFreedom,
    offset,
    observed,
    expected,
    cells: result.cells.map((c) => ({ ...c, from: c.from + offset, to: c.to + offset })),
  };
}
