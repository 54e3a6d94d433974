import { describe, expect, it } from 'vitest';
import { countPartitions } from '../../src/core/counting/partition-counts.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { lengthOf, partsOf, sizeOf, type Partition } from '../../src/core/partition.js';
import { constrainedPartitionSampler, planCandidates } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { satisfies } from '../support/enumerate-constrained.js';

/**
 * allowed-length-boltzmann (three determined sites) where tables still work but the planner
 * already uses it: the law of the number of parts (at most K) or of one size's multiplicity
 * (exactly k) against the exact law from BigInt counts (countPartitions, checked against OEIS in
 * test/constrained/counts.test.ts). Pearson chi-square, cells pooled to expect >= 20 samples
 * (common practice), alpha = 1e-4 per test.
 */
const ALPHA = 1e-4;
const SAMPLES = 20_000;

function ratio(a: bigint, b: bigint): number {
  const scale = 10n ** 18n;
  return Number((a * scale) / b) / 1e18;
}

function run(family: PartitionFamily, statistic: (p: Partition) => number, exact: Map<number, number>, seed: string): void {
  expect(constrainedPartitionSampler(family).method).toBe('allowed-length-boltzmann/1');
  expect(planCandidates(family).some((c) => c.method.startsWith('table') && c.fits)).toBe(true);
  const sampler = constrainedPartitionSampler(family, { method: 'allowed-length-boltzmann' });
  const observed = new Map<number, number>();
  for (let i = 0; i < SAMPLES; i++) {
    const p = sampler.sample(sampleSource(seed, i, 'verify-allowed-length'));
    if (i < 200) expect(sizeOf(p) === family.n && satisfies(partsOf(p), family)).toBe(true);
    const v = statistic(p);
    observed.set(v, (observed.get(v) ?? 0) + 1);
  }
  // Pool adjacent values until each cell expects >= 20.
  const cellsObserved: number[] = [];
  const cellsProbability: number[] = [];
  let o = 0;
  let q = 0;
  for (const v of [...exact.keys()].sort((a, b) => a - b)) {
    o += observed.get(v) ?? 0;
    q += exact.get(v)!;
    if (q * SAMPLES >= 20) {
      cellsObserved.push(o);
      cellsProbability.push(q);
      o = 0;
      q = 0;
    }
  }
  cellsObserved[cellsObserved.length - 1] += o;
  cellsProbability[cellsProbability.length - 1] += q;
  let seen = 0;
  for (const [v, c] of observed) if (exact.has(v)) seen += c;
  expect(seen).toBe(SAMPLES);
  expect(cellsObserved.length).toBeGreaterThan(5);
  expect(chiSquareTest(cellsObserved, cellsProbability).pValue).toBeGreaterThan(ALPHA);
}

const COINS = [1, 2, 5, 10, 20, 50];

describe('allowed-length-boltzmann: exact laws at sizes the planner gives it', () => {
  it('n = 3000, at most 100 parts from {1, 2, 5, 10, 20, 50}: law of the number of parts', () => {
    const family: PartitionFamily = { kind: 'partition', n: 3000, allowed: COINS, maxLength: 100 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    for (let k = 1; k <= 100; k++) {
      const c = countPartitions({ kind: 'partition', n: 3000, allowed: COINS, length: k });
      if (c > 0n) exact.set(k, ratio(c, total));
    }
    run(family, lengthOf, exact, 'coins-at-most');
  });

  it('n = 2000, exactly 60 parts from {1, 3, 4, 9, 17, 40, 41} (x > 1): law of the multiplicity of 41', () => {
    const sizes = [1, 3, 4, 9, 17, 40, 41];
    const family: PartitionFamily = { kind: 'partition', n: 2000, allowed: sizes, length: 60 };
    const total = countPartitions(family);
    const exact = new Map<number, number>();
    for (let j = 0; j * 41 <= 2000 && j <= 60; j++) {
      const rest = countPartitions({ kind: 'partition', n: 2000 - 41 * j, allowed: sizes.slice(0, -1), length: 60 - j });
      if (rest > 0n) exact.set(j, ratio(rest, total));
    }
    const top = (p: Partition) => (p.sizes[0] === 41 ? p.multiplicities[0] : 0);
    run(family, top, exact, 'x-above-one');
  });
});
