import { describe, expect, it } from 'vitest';
import type { SizeSet } from '../../src/core/partitions/constrained/spec.js';
import { sumOverSizes, sumsOverSizes } from '../../src/core/partitions/constrained/tilt.js';

// sumsOverSizes replaces several sumOverSizes passes in the planner's tilt and length-law
// estimates; the tilt it solves also steers a length filter's Boltzmann sampler, whose stream is
// unchanged only if every sum is bit for bit the same.
describe('sumsOverSizes: several sums in one pass, each bit for bit sumOverSizes', () => {
  const sets: [SizeSet, number][] = [
    [{ kind: 'list', values: [1, 2, 5, 10, 20, 50] }, -0.01],
    [{ kind: 'interval', lo: 3, hi: 40 }, -0.2],
    [{ kind: 'interval', lo: 1, hi: 1_000_000_000 }, -4.2e-5], // long: direct head and Simpson tail
    [{ kind: 'interval', lo: 7, hi: 9_000 }, -1e-4], // just above 2 * DIRECT_TERMS sizes
    [{ kind: 'interval', lo: 1, hi: 8_000 }, 0.003], // distinct parts may need t > 0: no cut-off
  ];
  it.each(sets)('%j at t = %d', (sizes, t) => {
    const fs = [
      (k: number) => Math.exp(t * k) / -Math.expm1(t * k),
      (k: number) => k * k * Math.exp(t * k),
      (k: number) => 1 / (1 + Math.exp(-t * k)),
    ];
    const fused = sumsOverSizes(sizes, t, fs.length, (k, out) => {
      for (let i = 0; i < fs.length; i++) out[i] = fs[i](k);
    });
    for (let i = 0; i < fs.length; i++) expect(Object.is(fused[i], sumOverSizes(sizes, t, fs[i]))).toBe(true);
  });
});
