import { describe, expect, it } from 'vitest';
import { EmptyFamilyError, LimitExceededError } from '../../src/core/errors.js';
import { lengthOf, partsOf, sizeOf } from '../../src/core/partition.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { drawFamily } from '../support/random-families.js';
import { enumerateFamily, satisfies } from '../support/enumerate-constrained.js';

/**
 * Every combination of the six partition constraints (distinct, minPart, maxPart, length,
 * maxLength, allowed), each present with probability 1/2 (allowed 1/4), n log-uniform up to 1e9,
 * bounds drawn on the scale of n so that most families are non-empty and the constraints bind.
 * Each family is planned: it must be served — one sample drawn and checked to sum to n and to
 * satisfy every constraint — or be empty (checked by enumeration at small n). A refusal over a
 * work or table limit is a gap: the only refusals the product should make are for the size of
 * the output, which one multiplicity-form sample never reaches here (at most ~45,000 distinct
 * sizes at n = 1e9). The gaps left today are listed in KNOWN_GAPS (none for this seed): the
 * test fails on any new refusal, and also when a listed gap gets served, so the list stays
 * true. Every refusal must name the family and say what would fit. Fixed seed; no statistics,
 * so no false alarms.
 */
const KNOWN_GAPS: string[] = [];

describe('every combination of the six constraints, n up to 1e9', () => {
  it('is served or empty; refused for work only in the listed gaps, with a message that says what fits', () => {
    const source = sampleSource('combinations-property', 0, 'test');
    const outcomes = { served: 0, empty: 0, checked: 0 };
    const refused: string[] = [];
    for (let trial = 0; trial < 150; trial++) {
      const f = drawFamily(source);
      const label = JSON.stringify(f);
      try {
        const sampler = constrainedPartitionSampler(f);
        outcomes.served++;
        const p = sampler.sample(sampleSource('combinations-property', trial, 'sample'));
        expect(sizeOf(p), label).toBe(f.n);
        if (lengthOf(p) <= 1e5) expect(satisfies(partsOf(p), f), `${label} ${sampler.method}`).toBe(true);
        outcomes.checked++;
      } catch (error) {
        if (error instanceof EmptyFamilyError) {
          outcomes.empty++;
          if (f.n <= 40) expect(enumerateFamily(f), label).toEqual([]);
          continue;
        }
        if (!(error instanceof LimitExceededError)) throw error;
        expect(error.message, label).not.toMatch(/cell|table|boltzmann|subset|mixture|\/1/i);
        expect(error.message, label).toMatch(new RegExp(`partitions of ${f.n} `));
        expect(error.message, label).toMatch(/fit/);
        refused.push(label);
      }
    }
    expect(refused).toEqual(KNOWN_GAPS);
    expect(outcomes.served).toBeGreaterThan(60);
    expect(outcomes.checked).toBe(outcomes.served);
  });
});
