import type { RandomSource } from '../random.js';
import type { SetPartitionSampler } from './sampler.js';
import type { SetPartition } from './set-partition.js';
import { assignSizes } from './urns.js';

/**
 * Families whose constraints force every block to the same size s = n/k: exactly one number of
 * blocks k fits, and k blocks of at least minBlockSize (or at most maxBlockSize) items can only
 * hold n items when every block has exactly that many (n blocks of one item, one block of all,
 * 10 blocks of at least 100 items from 1000). The labels 0..k−1, each s times, in a uniformly
 * random order (assignSizes, urns.ts): each set partition into k blocks of s items is k!·(s!)^k
 * of the n! orders, so all are equally likely. With s = 1 or k = 1 the family has one member,
 * written without drawing anything.
 */
export function equalBlocksSampler(n: number, k: number): SetPartitionSampler {
  const size = n / k;
  if (!Number.isInteger(size)) throw new RangeError(`${k} equal blocks cannot hold ${n} items (bug)`);
  const single = k === 1 || size === 1;
  return {
    method: 'equal-blocks/1',
    expectedLength: n,
    expectedBlocks: k,
    // Writing the RGS; otherwise also the shuffle (a third of a word per item near n = 1000) and numbering blocks.
    expectedWork: single ? n : 3 * n,
    sample(source: RandomSource): SetPartition {
      if (single) {
        const rgs = new Int32Array(n);
        if (size === 1) for (let i = 0; i < n; i++) rgs[i] = i;
        return { rgs, blocks: k };
      }
      return assignSizes(source, n, new Int32Array(k).fill(size));
    },
  };
}
