import { all, create } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { LimitExceededError } from '../../src/core/errors.js';
import type { SetPartitionFamily } from '../../src/core/family.js';
import {
  atMostByInclusionExclusion,
  bellNumbers,
  blockTable,
  countSetPartitions,
  freeTable,
  stirlingByInclusionExclusion,
  stirlingColumn,
} from '../../src/core/set-partitions/counts.js';
import { logBellNumber, stamLaw } from '../../src/core/set-partitions/stam-law.js';
import { enumerateSetPartitions } from '../support/enumerate-set-partitions.js';
import { CONSTRAINT_SHAPES } from './support.js';

/** mathjs (test-only) with BigNumbers wide enough for B_50 (48 digits) and S(30, k). */
const math = create(all, { number: 'BigNumber', precision: 120 });
const big = (x: unknown) => BigInt((x as { toFixed(): string }).toFixed());

const count = (f: Omit<SetPartitionFamily, 'kind'>) => countSetPartitions({ kind: 'set-partition', ...f });

describe('Bell numbers (every set partition of n)', () => {
  // OEIS A000110, B_0..B_20, B_25, B_30 and B_50 — from memory, confirmed by mathjs below.
  const A000110 = [1n, 1n, 2n, 5n, 15n, 52n, 203n, 877n, 4140n, 21147n, 115975n, 678570n, 4213597n, 27644437n, 190899322n, 1382958545n, 10480142147n, 82864869804n, 682076806159n, 5832742205057n, 51724158235372n];
  const A000110_MORE: [number, bigint][] = [
    [25, 4638590332229999353n],
    [30, 846749014511809332450147n],
    [50, 185724268771078270438257767181908917499221852770n],
  ];

  it('match OEIS A000110 (from memory) through Aitken\'s array and the count endpoint\'s planner', () => {
    const bell = bellNumbers(50);
    expect(bell.slice(0, 21)).toEqual(A000110);
    for (const [n, value] of A000110_MORE) {
      expect(bell[n]).toBe(value);
      expect(count({ n })).toBe(value);
    }
  });

  it('match mathjs bellNumbers (BigNumber) for every n <= 50', () => {
    const bell = bellNumbers(50);
    for (let n = 0; n <= 50; n++) expect(bell[n], `B_${n}`).toBe(big(math.bellNumbers(math.bignumber(n))));
  });

  it('satisfy the independent recurrence B_(n+1) = sum_k C(n, k) B_k (Comtet 1974, §5.4)', () => {
    const bell = bellNumbers(80);
    for (let n = 0; n < 80; n++) {
      let sum = 0n;
      let choose = 1n;
      for (let k = 0; k <= n; k++) {
        sum += choose * bell[k];
        choose = (choose * BigInt(n - k)) / BigInt(k + 1);
      }
      expect(bell[n + 1]).toBe(sum);
    }
  });

  it('ln B_n from Dobinski\'s sum (used for limits) agrees with the exact value', () => {
    const bell = bellNumbers(600);
    for (const n of [1, 2, 10, 50, 200, 600]) {
      // ln of an exact BigInt: its top 53 bits as a double, shifted by the rest.
      const bits = bell[n].toString(2);
      const top = Math.min(53, bits.length);
      const lnExact = (bits.length - top) * Math.LN2 + Math.log(parseInt(bits.slice(0, top), 2));
      expect(Math.abs(logBellNumber(n) - lnExact)).toBeLessThan(1e-12 * Math.max(1, lnExact));
    }
  });

  it('the mean of Stam\'s urn count is B_(n+1)/B_n (Dobinski), to double precision', () => {
    const bell = bellNumbers(301);
    for (const n of [5, 40, 300]) {
      const exact = Number((bell[n + 1] * 10n ** 15n) / bell[n]) / 1e15;
      expect(stamLaw(n).law.mean / exact - 1).toBeLessThan(1e-12);
    }
  });

  it('past the work limit a count is refused, naming the limit', () => {
    expect(() => count({ n: 3000 })).toThrow(LimitExceededError);
    expect(() => count({ n: 3000 })).toThrow(/limit/);
  });
});

describe('Stirling numbers of the second kind (exactly k blocks)', () => {
  it('row 10 matches OEIS A008277 (from memory)', () => {
    // A008277, n = 10, k = 1..10.
    expect(stirlingColumn(10, 10).slice(1)).toEqual([1n, 511n, 9330n, 34105n, 42525n, 22827n, 5880n, 750n, 45n, 1n]);
  });

  it('match mathjs stirlingS2 (BigNumber) for every 0 <= k <= n <= 30, by every method', () => {
    for (let n = 0; n <= 30; n++) {
      const column = stirlingColumn(n, n);
      for (let k = 0; k <= n; k++) {
        const expected = big(math.stirlingS2(math.bignumber(n), math.bignumber(k)));
        expect(column[k], `S(${n}, ${k})`).toBe(expected);
        expect(stirlingByInclusionExclusion(n, k), `S(${n}, ${k}) by inclusion–exclusion`).toBe(expected);
        if (n > 0) expect(count({ n, blocks: k }), `count n=${n} blocks=${k}`).toBe(expected);
      }
    }
  });

  it('at most K blocks: the derangement form of inclusion–exclusion equals the sum of the column', () => {
    for (const [n, K] of [[12, 3], [30, 7], [200, 15], [40, 40]] as const) {
      const column = stirlingColumn(n, K);
      expect(atMostByInclusionExclusion(n, K)).toBe(column.reduce((a, b) => a + b, 0n));
      expect(count({ n, maxBlocks: K })).toBe(column.reduce((a, b) => a + b, 0n));
    }
  });

  it('large n with few blocks by inclusion–exclusion: S(n, 2) = 2^(n−1) − 1 (DLMF 26.8.9 — from memory)', () => {
    expect(count({ n: 20_000, blocks: 2 })).toBe(2n ** 19_999n - 1n);
  });
});

describe('bounded block sizes', () => {
  it('no singletons: OEIS A000296 (from memory), and B_n = a(n) + a(n+1) (a property listed there)', () => {
    const A000296 = [1n, 0n, 1n, 1n, 4n, 11n, 41n, 162n, 715n, 3425n, 17722n, 98253n, 580317n, 3633280n, 24011157n, 166888165n];
    const byTable = freeTable(A000296.length - 1, 2, 1000);
    expect(byTable).toEqual(A000296);
    const bell = bellNumbers(60);
    const a = freeTable(61, 2, 1000);
    for (let n = 0; n <= 60; n++) expect(a[n] + a[n + 1]).toBe(bell[n]);
    for (let n = 1; n <= 40; n++) expect(count({ n, minBlockSize: 2 })).toBe(a[n]);
  });

  it('blocks of at most 3 items: OEIS A001680 (from memory)', () => {
    expect(freeTable(10, 1, 3)).toEqual([1n, 1n, 2n, 5n, 14n, 46n, 166n, 652n, 2780n, 12644n, 61136n]);
  });

  it('every constraint shape agrees with brute-force enumeration (n <= 9)', () => {
    for (let n = 0; n <= 9; n++) {
      for (const shape of CONSTRAINT_SHAPES) {
        const c = { n, ...shape };
        if (c.blocks !== undefined && c.blocks > n) continue;
        const expected = BigInt(enumerateSetPartitions(c).length);
        expect(count(c), JSON.stringify(c)).toBe(expected);
      }
    }
  });

  it('the block table (the samplers\' counts) agrees with the free recurrence summed over block counts', () => {
    for (const [n, a, b] of [[25, 2, 1000], [25, 1, 4], [30, 3, 7], [18, 2, 2]] as const) {
      const table = blockTable(n, n, a, b);
      const free = freeTable(n, a, b);
      for (let m = 0; m <= n; m++) expect(table[m].reduce((x, y) => x + y, 0n), `m=${m} a=${a} b=${b}`).toBe(free[m]);
    }
  });

  it('an empty family counts 0; contradictions are RangeErrors naming the parameter', () => {
    expect(count({ n: 10, blocks: 3, minBlockSize: 4 })).toBe(0n);
    expect(count({ n: 10, maxBlocks: 2, maxBlockSize: 4 })).toBe(0n);
    expect(count({ n: 0 })).toBe(1n);
    expect(count({ n: 0, blocks: 0 })).toBe(1n);
    expect(count({ n: 5, blocks: 0 })).toBe(0n);
    expect(() => count({ n: 10, blocks: 11 })).toThrow(/blocks/);
    expect(() => count({ n: 10, minBlockSize: 4, maxBlockSize: 3 })).toThrow(/minBlockSize/);
  });
});
