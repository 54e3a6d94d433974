import { spread } from './spread.js';

/**
 * Shrink candidates of a partition (parts largest first), most aggressive first: fewer parts and
 * a smaller n, then the same n with fewer parts, then moves that keep the number of parts and
 * even out or reorder the parts. Each candidate is written largest first; the arbitrary keeps
 * those that are strictly simpler (simplicity.ts) and members of their family, so the moves
 * themselves need not respect any constraint. About 8 candidates per distinct part size, for
 * the sizes `spread` picks (all of them up to 128; a partition of 10^9 has ~2.5·10^4 sizes, and
 * the halving moves shorten it in logarithmically many steps).
 */
export function* partitionShrinks(parts: readonly number[]): Generator<number[]> {
  const length = parts.length;
  if (length === 0) return;
  const all = distinctSizes(parts);
  const sizes = spread(all.length).map((i) => all[i]);
  // A smaller n: drop half of the parts (the smaller ones, then the larger ones), one copy of a
  // size, or one unit of a part.
  if (length >= 4) {
    yield parts.slice(0, Math.ceil(length / 2));
    yield parts.slice(Math.floor(length / 2));
  }
  for (const size of sizes) yield without(parts, parts.lastIndexOf(size));
  for (const size of sizes) if (size > 1) yield sorted(replaced(parts, parts.lastIndexOf(size), [size - 1]));
  for (const size of sizes) if (size > 3) yield sorted(replaced(parts, parts.indexOf(size), [size >> 1]));
  // The same n with fewer parts: merge the smallest half into one part, the two smallest parts,
  // the smallest into the largest, two equal parts...
  if (length >= 4) {
    const keep = Math.ceil(length / 2);
    yield sorted([...parts.slice(0, keep), sum(parts.slice(keep))]);
  }
  if (length >= 2) {
    yield sorted([...parts.slice(0, length - 2), parts[length - 2] + parts[length - 1]]);
    yield sorted([parts[0] + parts[length - 1], ...parts.slice(1, length - 1)]);
  }
  for (const size of sizes) {
    const at = parts.indexOf(size);
    if (parts[at + 1] === size) yield sorted(replaced(without(parts, at + 1), at, [2 * size]));
  }
  // ... or two neighbouring sizes, or the largest part with a copy of each other size.
  for (let i = 0; i + 1 < sizes.length; i++) {
    const at = parts.lastIndexOf(sizes[i]);
    if (at + 1 < length) yield sorted(replaced(without(parts, at + 1), at, [parts[at] + parts[at + 1]]));
  }
  for (let i = 1; i < sizes.length; i++) {
    const at = parts.lastIndexOf(sizes[i]);
    yield sorted(replaced(without(parts, at), 0, [parts[0] + parts[at]]));
  }
  // The same n and number of parts: even out two neighbouring sizes, or move one unit from the
  // smallest part to a larger one (lexicographically larger: towards the family's first member).
  for (let i = 0; i + 1 < sizes.length; i++) {
    const a = parts.lastIndexOf(sizes[i]);
    const b = a + 1;
    if (b >= length) continue;
    const total = parts[a] + parts[b];
    yield sorted(replaced(replaced(parts, a, [Math.ceil(total / 2)]), b, [Math.floor(total / 2)]));
  }
  const last = length - 1;
  for (const size of sizes) {
    const at = parts.indexOf(size);
    if (at > 0 && at < last) yield sorted(replaced(replaced(parts, at, [size + 1]), last, parts[last] > 1 ? [parts[last] - 1] : []));
  }
}

function distinctSizes(parts: readonly number[]): number[] {
  const out: number[] = [];
  for (const p of parts) if (out[out.length - 1] !== p) out.push(p);
  return out;
}

function without(parts: readonly number[], at: number): number[] {
  return [...parts.slice(0, at), ...parts.slice(at + 1)];
}

function replaced(parts: readonly number[], at: number, by: readonly number[]): number[] {
  return [...parts.slice(0, at), ...by, ...parts.slice(at + 1)];
}

function sorted(parts: number[]): number[] {
  return parts.sort((a, b) => b - a);
}

function sum(parts: readonly number[]): number {
  let total = 0;
  for (const p of parts) total += p;
  return total;
}
