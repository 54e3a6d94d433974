import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { LogDistinctPartitionNumbers } from '../../src/core/counting/log-distinct-partition-number.js';
import type { PartitionFamily } from '../../src/core/family.js';
import { partsOf } from '../../src/core/partition.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { DistinctBoundedSelfSimilarSampler } from '../../src/core/partitions/distinct-bounded-self-similar.js';
import { DistinctSelfSimilarTables } from '../../src/core/partitions/distinct-self-similar.js';
import { DistinctPartitionTable } from '../../src/core/partitions/distinct-table.js';
import { sampleSource } from '../../src/core/seeding.js';
import { chiSquareTest } from '../support/chi-square.js';
import { exactPartCountLaw, pooled } from '../support/distinct-part-count-law.js';

const ALPHA = 1e-4; // false-alarm probability per check (project convention)

/**
 * The members of {distinct parts in [a, c] summing to n}, largest first, by direct recursion on
 * the smallest part (independent of the library). test/support/enumerate-constrained.ts filters
 * all p(n) partitions of n, which at n = 1300 (p ~ 1e35) never ends: that was the "out of memory"
 * of the earlier uniformity tests at n = 1300 and 1400, not the sampler.
 */
function enumerateDistinct(n: number, a: number, c = n): string[] {
  const out: string[] = [];
  const parts: number[] = [];
  const go = (lo: number, rest: number) => {
    if (rest === 0) {
      out.push([...parts].reverse().join(','));
      return;
    }
    for (let k = lo; k <= Math.min(c, rest); k++) {
      if (rest - k !== 0 && rest - k < k + 1) continue; // the next part must be > k
      parts.push(k);
      go(k + 1, rest - k);
      parts.pop();
    }
  };
  go(a, n);
  return out;
}

/** Pearson chi-square of `perMember` x |family| samples against uniform over the enumeration. */
function chiSquare(members: string[], sampler: PartitionSampler, seed: string, perMember = 25) {
  const counts = new Map<string, number>(members.map((m) => [m, 0]));
  let strangers = 0;
  const samples = perMember * members.length;
  for (let i = 0; i < samples; i++) {
    const key = partsOf(sampler.sample(sampleSource(seed, i, 'chi-square'))).join(',');
    const seen = counts.get(key);
    if (seen === undefined) strangers++;
    else counts.set(key, seen + 1);
  }
  let statistic = 0;
  for (const o of counts.values()) statistic += (o - perMember) ** 2 / perMember;
  return { strangers, pValue: 1 - chisquareCdf(statistic, members.length - 1) };
}

describe('distinct-bounded-self-similar with minPart above 200 (exactly uniform, chi-square over the enumeration)', () => {
  const tables = new DistinctSelfSimilarTables(new DistinctPartitionTable(60), new LogDistinctPartitionNumbers());
  // Few parts fit (<= 3), so the families are small; base thresholds 0 and 3 take the levels
  // down to sizes 0-3 (every level's count for parts >= ⌈b/2⌉ with b' = 101..106, the parity step).
  const cases: Array<[number, number, number]> = [
    [610, 201, 0],
    [640, 211, 3],
  ];
  for (const [n, a, base] of cases) {
    it(`n = ${n}, parts >= ${a}, base threshold ${base}`, () => {
      const members = enumerateDistinct(n, a);
      expect(members.length).toBeGreaterThan(30);
      const sampler = new DistinctBoundedSelfSimilarSampler(n, a, tables, base);
      const r = chiSquare(members, sampler, `dlm-${n}-${a}-${base}`);
      expect(r.strangers).toBe(0);
      expect(r.pValue).toBeGreaterThan(ALPHA);
    });
  }
});

describe('distinct-bounded-self-similar with minPart above 200 through the planner: the exact law of the number of parts', () => {
  // Where the planner serves a > 200 (n >= a²/4): the number of parts against its exact law from
  // BigInt counts (test/support/distinct-part-count-law.ts), Pearson chi-square on the pooled
  // law; false-alarm probability 1e-4. n = 16,000 with parts >= 240 (n/a² = 0.28, ~17 parts).
  it('n = 16,000, parts >= 240 (method forced)', () => {
    const n = 16_000;
    const a = 240;
    const family: PartitionFamily = { kind: 'partition', n, distinct: true, minPart: a };
    const sampler = constrainedPartitionSampler(family, { method: 'distinct-bounded-self-similar' });
    expect(sampler.method).toBe('distinct-bounded-self-similar/1');
    const law = exactPartCountLaw(n, a);
    const samples = 4000;
    const observed = new Array<number>(law.length).fill(0);
    for (let i = 0; i < samples; i++) observed[sampler.sample(sampleSource('dlm-parts-law', i, 'test')).sizes.length]++;
    const p = pooled(observed, law, samples);
    expect(p.observed.length).toBeGreaterThan(5);
    expect(chiSquareTest(p.observed, p.probabilities).pValue).toBeGreaterThan(ALPHA);
  });
});
