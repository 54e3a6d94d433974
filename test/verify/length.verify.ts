import { describe, expect, it } from 'vitest';
import { countPartitions } from '../../src/core/counting/partition-counts.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { lengthOf, partsOf, sizeOf, type Partition } from '../../src/core/partition.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import type { BoxMixture } from '../../src/core/partitions/constrained/box-mixture.js';
import { constrainedPartitionSampler, planCandidates } from '../../src/core/partitions/constrained/plan.js';
import { mixtureSampler } from '../../src/core/partitions/constrained/plan-length.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { satisfies } from '../support/enumerate-constrained.js';

/**
 * The length branch's methods at sizes where exact counting still works but the planner already
 * uses the new method: the law of a statistic of the samples (largest part, number of parts,
 * multiplicity of one size) against its exact law computed from BigInt counts
 * (countPartitions, itself checked against OEIS in test/constrained/counts.test.ts). Pearson
 * chi-square, cells pooled to expect >= 20 samples (common practice), alpha = 1e-4 per test.
 */
const ALPHA = 1e-4;
const SAMPLES = 20_000;

/** BigInt ratio as a double. */
function ratio(a: bigint, b: bigint): number {
  const scale = 10n ** 18n;
  return Number((a * scale) / b) / 1e18;
}

/**
 * Chi-square of a statistic's observed values against exact probabilities (value -> P), adjacent
 * values pooled from both ends until each cell expects at least 20.
 */
function lawTest(observed: Map<number, number>, exact: Map<number, number>): { pValue: number; cells: number } {
  const values = [...exact.keys()].sort((a, b) => a - b);
  const cellsObserved: number[] = [];
  const cellsProbability: number[] = [];
  let o = 0;
  let p = 0;
  for (const v of values) {
    o += observed.get(v) ?? 0;
    p += exact.get(v)!;
    if (p * SAMPLES >= 20) {
      cellsObserved.push(o);
      cellsProbability.push(p);
      o = 0;
      p = 0;
    }
  }
  if (p > 0 || o > 0) {
    cellsObserved[cellsObserved.length - 1] += o;
    cellsProbability[cellsProbability.length - 1] += p;
  }
  let seen = 0;
  for (const c of observed.values()) seen += c;
  expect(seen).toBe(SAMPLES);
  const { pValue } = chiSquareTest(cellsObserved, cellsProbability);
  return { pValue, cells: cellsObserved.length };
}

function run(
  family: PartitionFamily,
  method: string,
  statistic: (p: Partition) => number,
  exact: Map<number, number>,
  seed: string,
  planned: string = method,
  /** A sampler of `method` built with its own tuning, used instead of the planner's. */
  given?: PartitionSampler,
): void {
  // The planner's own choice at this size (tables would still fit, but cost more); `method` is
  // forced, and is the planner's choice unless `planned` says otherwise.
  expect(constrainedPartitionSampler(family).method.replace(/\/\d+/g, '')).toBe(planned);
  expect(planCandidates(family).some((c) => c.method.startsWith('table') && c.fits)).toBe(true);
  const sampler = given ?? constrainedPartitionSampler(family, { method });
  expect(sampler.method.replace(/\/\d+/g, '')).toBe(method);
  const observed = new Map<number, number>();
  for (let i = 0; i < SAMPLES; i++) {
    const p = sampler.sample(sampleSource(seed, i, 'verify-length'));
    if (i < 200) expect(sizeOf(p) === family.n && satisfies(partsOf(p), family)).toBe(true);
    const v = statistic(p);
    observed.set(v, (observed.get(v) ?? 0) + 1);
  }
  const result = lawTest(observed, exact);
  expect(result.cells).toBeGreaterThan(5);
  expect(result.pValue).toBeGreaterThan(ALPHA);
}

describe('box-subset: law of the largest part', () => {
  it('n = 1200, exactly 20 parts <= 100', () => {
    const base = { kind: 'partition', n: 1200, length: 20 } as const;
    const family: PartitionFamily = { ...base, maxPart: 100 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    let below = 0n;
    for (let j = 60; j <= 100; j++) {
      const upTo = countPartitions({ ...base, maxPart: j });
      exact.set(j, ratio(upTo - below, total));
      below = upTo;
    }
    run(family, 'box-subset', (p) => p.sizes[0], exact, 'box-largest');
  });

  it('n = 1500, at most 50 parts <= 60 (box more than half full: complemented)', () => {
    const base = { kind: 'partition', n: 1500, maxLength: 50 } as const;
    const family: PartitionFamily = { ...base, maxPart: 60 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    let below = 0n;
    for (let j = 30; j <= 60; j++) {
      const upTo = countPartitions({ ...base, maxPart: j });
      exact.set(j, ratio(upTo - below, total));
      below = upTo;
    }
    // The planner takes box-rotation here (box near half full); box-subset forced, then the planner's choice.
    run(family, 'box-subset', (p) => p.sizes[0], exact, 'box-largest-complement', 'box-rotation');
    run(family, 'box-rotation', (p) => p.sizes[0], exact, 'box-largest-rotation', 'box-rotation');
  });
});

describe('box-mixture: law of the number of parts', () => {
  it('n = 20000, at most 110 distinct parts (typical ~108: the bound binds mildly, k spread over many values)', () => {
    const family: PartitionFamily = { kind: 'partition', n: 20_000, distinct: true, maxLength: 110 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    for (let k = 1; k <= 110; k++) exact.set(k, ratio(countPartitions({ kind: 'partition', n: 20_000, distinct: true, length: k }), total));
    // The planner now prefers filtering plain distinct samples by their length here (the bound
    // binds mildly); box-mixture, which it uses where the bound binds hard, is forced.
    const planned = 'distinct-self-similar+length-filter';
    run(family, 'box-mixture', lengthOf, exact, 'mixture-distinct', planned);
    run(family, planned, lengthOf, exact, 'filter-distinct', planned);
  });

  it('n = 8000, at most 100 parts >= 5', () => {
    const family: PartitionFamily = { kind: 'partition', n: 8000, minPart: 5, maxLength: 100 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    for (let k = 1; k <= 100; k++) exact.set(k, ratio(countPartitions({ kind: 'partition', n: 8000, minPart: 5, length: k }), total));
    // The planner picks conjugate-mixture here (its O(K) setup against the table's 8e5 cells);
    // box-mixture and table-lengths are forced, and all three get the same exact law.
    run(family, 'box-mixture', lengthOf, exact, 'mixture-minpart', 'conjugate-mixture');
    run(family, 'table-lengths', lengthOf, exact, 'tables-minpart', 'conjugate-mixture');
    run(family, 'conjugate-mixture', lengthOf, exact, 'conjugate-minpart', 'conjugate-mixture');
  });

  /** Share of the bounded boxes that keep the previous box's tilt. */
  const keptTilts = (mixture: BoxMixture): number => {
    const bounded = mixture.designs.filter((d) => !d.single && d.b !== Infinity);
    return bounded.filter((d, i) => i > 0 && bounded[i - 1].s === d.s).length / bounded.length;
  };

  // Bounded boxes (parts in [lo, hi]): the planner's sampler, then one whose tilts are all walked
  // (polish: false; over a third of the k keep the previous k's tilt, their moments and
  // normalisers walked a step at a time, binomial-walk.ts): the weights of k must be exact.
  it('n = 1500, at most 90 parts in [2, 30] (bounded boxes, k = 50..90, tilts walked across k)', () => {
    const family: PartitionFamily = { kind: 'partition', n: 1500, minPart: 2, maxPart: 30, maxLength: 90 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    for (let k = 1; k <= 90; k++) exact.set(k, ratio(countPartitions({ ...family, maxLength: undefined, length: k }), total));
    run(family, 'box-mixture', lengthOf, exact, 'mixture-bounded', 'box-mixture');
    const walked = mixtureSampler(1500, 2, 30, false, 90, { polish: false });
    expect(keptTilts(walked)).toBeGreaterThan(1 / 3);
    run(family, 'box-mixture', lengthOf, exact, 'mixture-bounded-walked', 'box-mixture', walked);
  });

  it('n = 1500, at most 30 distinct parts in [2, 100] (staircase boxes, tilts walked across k)', () => {
    const family: PartitionFamily = { kind: 'partition', n: 1500, distinct: true, minPart: 2, maxPart: 100, maxLength: 30 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    for (let k = 1; k <= 30; k++) exact.set(k, ratio(countPartitions({ ...family, maxLength: undefined, length: k }), total));
    run(family, 'box-mixture', lengthOf, exact, 'mixture-bounded-distinct', 'box-mixture');
    const walked = mixtureSampler(1500, 2, 100, true, 30, { polish: false });
    expect(keptTilts(walked)).toBeGreaterThan(1 / 3);
    run(family, 'box-mixture', lengthOf, exact, 'mixture-bounded-distinct-walked', 'box-mixture', walked);
  });
});

describe('allowed-length-boltzmann: law of the multiplicity of the largest size', () => {
  it('n = 3000, exactly 150 parts from {1, 2, 5, 10, 20, 50}', () => {
    const family: PartitionFamily = { kind: 'partition', n: 3000, allowed: [1, 2, 5, 10, 20, 50], length: 150 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    for (let j = 0; j * 50 <= 3000 && j <= 150; j++) {
      const rest = countPartitions({ kind: 'partition', n: 3000 - 50 * j, allowed: [1, 2, 5, 10, 20], length: 150 - j });
      if (rest > 0n) exact.set(j, ratio(rest, total));
    }
    const fifties = (p: Partition) => (p.sizes[0] === 50 ? p.multiplicities[0] : 0);
    run(family, 'allowed-length-boltzmann', fifties, exact, 'allowed-fifties');
  });
});

describe('allowed-subset: law of the largest part', () => {
  it('n = 1200, exactly 20 distinct odd parts below 120', () => {
    const odd = Array.from({ length: 60 }, (_, i) => 2 * i + 1);
    const family: PartitionFamily = { kind: 'partition', n: 1200, distinct: true, allowed: odd, length: 20 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    let below = 0n;
    for (let j = 61; j <= 119; j += 2) {
      const upTo = countPartitions({ ...family, allowed: odd.filter((v) => v <= j) });
      if (upTo > below) exact.set(j, ratio(upTo - below, total));
      below = upTo;
    }
    run(family, 'allowed-subset', (p) => p.sizes[0], exact, 'subset-largest');
  });
});
