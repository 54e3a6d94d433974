import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';

/**
 * Pearson's chi-square goodness-of-fit test of observed counts against expected probabilities.
 * The p-value comes from @stdlib's chi-square CDF (not hand-rolled).
 */
export function chiSquareTest(observed: readonly number[], probabilities: readonly number[]): { statistic: number; pValue: number; dof: number } {
  const total = observed.reduce((a, b) => a + b, 0);
  let statistic = 0;
  for (let i = 0; i < observed.length; i++) {
    const expected = total * probabilities[i];
    statistic += (observed[i] - expected) ** 2 / expected;
  }
  const dof = observed.length - 1;
  return { statistic, pValue: 1 - chisquareCdf(statistic, dof), dof };
}
