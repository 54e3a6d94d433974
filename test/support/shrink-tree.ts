import fc from 'fast-check';
import type { FamilyArbitrary } from 'partsmith/fast-check';

/** The values of an arbitrary and the shrink tree below each, to `depth` levels (at most `width` candidates per value). */
export function valuesAndShrinks<M extends object>(arb: FamilyArbitrary<M>, seed: number, runs: number, depth = 3, width = 6): { values: M[]; shrinks: [M, M][] } {
  const values: M[] = [];
  const shrinks: [M, M][] = [];
  for (const value of fc.sample(arb, { seed, numRuns: runs })) {
    values.push(value);
    let level: M[] = [value];
    for (let d = 0; d < depth; d++) {
      const next: M[] = [];
      for (const v of level) {
        let taken = 0;
        for (const candidate of arb.shrink(v, undefined)) {
          shrinks.push([v, candidate.value]);
          next.push(candidate.value);
          if (++taken >= width) break;
        }
      }
      level = next;
    }
  }
  return { values, shrinks };
}
