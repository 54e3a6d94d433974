import { describe, expect, it } from 'vitest';
import { countPartitions } from '../../src/core/counting/partition-counts.js';
import { EmptyFamilyError, LimitExceededError } from '../../src/core/errors.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { partsOf, sizeOf } from '../../src/core/partition.js';
import { nextBelow } from '../../src/core/random.js';
import { sampleSource } from '../../src/core/seeding.js';
import {
  constrainedPartitionSampler,
  planCandidates,
  SAMPLE_WORK_LIMIT,
} from '../../src/core/partitions/constrained/plan.js';
import { satisfies, wellFormed } from '../support/enumerate-constrained.js';

type Mutable = { -readonly [K in keyof PartitionFamily]: PartitionFamily[K] };

function randomFamily(source: ReturnType<typeof sampleSource>): Mutable {
  const n = 1 + nextBelow(source, 40);
  const f: Mutable = { kind: 'partition', n };
  if (nextBelow(source, 2)) f.distinct = true;
  if (nextBelow(source, 3) === 0) f.minPart = 1 + nextBelow(source, 4);
  if (nextBelow(source, 3) === 0) f.maxPart = (f.minPart ?? 1) + nextBelow(source, 12);
  const lengthKind = nextBelow(source, 4);
  if (lengthKind === 0) f.length = nextBelow(source, Math.min(n, 8) + 1);
  if (lengthKind === 1) f.maxLength = nextBelow(source, 10);
  if (nextBelow(source, 3) === 0) {
    const allowed = new Set<number>();
    const size = 1 + nextBelow(source, 8);
    for (let i = 0; i < size; i++) allowed.add(1 + nextBelow(source, 20));
    f.allowed = [...allowed];
  }
  return f;
}

describe('every sample satisfies every constraint', () => {
  it('random feasible families at small n, every applicable method', () => {
    const source = sampleSource('properties', 0, 'test');
    let checked = 0;
    for (let trial = 0; trial < 250; trial++) {
      const f = randomFamily(source);
      if (countPartitions(f) === 0n) {
        expect(() => constrainedPartitionSampler(f), JSON.stringify(f)).toThrow(EmptyFamilyError);
        continue;
      }
      for (const candidate of planCandidates(f, true)) {
        const sampler = constrainedPartitionSampler(f, { method: candidate.method.split('/')[0] });
        for (let i = 0; i < 20; i++) {
          const p = sampler.sample(sampleSource('properties', i, `${trial}`));
          const ok = wellFormed(p) && sizeOf(p) === f.n && satisfies(partsOf(p), f);
          expect(ok, `${JSON.stringify(f)} ${candidate.method} -> ${partsOf(p)}`).toBe(true);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(2000);
  });

  it('large n: distinct parts, parts <= m, exactly k parts, at most K parts, allowed sizes', () => {
    const families: PartitionFamily[] = [
      { kind: 'partition', n: 100_000, distinct: true },
      { kind: 'partition', n: 100_000, maxPart: 50 },
      { kind: 'partition', n: 100_000, minPart: 7 },
      { kind: 'partition', n: 100_000, length: 30, minPart: 2 },
      { kind: 'partition', n: 100_000, distinct: true, length: 30 },
      { kind: 'partition', n: 100_000, maxLength: 40 },
      { kind: 'partition', n: 100_000, allowed: [3, 7, 10, 25, 60] },
      { kind: 'partition', n: 100_000, distinct: true, minPart: 10, maxPart: 2000 },
    ];
    for (const f of families) {
      const sampler = constrainedPartitionSampler(f);
      for (let i = 0; i < 3; i++) {
        const p = sampler.sample(sampleSource('large', i, 'test'));
        expect(wellFormed(p) && sizeOf(p) === f.n && satisfies(partsOf(p), f), `${JSON.stringify(f)} ${sampler.method}`).toBe(true);
      }
    }
  });
});

describe('planner errors and limits', () => {
  it('says why a family is empty', () => {
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 7, allowed: [2, 4] })).toThrow(
      new EmptyFamilyError('no partition of 7 has all parts in {2, 4}'),
    );
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 5, distinct: true, length: 3 })).toThrow(EmptyFamilyError);
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 11, allowed: [3, 5], maxLength: 2 })).toThrow(EmptyFamilyError);
  });
  it('rejects contradictory bounds with a RangeError naming them', () => {
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 10, minPart: 5, maxPart: 3 })).toThrow(/minPart \(5\) is larger than maxPart \(3\)/);
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 10, length: 11 })).toThrow(/at most 10 parts/);
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 10, length: 2, maxLength: 3 })).toThrow(RangeError);
  });
  it(`names the limit and what would fit when no method fits (<= ${SAMPLE_WORK_LIMIT} steps per sample), never a method or a table`, () => {
    // Box with both sides binding, 31,623 rows and 94,868 columns, a third full (half-full boxes
    // this large are served by box-rotation): ~2.6e7 steps per sample.
    const f: PartitionFamily = { kind: 'partition', n: 1_000_000_000, length: 31_623, maxPart: 94_869 };
    expect(() => constrainedPartitionSampler(f)).toThrow(LimitExceededError);
    try {
      constrainedPartitionSampler(f);
    } catch (error) {
      const { message, limit } = error as LimitExceededError;
      expect(limit).toMatch(/work per sample/);
      expect(message).toMatch(/exactly 31623 parts/);
      expect(message).toMatch(/fits with at most about \d+ parts/);
      expect(message).not.toMatch(/cell|table|boltzmann|subset|mixture|rotation|\/1/i);
    }
    // The short side is the part bound: the refusal says how small maxPart would have to be.
    const g: PartitionFamily = { kind: 'partition', n: 1_000_000_000, maxLength: 94_869, maxPart: 31_623 };
    expect(() => constrainedPartitionSampler(g)).toThrow(/fits with maxPart at most about \d+/);
    // Distinct parts from a long list at large n where whether any subset sums to n is not decided
    // within the work bound (1000 sizes within 3000 of 1e6: no run of sums forms): the refusal
    // says which n are decided (subset-sum-reach.ts).
    const near = Array.from({ length: 1000 }, (_, i) => 1_000_000 - 3 * i);
    const h: PartitionFamily = { kind: 'partition', n: 500_000_000, distinct: true, allowed: near };
    expect(() => constrainedPartitionSampler(h)).toThrow(/with these sizes n up to about 95000 or within about 95000 below their sum \(998501500\) fits$/);
    // The long list 1, 5, 9, ... at n = 1e6 (refused before reachability had the run argument) is sampled.
    const spaced = Array.from({ length: 1000 }, (_, i) => 1 + 4 * i);
    expect(() => constrainedPartitionSampler({ kind: 'partition', n: 1_000_000, distinct: true, allowed: spaced })).not.toThrow();
  });
  it('n = 0 has the empty partition only', () => {
    const s = constrainedPartitionSampler({ kind: 'partition', n: 0, distinct: true, allowed: [3] });
    expect(s.sample(sampleSource('zero', 0, 't'))).toEqual({ sizes: [], multiplicities: [] });
  });
  it('reports honest estimates', () => {
    const s = constrainedPartitionSampler({ kind: 'partition', n: 10_000, distinct: true });
    // Mean number of distinct parts ~ (2 sqrt(3) ln 2 / pi) sqrt(n) (Erdős & Lehner 1941): 76.4 at n = 1e4.
    expect(s.expectedLength).toBeGreaterThan(70);
    expect(s.expectedLength).toBeLessThan(80);
    expect(s.expectedWork).toBeGreaterThan(0);
  });
});
