import { describe, expect, it } from 'vitest';
import { EmptyFamilyError, LimitExceededError } from '../../src/core/errors.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { lengthOf, partsOf, sizeOf } from '../../src/core/partition.js';
import { nextBelow } from '../../src/core/random.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { listLengthFeasible } from '../../src/core/partitions/constrained/length-feasibility.js';
import { enumerateFamily, satisfies } from '../support/enumerate-constrained.js';

/**
 * Random families with a length constraint (length or maxLength, with any of distinct, minPart,
 * maxPart, allowed), n log-uniform up to 1e9, fixed seed. Each is either served — one sample
 * drawn and checked against every constraint — or empty (checked by enumeration at small n), or
 * refused over the work limit with a message that names the limit and says what would fit and
 * names no method or table. The families drawn keep the number of parts and the range of part
 * sizes within what the README states is served (short side of the box <= 2e4): those must all be
 * served. Families where maxLength cannot bind are planned without it (the no-length branch),
 * and are left out here.
 */
type Mutable = { -readonly [K in keyof PartitionFamily]: PartitionFamily[K] };

function draw(source: ReturnType<typeof sampleSource>): Mutable {
  const logUniform = (lo: number, hi: number) => Math.floor(Math.exp(Math.log(lo) + source.nextDouble() * (Math.log(hi) - Math.log(lo))));
  const n = logUniform(1, 1e9 + 1);
  const f: Mutable = { kind: 'partition', n };
  if (nextBelow(source, 2)) f.distinct = true;
  if (nextBelow(source, 2)) f.minPart = logUniform(1, Math.max(2, Math.sqrt(n)));
  if (nextBelow(source, 2)) f.maxPart = (f.minPart ?? 1) + logUniform(1, Math.max(2, Math.min(n, 2e4)));
  if (nextBelow(source, 4) === 0) {
    const size = logUniform(1, 40);
    const top = logUniform(2, Math.max(3, Math.min(n, 1e4)));
    const allowed = new Set<number>();
    for (let i = 0; i < size; i++) allowed.add(1 + nextBelow(source, top));
    f.allowed = [...allowed];
  }
  const parts = logUniform(1, Math.min(n, 2e4) + 1);
  if (nextBelow(source, 2)) f.length = parts;
  else f.maxLength = parts;
  return f;
}

describe('families with a length constraint, n up to 1e9', () => {
  it('are served, or empty, never refused within the stated limits', () => {
    const source = sampleSource('length-property', 0, 'test');
    const outcomes = { served: 0, empty: 0, checked: 0 };
    const refused: string[] = [];
    for (let trial = 0; trial < 120; trial++) {
      const f = draw(source);
      const label = JSON.stringify(f);
      try {
        const sampler = constrainedPartitionSampler(f);
        outcomes.served++;
        if (sampler.expectedWork > 2e6) continue; // keep the test short; planning was the check
        const p = sampler.sample(sampleSource('length-property', trial, 'sample'));
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
        expect(error.message, label).toMatch(/limit/);
        expect(error.message, label).not.toMatch(/cell|table|boltzmann|subset|mixture|\/1/i);
        refused.push(`${label}: ${error.message}`);
      }
    }
    expect(refused).toEqual([]);
    expect(outcomes.served).toBeGreaterThan(40);
    expect(outcomes.checked).toBeGreaterThan(30);
  });
});

describe('emptiness of allowed lists with a length constraint (length-feasibility.ts)', () => {
  it('agrees with enumeration at small n, by the table and by the residue shortest paths', () => {
    const source = sampleSource('list-feasibility', 0, 'test');
    let decided = 0;
    let paths = 0;
    let shortcuts = 0;
    for (let trial = 0; trial < 400; trial++) {
      const n = 1 + nextBelow(source, 40);
      const allowed = [...new Set(Array.from({ length: 1 + nextBelow(source, 5) }, () => 1 + nextBelow(source, 15)))].sort((a, b) => a - b);
      const distinct = nextBelow(source, 3) === 0;
      const k = 1 + nextBelow(source, 12);
      const exact = nextBelow(source, 2) === 0;
      const family: PartitionFamily = { kind: 'partition', n, allowed, distinct, ...(exact ? { length: k } : { maxLength: k }) };
      const truth = enumerateFamily(family).length > 0;
      const kMin = exact ? k : 1;
      for (const [workLimit, pathsOnly] of [
        [3e7, false],
        [3e7, true],
        [1, false],
      ] as const) {
        // pathsOnly: the residue shortest paths; workLimit 1 (distinct): bounds, residues and the
        // greedy witness only. Each may answer undefined; a definite answer must be right.
        const answer = listLengthFeasible(allowed, n, kMin, k, distinct, workLimit, pathsOnly);
        if (answer !== undefined) {
          expect(answer, `${JSON.stringify(family)} ${workLimit} ${pathsOnly}`).toBe(truth);
          if (pathsOnly && !distinct) paths++;
          if (workLimit === 1 && distinct) shortcuts++;
          decided++;
        }
      }
    }
    expect(decided).toBeGreaterThan(500);
    expect(paths).toBeGreaterThan(150);
    expect(shortcuts).toBeGreaterThan(50);
  });

  it('distinct sizes: residues and a constructive witness decide where the bit-set table would not fit', () => {
    const odd = Array.from({ length: 500 }, (_, i) => 2 * i + 1);
    expect(listLengthFeasible(odd, 40_000, 200, 200, true)).toBe(true); // 1 + 3 + ... + 399
    expect(listLengthFeasible(odd, 40_001, 200, 200, true)).toBe(false); // 200 odd numbers: even sum
    const spaced = Array.from({ length: 1000 }, (_, i) => 1 + 4000 * i);
    expect(listLengthFeasible(spaced, 1_000_000_000, 500, 500, true)).toBe(false); // sum = 500 mod 4000
  });

  it('decides large families by residue shortest paths: 1000 parts from {3, 7, 11} sum to 10000, not to 10001', () => {
    expect(listLengthFeasible([3, 7, 11], 10_000, 1000, 1000, false)).toBe(true);
    // n - 3k must be a sum of 4s and 8s (differences): 10001 - 3000 = 7001 is odd.
    expect(listLengthFeasible([3, 7, 11], 10_001, 1000, 1000, false)).toBe(false);
    // At most 100 parts of at most 11 cannot reach 1101.
    expect(listLengthFeasible([3, 7, 11], 1101, 1, 100, false)).toBe(false);
    expect(listLengthFeasible([3, 7, 11], 1100, 1, 100, false)).toBe(true);
  });
});
