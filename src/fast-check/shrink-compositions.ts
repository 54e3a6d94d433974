import { spread } from './spread.js';

/**
 * Shrink candidates of a composition (parts in order), most aggressive first, as for partitions
 * (shrink-partitions.ts) but keeping the order of the parts: drop a prefix, a suffix or a part,
 * lower a part; merge neighbours; even out neighbours, or swap a smaller part before a larger
 * one (lexicographically larger). Moves at single positions look at the positions `spread`
 * picks (all of a short composition; about a hundred of a long one, which the halving moves
 * shorten in logarithmically many steps), so a step proposes at most a few hundred candidates.
 */

export function* compositionShrinks(parts: readonly number[]): Generator<number[]> {
  const length = parts.length;
  if (length === 0) return;
  const positions = spread(length);
  if (length >= 2) {
    yield parts.slice(0, length >> 1);
    yield parts.slice(length >> 1);
  }
  for (const at of positions) yield without(parts, at);
  for (const at of positions) if (parts[at] > 0) yield replaced(parts, at, [parts[at] - 1]);
  for (const at of positions) if (parts[at] > 3) yield replaced(parts, at, [parts[at] >> 1]);
  if (length >= 4) yield [...parts.slice(0, length >> 1), sum(parts.slice(length >> 1))];
  for (const at of positions) if (at + 1 < length) yield replaced(without(parts, at + 1), at, [parts[at] + parts[at + 1]]);
  for (const at of positions) {
    if (at + 1 >= length) continue;
    const total = parts[at] + parts[at + 1];
    yield replaced(parts, at, [Math.ceil(total / 2), Math.floor(total / 2)], 2);
    if (parts[at] < parts[at + 1]) yield replaced(parts, at, [parts[at + 1], parts[at]], 2);
  }
}

function without(parts: readonly number[], at: number): number[] {
  return [...parts.slice(0, at), ...parts.slice(at + 1)];
}

function replaced(parts: readonly number[], at: number, by: readonly number[], span = 1): number[] {
  return [...parts.slice(0, at), ...by, ...parts.slice(at + span)];
}

function sum(parts: readonly number[]): number {
  let total = 0;
  for (const p of parts) total += p;
  return total;
}
