import { describe, expect, it } from 'vitest';
import { isFeasible, smallestInResidue } from '../../src/core/partitions/constrained/feasibility.js';
import { listLengthFeasible } from '../../src/core/partitions/constrained/length-feasibility.js';
import { toSpec } from '../../src/core/partitions/constrained/spec.js';
import { nextBelow } from '../../src/core/random.js';
import { sampleSource } from '../../src/core/seeding.js';

/** Sums of sizes with any multiplicities up to `top`, by the plain reachability table. */
function reachable(sizes: readonly number[], top: number): Uint8Array {
  const reach = new Uint8Array(top + 1);
  reach[0] = 1;
  for (const a of sizes) for (let m = a; m <= top; m++) if (reach[m - a]) reach[m] = 1;
  return reach;
}

describe('any multiplicities from a list: which n are sums (round-robin residue table)', () => {
  it('agrees with the reachability table on 200 random lists (fixed seed)', () => {
    const source = sampleSource('feasibility', 0, 'lists');
    for (let trial = 0; trial < 200; trial++) {
      const count = 1 + nextBelow(source, 6);
      const set = new Set<number>();
      while (set.size < count) set.add(2 + nextBelow(source, 60));
      const sizes = [...set].sort((a, b) => a - b);
      const top = 4000;
      const reach = reachable(sizes, top);
      const g = sizes.reduce((x, y) => {
        while (y) [x, y] = [y, x % y];
        return x;
      });
      const d = smallestInResidue(sizes.map((s) => s / g));
      const mismatches: number[] = [];
      for (let m = 0; m <= top; m++) {
        const byResidue = m % g === 0 && m / g >= d[(m / g) % (sizes[0] / g)];
        if (byResidue !== (reach[m] === 1)) mismatches.push(m);
      }
      expect(mismatches, sizes.join(',')).toEqual([]);
      // The planner's question at a few n (Schur's bound or the residue table).
      for (const m of [1 + nextBelow(source, top), 1 + nextBelow(source, 400)]) {
        expect(isFeasible(toSpec({ kind: 'partition', n: m, allowed: sizes })), `${sizes.join(',')} n = ${m}`).toBe(reach[m] === 1);
      }
    }
  });

  it("decides large sizes at large n below Schur's bound (the table would be too large)", () => {
    // 6 sizes from 11361: Schur's bound 11360 * 23604 = 2.7e8 > n.
    const sizes = [11361, 13035, 15409, 19971, 20256, 23605];
    expect(isFeasible(toSpec({ kind: 'partition', n: 252_247_132, allowed: sizes }))).toBe(true);
    // 2 sizes 1000 and 1001: the Frobenius number is 1000 * 1001 - 1000 - 1001 = 998999 (Sylvester 1884).
    expect(isFeasible(toSpec({ kind: 'partition', n: 998_999, allowed: [1000, 1001] }))).toBe(false);
    expect(isFeasible(toSpec({ kind: 'partition', n: 999_000, allowed: [1000, 1001] }))).toBe(true);
    expect(isFeasible(toSpec({ kind: 'partition', n: 998_998, allowed: [1000, 1001] }))).toBe(true);
  });
});

describe('any multiplicities from a list with a length constraint (round-robin residue paths)', () => {
  it('agrees with the table of fewest parts (length-feasibility.ts) on 300 random lists (fixed seed)', () => {
    const source = sampleSource('feasibility', 1, 'length');
    for (let trial = 0; trial < 300; trial++) {
      const count = 2 + nextBelow(source, 5);
      const set = new Set<number>();
      while (set.size < count) set.add(1 + nextBelow(source, 40));
      const sizes = [...set].sort((a, b) => a - b);
      const n = 1 + nextBelow(source, 600);
      const parts = 1 + nextBelow(source, 40);
      for (const exactly of [true, false]) {
        const spec = toSpec({ kind: 'partition', n, allowed: sizes, ...(exactly ? { length: parts } : { maxLength: parts }) });
        if (spec.sizes.kind !== 'list') continue;
        const values = spec.sizes.values;
        const byTable = listLengthFeasible(values, n, exactly ? parts : 1, parts, false);
        expect(byTable).not.toBeUndefined();
        expect(isFeasible(spec), `${sizes.join(',')} n = ${n}, ${exactly ? 'exactly' : 'at most'} ${parts}`).toBe(byTable);
      }
    }
  });
});
