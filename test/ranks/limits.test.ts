import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { LimitExceededError } from '../../src/core/errors.js';
import type { CompositionFamily, PartitionFamily } from '../../src/core/family.js';
import { compositionRanker, compositionRankTableSize, largestRankableCompositionN } from '../../src/core/ranks/composition-ranker.js';
import { RANK_TABLE_BYTES } from '../../src/core/ranks/limits.js';
import { largestRankablePartitionN, partitionRanker, partitionRankTableSize } from '../../src/core/ranks/partition-ranker.js';
import { setPartitionRanker } from '../../src/core/set-partitions/ranker.js';
import { PROJECT_ROOT } from '../edge/runtimes.js';

/** The README's table of the largest n per family shape: [kind, constraints as a query, n]. */
function readmeLimits(): [string, Record<string, unknown>, number][] {
  const readme = readFileSync(join(PROJECT_ROOT, 'README.md'), 'utf8');
  const table = readme.slice(readme.indexOf('| partitions | largest `n` | compositions | largest `n` |'));
  const lines = table.split('\n').slice(2);
  const rows = lines.slice(0, lines.findIndex((line) => !line.startsWith('|')));
  const out: [string, Record<string, unknown>, number][] = [];
  for (const row of rows) {
    const cells = row.split('|').slice(1, -1).map((c) => c.trim());
    for (const [kind, shape, n] of [['partition', cells[0], cells[1]], ['composition', cells[2], cells[3]]]) {
      if (!shape) continue;
      const query = shape.startsWith('no constraint') ? '' : /`([^`]+)`/.exec(shape)![1];
      const constraints: Record<string, unknown> = {};
      for (const [key, value] of new URLSearchParams(query)) constraints[key] = key === 'allowed' ? value.split(',').map(Number) : value === 'true' ? true : Number(value);
      out.push([kind, constraints, Number(n.replace(/,/g, ''))]);
    }
  }
  return out;
}

/** The README's table of the largest n per set-partition shape: [constraints, n]. */
function readmeSetPartitionLimits(): [Record<string, number>, number][] {
  const readme = readFileSync(join(PROJECT_ROOT, 'README.md'), 'utf8');
  const lines = readme.slice(readme.indexOf('| set partitions | largest `n` |')).split('\n').slice(2);
  return lines.slice(0, lines.findIndex((line) => !line.startsWith('|'))).map((row) => {
    const [shape, n] = row.split('|').slice(1, -1).map((c) => c.trim());
    const query = shape.startsWith('no constraint') ? '' : /`([^`]+)`/.exec(shape)![1];
    return [Object.fromEntries([...new URLSearchParams(query)].map(([k, v]) => [k, Number(v)])), Number(n.replace(/,/g, ''))];
  });
}

const rankable = (family: Record<string, number> & { n: number }) => {
  try {
    setPartitionRanker({ kind: 'set-partition', ...family });
    return true;
  } catch (error) {
    if (error instanceof LimitExceededError) return false;
    throw error;
  }
};

describe('rank table limits', () => {
  it('set partitions: the README states the largest n per shape the code ranks (it ranks n and refuses n + 1)', () => {
    const rows = readmeSetPartitionLimits();
    expect(rows.length).toBeGreaterThanOrEqual(8);
    for (const [constraints, n] of rows) {
      expect(rankable({ ...constraints, n }), `${JSON.stringify(constraints)} at ${n}`).toBe(true);
      expect(rankable({ ...constraints, n: n + 1 }), `${JSON.stringify(constraints)} at ${n + 1}`).toBe(false);
    }
  });

  it('the README states the largest n per family shape that the code enforces', () => {
    const rows = readmeLimits();
    expect(rows.length).toBeGreaterThanOrEqual(15);
    for (const [kind, constraints, n] of rows) {
      const largest =
        kind === 'partition'
          ? largestRankablePartitionN({ kind: 'partition', n: 1e9, ...constraints } as PartitionFamily)
          : largestRankableCompositionN({ kind: 'composition', n: 1e9, ...constraints } as CompositionFamily);
      expect(largest, `${kind} ${JSON.stringify(constraints)}`).toBe(n);
    }
  });

  it('refuses past the limit with a LimitExceededError naming the limit and the n that fits', () => {
    const largest = largestRankablePartitionN({ kind: 'partition', n: 1e9 });
    expect(partitionRankTableSize({ kind: 'partition', n: largest }).bytes).toBeLessThanOrEqual(RANK_TABLE_BYTES);
    expect(partitionRankTableSize({ kind: 'partition', n: largest + 1 }).bytes).toBeGreaterThan(RANK_TABLE_BYTES);
    try {
      partitionRanker({ kind: 'partition', n: largest + 1 });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(LimitExceededError);
      expect((error as LimitExceededError).limit).toBe('rank table <= 32 MiB');
      expect((error as Error).message).toMatch(new RegExp(`over the limit of 32 MiB per table; without constraints, n <= ${largest.toLocaleString('en-US')} fits`));
    }
    expect(() => partitionRanker({ kind: 'partition', n: 1e9, maxLength: 3, distinct: true })).toThrow(/^ranking partitions of 1000000000 with distinct = true, maxLength = 3 needs a counting table, .*; with distinct = true, maxLength = 3, n <= [0-9,]+ fits$/);
    const compositions = largestRankableCompositionN({ kind: 'composition', n: 1e9, length: 10 });
    expect(compositionRankTableSize({ kind: 'composition', n: compositions, length: 10 }).bytes).toBeLessThanOrEqual(RANK_TABLE_BYTES);
    expect(() => compositionRanker({ kind: 'composition', n: compositions + 1, length: 10 })).toThrow(LimitExceededError);
    expect(() => compositionRanker({ kind: 'composition', n: 2 ** 20 + 2 })).toThrow(/n <= 1,048,577/);
  });
});
