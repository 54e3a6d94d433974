import type { CompositionFamily } from '../../src/core/family.js';

/**
 * Every composition in a family, by brute force (test-only; independent of the library's
 * counting and sampling code): parts are tried one by one and kept when they satisfy the
 * family's constraints as stated in src/core/family.ts.
 */
export function enumerateCompositions(family: CompositionFamily): number[][] {
  // minPart defaults to 1, except that an explicit allowed list is not filtered by the default.
  const min = family.minPart ?? (family.allowed === undefined ? 1 : 0);
  const max = family.maxPart ?? family.n;
  const ok = (v: number) => v >= min && v <= max && (family.allowed === undefined || family.allowed.includes(v));
  const out: number[][] = [];
  const prefix: number[] = [];
  const walk = (rest: number): void => {
    if (family.length === undefined ? rest === 0 : prefix.length === family.length) {
      if (rest === 0) out.push([...prefix]);
      if (family.length !== undefined || rest === 0) return;
    }
    for (let v = 0; v <= rest; v++) {
      if (!ok(v)) continue;
      prefix.push(v);
      walk(rest - v);
      prefix.pop();
    }
  };
  walk(family.n);
  return out;
}
