import seedrandom from 'seedrandom';
import type { Ranker } from '../../src/core/ranks/ranker.js';

/** Every member of a ranker's family, in its order, from `start`. */
export function listAll(ranker: Ranker, start = 0n): number[][] {
  const out: number[][] = [];
  const members = ranker.list(start);
  for (let next = members.next(); !next.done; next = members.next()) out.push(next.value);
  return out;
}

/** The first `count` members of a listing from `start`. */
export function listSome(ranker: Ranker, start: bigint, count: number): number[][] {
  const out: number[][] = [];
  const members = ranker.list(start);
  for (let next = members.next(); !next.done && out.length < count; next = members.next()) out.push(next.value);
  return out;
}

/** Seeded uniform BigInts below `bound` (> 0): decimal digits from seedrandom, reduced with rejection. */
export function randomRanks(seed: string, bound: bigint, count: number): bigint[] {
  const rng = seedrandom(seed);
  const digits = bound.toString().length + 2;
  const span = 10n ** BigInt(digits);
  const limit = span - (span % bound);
  const out: bigint[] = [];
  while (out.length < count) {
    let text = '';
    for (let i = 0; i < digits; i++) text += Math.floor(rng() * 10);
    const value = BigInt(text);
    if (value < limit) out.push(value % bound);
  }
  return out;
}
