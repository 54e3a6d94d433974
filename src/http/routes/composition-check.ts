import { planCompositionSampler } from '../../core/compositions/plan.js';
import { familyKey, type CompositionFamily } from '../../core/family.js';
import { CHECK_ALPHA } from '../../core/pictures/check.js';
import { exactLawHistogram, histogramSvg, stackedSvg } from '../../core/pictures/check-svg.js';
import { checkCompositionParts, type CompositionPartsReport } from '../../core/pictures/composition-parts.js';
import type { CompositionSampler } from '../../core/sampler.js';
import { sampleSource } from '../../core/seeding.js';
import { deadlineOf, RequestStopped } from '../deadline.js';
import { defineEndpoint } from '../endpoint.js';
import type { Limits } from '../limits.js';
import { ProblemError } from '../problem.js';
import { respondWithJson } from '../respond.js';
import { checkSamplesBudget } from '../work-budget.js';
import { compositionCheckQuery } from '../../schemas/composition-check.js';
import { compositionFamilyOf } from '../../library/compositions.js';
import { PROBLEM_RESPONSES } from './docs.js';
import { respondWithBody, SVG_CONTENT_TYPE } from './diagram.js';

export const COMPOSITION_CHECK_PATH = '/v1/compositions/check';

export interface CompositionCheck {
  readonly family: CompositionFamily;
  readonly seed: string;
  readonly method: string;
  readonly report: CompositionPartsReport;
}

/**
 * Draws samples 0..samples−1 of the seed — sample i is `sampler.sample(sampleSource(seed, i,
 * familyKey(family)))`, exactly what GET /v1/compositions returns at index i — and tests their
 * numbers of parts against the exact law 1 + Binomial(n − 1, 1/2). `sampler` defaults to the
 * service's own; tests pass a deliberately biased one through the very same code.
 * Refused up front when the estimated time is over the work budget; stops at the request's deadline.
 */
export function runCompositionCheck(n: number, samples: number, seed: string, limits: Limits, sampler?: CompositionSampler): CompositionCheck {
  const family = compositionFamilyOf({ n });
  const used = sampler ?? planCompositionSampler(family);
  checkSamplesBudget('checking', samples, used, used.expectedLength, limits);
  const key = familyKey(family);
  const deadline = deadlineOf(limits);
  function* partCounts(): Generator<number> {
    for (let i = 0; i < samples; i++) {
      deadline?.check(i);
      yield used.sample(sampleSource(seed, i, key)).length;
    }
  }
  try {
    return { family, seed, method: used.method, report: checkCompositionParts(n, partCounts()) };
  } catch (error) {
    if (!(error instanceof RequestStopped)) throw error;
    throw new ProblemError(503, `This check ran past the deadline of ${error.budgetMs} ms per request after ${error.produced} samples. Ask for fewer samples or a smaller n.`, undefined, {
      'retry-after': String(Math.max(1, Math.ceil(error.budgetMs / 1000))),
    });
  }
}

/** The plot input: observed numbers of parts against the exact binomial law. */
export function compositionCheckSvg(check: CompositionCheck): string {
  return stackedSvg(`Distribution check of ${check.report.samples} samples of compositions of ${check.family.n}`, [histogramSvg(exactLawHistogram('number of parts', check.report))]);
}

/** The JSON body: the headline test first (same fields as the partitions check), then the details. */
export function compositionCheckJson(check: CompositionCheck): Record<string, unknown> {
  const { report } = check;
  return {
    family: check.family,
    seed: check.seed,
    method: check.method,
    samples: report.samples,
    quantity: 'number of parts',
    law: report.law,
    test: report.test,
    statistic: report.statistic,
    pValue: report.pValue,
    alpha: CHECK_ALPHA,
    passed: report.pValue === null ? null : report.pValue >= CHECK_ALPHA,
    parts: { offset: report.offset, observed: report.observed, expected: report.expected, degreesOfFreedom: report.degreesOfFreedom, cells: report.cells },
  };
}

export const compositionCheckEndpoint = defineEndpoint({
  path: COMPOSITION_CHECK_PATH,
  summary: 'Check composition samples against the exact law of their number of parts',
  description:
    'Draws samples 0..samples−1 of a seed (the same ones GET /v1/compositions returns) and compares their numbers of parts with the exact law: a uniform composition of n cuts each of the n − 1 gaps between units with probability 1/2, so it has 1 + Binomial(n − 1, 1/2) parts (Stanley, Enumerative Combinatorics I, §1.2). Pearson chi-square, cells pooled to expect >= 5; `passed` uses alpha = 1e-4. Unrestricted compositions only.',
  query: compositionCheckQuery,
  responses: {
    '200': { description: 'The check (application/json) or its plot (image/svg+xml).', contentTypes: ['application/json', 'image/svg+xml'] },
    '304': { description: 'Not modified.', contentTypes: [] },
    ...PROBLEM_RESPONSES,
  },
  handle(request, query, context) {
    const seeded = query.seed !== undefined;
    const seed = query.seed ?? context.drawSeed();
    const check = runCompositionCheck(query.n, query.samples, seed, context.limits);
    const cacheKey = seeded ? { ...query, seed } : null;
    if (query.format === 'svg') {
      return respondWithBody(request, COMPOSITION_CHECK_PATH, cacheKey, compositionCheckSvg(check), SVG_CONTENT_TYPE, { 'partsmith-seed': seed, 'partsmith-method': check.method });
    }
    return respondWithJson(request, COMPOSITION_CHECK_PATH, cacheKey, compositionCheckJson(check));
  },
});
