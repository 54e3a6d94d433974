import { describe, expect, it } from 'vitest';
import { LogBoundedPartCounts, boundedPartSaddle } from '../../src/core/counting/log-bounded-part-count.js';
import { LogMinPartCounts, minPartSaddle } from '../../src/core/counting/log-min-part-count.js';
import { concaveMaximiser } from '../../src/core/partitions/concave-maximiser.js';
import { ConcaveSqueeze } from '../../src/core/partitions/concave-squeeze.js';
import { FallingDifferences, bracketedLastRise } from '../../src/core/partitions/falling-differences.js';
import { MinPartSelfSimilarEngine, MinPartSelfSimilarTables, boundedMaximiser } from '../../src/core/partitions/min-part-self-similar.js';
import { sampleSource } from '../../src/core/seeding.js';

const uniformInt = (i: number, lo: number, hi: number) => lo + Math.floor(sampleSource('squeeze-test', i, 'k').nextDouble() * (hi - lo + 1));

describe('ConcaveSqueeze', () => {
  it('bounds a concave function by chords (exact on a parabola)', () => {
    const f = (m: number) => -((m - 500) ** 2) / 7;
    const q = new ConcaveSqueeze();
    for (let i = 0; i < 40; i++) {
      const m = uniformInt(i, 0, 1000);
      q.add(m, f(m));
    }
    for (let m = 0; m <= 1000; m++) {
      const [lo, hi] = q.bounds(m);
      expect(lo, `m ${m}`).toBeLessThanOrEqual(f(m) + 1e-9);
      expect(hi, `m ${m}`).toBeGreaterThanOrEqual(f(m) - 1e-9);
    }
  });

  it('bounds the saddle-point log-counts above the table within the engine margin (1e-8)', () => {
    // Parts >= 4 (the counts of a minPart = 7 level) and parts in [4, 125] (a maxPart = 250 level).
    const mp = new LogMinPartCounts(4);
    const bd = new LogBoundedPartCounts(4, 125, 20_000);
    for (const [counts, lo, hi] of [
      [mp, mp.exactUpTo + 1, 3e5],
      [bd, bd.exactUpTo + 1, 3e5],
    ] as const) {
      const q = new ConcaveSqueeze();
      for (let i = 0; i < 60; i++) {
        const m = uniformInt(i, lo, hi);
        q.add(m, counts.log(m));
      }
      for (let i = 100; i < 400; i++) {
        const m = uniformInt(i, lo, hi);
        const [l, u] = q.bounds(m);
        expect(l, `m ${m}`).toBeLessThanOrEqual(counts.log(m) + 1e-8);
        expect(u, `m ${m}`).toBeGreaterThanOrEqual(counts.log(m) - 1e-8);
      }
    }
  });
});

describe('FallingDifferences', () => {
  it('brackets and finds the last rising difference of a concave function (brute force)', () => {
    const d = new FallingDifferences((m) => Math.sqrt(m) - Math.sqrt(m - 1));
    for (let i = 0; i < 300; i++) {
      const theta = 0.005 + 0.1 * sampleSource('fd', i, 'k').nextDouble();
      const from = 3;
      const half = uniformInt(i + 1000, 10, 20_000);
      let brute = from;
      for (let m = from + 1; m <= half; m++) if (Math.sqrt(m) - Math.sqrt(m - 1) - theta > 0) brute = m;
      const found = bracketedLastRise(d, (x) => x - theta > 0, from, half);
      // null only while the points held bracket it too loosely; then remember the answer's neighbours.
      if (found === null) {
        d.at(brute);
        d.at(brute + 1);
      } else expect(found, `theta ${theta} half ${half}`).toBe(brute);
    }
  });

  it('leaves the bounded maximiser unchanged (with and without remembered differences)', () => {
    const counts = new LogBoundedPartCounts(4, 125, 20_000);
    const differences = new FallingDifferences((m) => counts.logRatio(m, m - 1));
    for (let i = 0; i < 120; i++) {
      const n = uniformInt(i, 4e4, 6e5);
      const logX = -boundedPartSaddle(7, 250, n);
      expect(boundedMaximiser(counts, n, logX, differences), `n ${n}`).toBe(boundedMaximiser(counts, n, logX));
    }
  });

  it('leaves the min-part maximiser unchanged (with and without remembered differences)', () => {
    const engine = new MinPartSelfSimilarEngine({ baseThreshold: 0, tables: new MinPartSelfSimilarTables(60) });
    const counts = new LogMinPartCounts(4);
    for (let i = 0; i < 120; i++) {
      const n = uniformInt(i, 1e4, 1e6);
      const logX = -minPartSaddle(7, n);
      expect(engine.maximiser(counts, n, logX), `n ${n}`).toBe(concaveMaximiser(counts, n, logX));
    }
  });
});
