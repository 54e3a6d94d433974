import cdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { barsRejectSampler } from '../../src/core/compositions/bars-reject.js';
import { fixedTiltedSampler } from '../../src/core/compositions/fixed-tilted.js';
import { planCompositionSampler } from '../../src/core/compositions/plan.js';
import { fixedCore, freeCore } from '../../src/core/compositions/reduce.js';
import { resolveCompositions } from '../../src/core/compositions/resolve.js';
import { tiltedRenewalSampler } from '../../src/core/compositions/tilted-renewal.js';
import type { CompositionFamily } from '../../src/core/family.js';
import type { CompositionSampler } from '../../src/core/sampler.js';
import { sampleSource } from '../../src/core/seeding.js';
import { enumerateCompositions } from '../support/enumerate-compositions.js';

/**
 * Chi-square goodness of fit against the uniform law over the brute-force enumeration of each
 * family. Each test fails with probability alpha = 1e-4 when the sampler is exactly uniform
 * (fixed seeds, so a run is reproducible). About 30 expected hits per composition keeps the
 * chi-square approximation good (common practice: >= 5 per cell).
 */
const ALPHA = 1e-4;
const PER_CELL = 30;

function chiSquarePValue(sampler: CompositionSampler, family: CompositionFamily, seed: string): number {
  const members = enumerateCompositions(family);
  const index = new Map(members.map((c, i) => [c.join(','), i]));
  const hits = new Float64Array(members.length);
  const draws = PER_CELL * members.length;
  for (let i = 0; i < draws; i++) {
    const c = sampler.sample(sampleSource(seed, i, 'uniformity'));
    const at = index.get(c.join(','));
    if (at === undefined) throw new Error(`sample ${c.join(',')} is not in the family`);
    hits[at]++;
  }
  let stat = 0;
  for (const h of hits) stat += (h - PER_CELL) ** 2 / PER_CELL;
  return 1 - cdf(stat, members.length - 1);
}

const fam = (f: Omit<CompositionFamily, 'kind'>): CompositionFamily => ({ kind: 'composition', ...f });

describe('planned samplers are uniform (chi-square, alpha = 1e-4 each)', () => {
  const cases: [string, Omit<CompositionFamily, 'kind'>, string][] = [
    ['unrestricted n = 10 (512 compositions)', { n: 10 }, 'gap-bits/1'],
    ['k = 4 parts, n = 14 (286)', { n: 14, length: 4 }, 'gap-subset/1'],
    ['weak, k = 3, n = 8 (45)', { n: 8, length: 3, minPart: 0 }, 'gap-subset/1'],
    ['parts in [2, 5], n = 20 (1744)', { n: 20, minPart: 2, maxPart: 5 }, 'count-table/1'],
    ['allowed {1, 3, 4}, n = 15 (714)', { n: 15, allowed: [1, 3, 4] }, 'count-table/1'],
    ['k = 5 parts in [1, 4], n = 12', { n: 12, length: 5, maxPart: 4 }, 'count-table/1'],
    ['k = 4 parts from {0, 2, 5}, n = 12', { n: 12, length: 4, allowed: [0, 2, 5] }, 'count-table/1'],
    ['k = 9 parts, n = 12 (more bars than stars)', { n: 12, length: 9 }, 'gap-subset/1'],
    // A part list in arithmetic progression is a full range once shifted and scaled
    // ({2, 5, 8, 11} -> {0..3}, d = 3): gap-subset on the core, parts mapped back as 2 + 3v.
    // (Regression: the planner once ignored the scale here and drew parts outside the list.)
    ['k = 3 parts from {2, 5, 8, 11}, n = 15 (10)', { n: 15, length: 3, allowed: [2, 5, 8, 11] }, 'gap-subset/1'],
    ['k = 6 parts from {2, 7}, n = 17 (6)', { n: 17, length: 6, allowed: [7, 2] }, 'gap-subset/1'],
    // Likewise without a length: {4, 8, 12} is 4 x {1, 2, 3}, every composition of 12 / 4 = 3.
    ['allowed {4, 8, 12}, n = 12 (4)', { n: 12, allowed: [12, 4, 8] }, 'gap-bits/1'],
    ['allowed {3, 6}, minPart 2, n = 6 (2)', { n: 6, minPart: 2, allowed: [3, 6] }, 'gap-bits/1'],
  ];
  for (const [name, f, method] of cases) {
    it(name, () => {
      const sampler = planCompositionSampler(fam(f));
      expect(sampler.method).toBe(method);
      expect(chiSquarePValue(sampler, fam(f), 'chi')).toBeGreaterThan(ALPHA);
    });
  }
});

describe('large-n methods, forced at small n, are uniform (chi-square, alpha = 1e-4 each)', () => {
  it('tilted-renewal, parts in [2, 5], n = 20, table T = 6 (i.i.d. prefix, acceptance and finishing table all used)', () => {
    const f = fam({ n: 20, minPart: 2, maxPart: 5 });
    const sampler = tiltedRenewalSampler(freeCore(resolveCompositions(f)), 6);
    expect(chiSquarePValue(sampler, f, 'renewal-a')).toBeGreaterThan(ALPHA);
  });
  it('tilted-renewal, allowed {1, 3, 4}, n = 15, T = 5', () => {
    const f = fam({ n: 15, allowed: [1, 3, 4] });
    const sampler = tiltedRenewalSampler(freeCore(resolveCompositions(f)), 5);
    expect(chiSquarePValue(sampler, f, 'renewal-b')).toBeGreaterThan(ALPHA);
  });
  it('tilted-renewal, parts >= 3 (window reaches 0), n = 18, T = 4', () => {
    const f = fam({ n: 18, minPart: 3 });
    const sampler = tiltedRenewalSampler(freeCore(resolveCompositions(f)), 4);
    expect(chiSquarePValue(sampler, f, 'renewal-c')).toBeGreaterThan(ALPHA);
  });
  it('tilted-renewal, allowed {4, 6, 10} (gcd 2 scaled out), n = 30, T = 4', () => {
    const f = fam({ n: 30, allowed: [4, 6, 10] });
    const sampler = tiltedRenewalSampler(freeCore(resolveCompositions(f)), 4);
    expect(chiSquarePValue(sampler, f, 'renewal-d')).toBeGreaterThan(ALPHA);
  });
  it('tilted-last-part, k = 5 parts in [1, 4], n = 12', () => {
    const f = fam({ n: 12, length: 5, maxPart: 4 });
    expect(chiSquarePValue(fixedTiltedSampler(fixedCore(resolveCompositions(f))), f, 'last-a')).toBeGreaterThan(ALPHA);
  });
  it('tilted-last-part, k = 5 parts in [1, 4], n = 16 (flipped: mean above the middle)', () => {
    const f = fam({ n: 16, length: 5, maxPart: 4 });
    expect(chiSquarePValue(fixedTiltedSampler(fixedCore(resolveCompositions(f))), f, 'last-b')).toBeGreaterThan(ALPHA);
  });
  it('tilted-last-part, k = 4 parts from {1, 3, 6}, n = 15 (list, tilt of either sign)', () => {
    const f = fam({ n: 15, length: 4, allowed: [1, 3, 6] });
    expect(chiSquarePValue(fixedTiltedSampler(fixedCore(resolveCompositions(f))), f, 'last-c')).toBeGreaterThan(ALPHA);
  });
  it('bars-reject, k = 4 parts in [0, 5], n = 13', () => {
    const f = fam({ n: 13, length: 4, minPart: 0, maxPart: 5 });
    const core = fixedCore(resolveCompositions(f));
    expect(chiSquarePValue(barsRejectSampler(core, 0.5), f, 'bars')).toBeGreaterThan(ALPHA);
  });
});
