import { describe, expect, it } from 'vitest';
import { partsTableWork } from '../../src/core/counting/parts-table-work.js';

/** The loop the closed form replaces (bounded-count-tables.ts, partsWork, before). */
function loopWork(a: number, b: number, end: number): number {
  let work = 0;
  for (let j = 1; j * a <= end; j++) work += Math.min(j * b, end) - j * a + 1;
  return 2 * work;
}

describe('partsTableWork: closed form of the by-parts table additions', () => {
  it('equals the loop exactly on a grid of small a, b, end (all integers)', () => {
    for (let a = 1; a <= 12; a++) {
      for (let b = a; b <= a + 30; b += 3) {
        for (let end = 0; end <= 400; end += 7) expect(partsTableWork(a, b, end)).toBe(loopWork(a, b, end));
      }
    }
  });

  it('equals the loop exactly at the sizes the planner meets (end up to 1e6, b far above or below end)', () => {
    const cases: [number, number, number][] = [
      [1, 2, 1_000_000],
      [1, 6, 999_999],
      [3, 20, 500_000],
      [64, 1152, 1_000_000],
      [3472, 1_000_000_000, 372_274_257 >> 9],
      [1, 1_000_000_000, 1_000_000],
      [7, 7, 123_457],
    ];
    for (const [a, b, end] of cases) expect(partsTableWork(a, b, end)).toBe(loopWork(a, b, end));
  });

  it('agrees with the loop to 1e-12 relatively where the sums pass 2^53 (a = 1, end = 1e8)', () => {
    const end = 100_000_000;
    const closed = partsTableWork(1, 5, end);
    const loop = loopWork(1, 5, end);
    expect(Math.abs(closed - loop) / loop).toBeLessThan(1e-12);
  });
});
