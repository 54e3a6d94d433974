import { familyKey, type PartitionFamily } from '../../core/family.js';
import type { Partition } from '../../core/partition.js';
import { planPartitionSampler } from '../../core/partitions/plan.js';
import { CHECK_ALPHA, checkPartitionSamples, type PartitionCheckReport } from '../../core/pictures/check.js';
import { boundarySvg, checkHistograms, histogramSvg, stackedSvg } from '../../core/pictures/check-svg.js';
import { sampleSource } from '../../core/seeding.js';
import { defineEndpoint } from '../endpoint.js';
import type { Limits } from '../limits.js';
import { respondWithJson } from '../respond.js';
import { checkSamplesBudget } from '../work-budget.js';
import { checkQuery } from '../../schemas/check.js';
import { PROBLEM_RESPONSES } from './docs.js';
import { respondWithBody, SVG_CONTENT_TYPE } from './diagram.js';
import { partitionFamilyOf } from '../../library/partitions.js';

const CHECK_PATH = '/v1/partitions/check';

export interface PartitionCheck {
  readonly family: PartitionFamily;
  readonly seed: string;
  readonly method: string;
  readonly report: PartitionCheckReport;
}

/**
 * Draws samples 0..samples−1 of the seed (the very samples GET /v1/partitions hands out) and
 * checks them. Refused up front when the estimated time is over the work budget.
 */
export function runPartitionCheck(query: Parameters<typeof partitionFamilyOf>[0], samples: number, seed: string, limits: Limits): PartitionCheck {
  const family = partitionFamilyOf(query);
  const sampler = planPartitionSampler(family);
  checkSamplesBudget('checking', samples, sampler, sampler.expectedLength, limits);
  const key = familyKey(family);
  function* draws(): Generator<Partition> {
    for (let i = 0; i < samples; i++) yield sampler.sample(sampleSource(seed, i, key));
  }
  return { family, seed, method: sampler.method, report: checkPartitionSamples(family, draws()) };
}

/** Both plots of a check, stacked (format=svg). */
export function checkSvg(check: PartitionCheck): string {
  const drawings = checkHistograms(check.report, check.family.distinct === true).map(histogramSvg);
  if (check.report.boundary) drawings.push(boundarySvg(check.report.boundary, check.report.samples));
  return stackedSvg(`Distribution check of ${check.report.samples} samples of partitions of ${check.family.n}`, drawings);
}

/** The JSON body: the headline test first, then the details. */
export function checkJson(check: PartitionCheck): Record<string, unknown> {
  const { largestPart, boundary, samples, ones, verdict } = check.report;
  return {
    family: check.family,
    seed: check.seed,
    method: check.method,
    samples,
    // The headline test is always against an exact law; above the largest-part table it is `ones`.
    quantity: verdict.quantity,
    law: verdict.law,
    test: verdict.test,
    statistic: verdict.statistic,
    pValue: verdict.pValue,
    alpha: CHECK_ALPHA,
    passed: verdict.pValue === null ? null : verdict.pValue >= CHECK_ALPHA,
    largestPart,
    ones,
    boundary,
  };
}

export const checkEndpoint = defineEndpoint({
  path: CHECK_PATH,
  summary: 'Check the samples against exact and limit laws',
  description:
    'Draws samples 0..samples−1 of a seed (the same ones GET /v1/partitions returns) and compares the law of their largest part with the exact law from counting tables (Pearson chi-square, cells pooled to expect >= 5; n <= 5000 with any constraints, n <= 13600 unconstrained, n <= 11600 distinct parts). Above that the largest part is compared with the Erdős–Lehner Gumbel limit law (Kolmogorov–Smirnov, `largestPart.asymptotic: true`, not used for `passed`) and the headline test is the exact law of `ones` (chi-square): the multiplicity of the part 1, P(X >= j) = p(n−j)/p(n), or for distinct parts the sum of the power-of-2 parts, P(X >= j) = q(n−j)/q(n) (the Glaisher bijection). `quantity` names the tested statistic. It compares their mean scaled diagram boundary with the limit shape (Vershik: e^(-cx) + e^(-cy) = 1, c = π/√6; distinct parts e^(cy) = 1 + e^(-cx), c = π/√12). `passed` uses alpha = 1e-4 of that exact law.',
  query: checkQuery,
  responses: {
    '200': { description: 'The check (application/json) or its plots (image/svg+xml).', contentTypes: ['application/json', 'image/svg+xml'] },
    '304': { description: 'Not modified.', contentTypes: [] },
    ...PROBLEM_RESPONSES,
  },
  handle(request, query, context) {
    const seeded = query.seed !== undefined;
    const seed = query.seed ?? context.drawSeed();
    const check = runPartitionCheck(query, query.samples, seed, context.limits);
    const cacheKey = seeded ? { ...query, seed } : null;
    if (query.format === 'svg') {
      return respondWithBody(request, CHECK_PATH, cacheKey, checkSvg(check), SVG_CONTENT_TYPE, { 'partsmith-seed': seed, 'partsmith-method': check.method });
    }
    return respondWithJson(request, CHECK_PATH, cacheKey, checkJson(check));
  },
});
