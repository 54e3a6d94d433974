import { familyKey } from '../../core/family.js';
import { lengthOf, partsOf, type Partition } from '../../core/partition.js';
import { planPartitionSampler } from '../../core/partitions/plan.js';
import { checkDiagramLimits, conjugateParts, DIAGRAM_LIMITS, ferrersText, sortedParts } from '../../core/pictures/ferrers.js';
import { ferrersSvg } from '../../core/pictures/ferrers-svg.js';
import { sampleSource } from '../../core/seeding.js';
import { IMMUTABLE, matchesIfNoneMatch, NO_STORE, strongEtag } from '../caching.js';
import { defineEndpoint } from '../endpoint.js';
import { checkSamplesBudget } from '../work-budget.js';
import type { Limits } from '../limits.js';
import { diagramQuery } from '../../schemas/diagram.js';
import { PROBLEM_RESPONSES } from './docs.js';
import { partitionFamilyOf } from '../../library/partitions.js';

const DIAGRAM_PATH = '/v1/partitions/diagram';

export const SVG_CONTENT_TYPE = 'image/svg+xml; charset=utf-8';
export const TEXT_CONTENT_TYPE = 'text/plain; charset=utf-8';

/**
 * A whole (small) body with the service's caching rules: immutable with a strong ETag when the
 * answer is a pure function of the query (`query` given), no-store otherwise.
 */
export async function respondWithBody(
  request: Request,
  path: string,
  query: Record<string, unknown> | null,
  body: string,
  contentType: string,
  extraHeaders: Record<string, string> = {},
): Promise<Response> {
  const headers: Record<string, string> = { 'content-type': contentType, ...extraHeaders };
  if (query) {
    const etag = strongEtag(path, query);
    headers.etag = etag;
    headers['cache-control'] = IMMUTABLE;
    if (matchesIfNoneMatch(request, etag)) return new Response(null, { status: 304, headers: { etag, 'cache-control': IMMUTABLE } });
  } else {
    headers['cache-control'] = NO_STORE;
  }
  return new Response(body, { status: 200, headers });
}

/** Sample `index` of `seed` for the family: the same partition GET /v1/partitions returns at that index. */
export function drawSample(query: Parameters<typeof partitionFamilyOf>[0], seed: string, index: number, limits: Limits): { partition: Partition; method: string } {
  const family = partitionFamilyOf(query);
  const sampler = planPartitionSampler(family);
  checkSamplesBudget('drawing', 1, sampler, sampler.expectedLength, limits);
  return { partition: sampler.sample(sampleSource(seed, index, familyKey(family))), method: sampler.method };
}

export const diagramEndpoint = defineEndpoint({
  path: DIAGRAM_PATH,
  summary: 'A Ferrers diagram, as SVG or text',
  description:
    `Draws a given partition (parts=5,4,1,1) or sample index of a seed (n, seed, index and the constraints of GET /v1/partitions). One cell per unit, one row per part, largest part on top; the Durfee square is highlighted. Diagrams are drawn with at most ${DIAGRAM_LIMITS.maxRows} rows, ${DIAGRAM_LIMITS.maxColumns} columns and ${DIAGRAM_LIMITS.maxCells} cells; larger ones are refused with 422.`,
  query: diagramQuery,
  responses: {
    '200': { description: 'The diagram (image/svg+xml or text/plain).', contentTypes: ['image/svg+xml', 'text/plain'] },
    '304': { description: 'Not modified.', contentTypes: [] },
    ...PROBLEM_RESPONSES,
  },
  async handle(request, query, context) {
    let parts: number[];
    const headers: Record<string, string> = {};
    let cacheable = true;
    let seed = query.seed;
    if (query.parts !== undefined) {
      const sorted = sortedParts(query.parts);
      checkDiagramLimits(sorted.length, sorted[0], sorted.reduce((a, b) => a + b, 0));
      parts = sorted;
    } else {
      const n = query.n!;
      // Every cell is a unit of n: refuse before sampling when n alone is over the cell limit.
      checkDiagramLimits(0, 0, n);
      cacheable = seed !== undefined;
      seed ??= context.drawSeed();
      const { partition, method } = drawSample({ ...query, n }, seed, query.index, context.limits);
      checkDiagramLimits(lengthOf(partition), partition.sizes[0] ?? 0, n);
      parts = partsOf(partition);
      headers['partsmith-seed'] = seed;
      headers['partsmith-method'] = method;
    }
    if (query.conjugate) parts = conjugateParts(parts);
    const body = query.style === 'text' ? ferrersText(parts) : ferrersSvg(parts);
    const contentType = query.style === 'text' ? TEXT_CONTENT_TYPE : SVG_CONTENT_TYPE;
    return respondWithBody(request, DIAGRAM_PATH, cacheable ? { ...query, seed } : null, body, contentType, headers);
  },
});
