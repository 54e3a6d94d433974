import type { SetPartitionSampler } from '../../src/core/set-partitions/sampler.js';
import { sampleSource } from '../../src/core/seeding.js';

/** The Lambert function W(x) (x e^x = n solved by Newton's method), for the asymptotic mean n/W(n). */
export function lambertW(n: number): number {
  let w = Math.log(n);
  for (let i = 0; i < 60; i++) w -= (w * Math.exp(w) - n) / (Math.exp(w) * (w + 1));
  return w;
}

/** How many samples of `sampler` have each number of blocks (index = blocks). */
export function blockCounts(sampler: SetPartitionSampler, samples: number, seed: string, key: string): number[] {
  const counts: number[] = [];
  for (let i = 0; i < samples; i++) {
    const k = sampler.sample(sampleSource(seed, i, key)).blocks;
    counts[k] = (counts[k] ?? 0) + 1;
  }
  return Array.from(counts, (c) => c ?? 0);
}

/** A BigInt ratio as a double. */
export function ratio(a: bigint, b: bigint): number {
  const shift = Math.max(0, b.toString(2).length - 60);
  return Number(a >> BigInt(shift)) / Number(b >> BigInt(shift));
}

/** Every constraint shape, alone and combined, for the brute-force comparisons (counts, ranks). */
export const CONSTRAINT_SHAPES: { blocks?: number; maxBlocks?: number; minBlockSize?: number; maxBlockSize?: number }[] = [
  {},
  { blocks: 3 },
  { maxBlocks: 2 },
  { minBlockSize: 2 },
  { maxBlockSize: 2 },
  { minBlockSize: 2, maxBlockSize: 3 },
  { blocks: 3, minBlockSize: 2 },
  { blocks: 4, maxBlockSize: 3 },
  { blocks: 2, minBlockSize: 2, maxBlockSize: 5 },
  { maxBlocks: 3, minBlockSize: 2, maxBlockSize: 4 },
  { maxBlocks: 4, maxBlockSize: 2 },
  { minBlockSize: 3 },
];
