import type { RandomSource } from '../random.js';
import type { SetPartitionSampler } from './sampler.js';
import { relabelInPlace, type SetPartition } from './set-partition.js';
import { fillUniformUrns } from './urns.js';

/**
 * Exactly k blocks by rejection from uniform maps: throw the n items into k labelled urns
 * uniformly and keep the throw when every urn holds minSize..maxSize items. The kept throws are
 * uniform over the surjections onto k urns with those sizes, and each set partition into k such
 * blocks is k! of them (one per labelling of its blocks), so the kept partitions are uniform
 * (the classical urn argument; e.g. Flajolet & Sedgewick 2009, §II.3.1 on surjections).
 * The acceptance is about exp(−k·e^(−n/k)) without size bounds: close to 1 once n >> k·ln k,
 * and then this is the cheapest exact method — n uniform urns (several per 32-bit word, urns.ts)
 * and a pass to number the blocks (which, without size bounds, is also the check).
 */
export function uniformMapsSampler(n: number, k: number, minSize: number, maxSize: number, expectedTrials: number): SetPartitionSampler {
  return {
    method: 'uniform-maps/1',
    expectedLength: n,
    expectedBlocks: k,
    expectedWork: expectedTrials * (n + k) + n,
    sample(source: RandomSource): SetPartition {
      const labels = new Int32Array(n);
      if (minSize <= 1 && maxSize >= n) {
        // Only "no urn empty" to check: the throw is kept when it numbers k blocks.
        for (;;) {
          fillUniformUrns(source, labels, k);
          const partition = relabelInPlace(labels, k);
          if (partition.blocks === k) return partition;
        }
      }
      const sizes = new Int32Array(k);
      for (;;) {
        fillUniformUrns(source, labels, k);
        for (let i = 0; i < n; i++) sizes[labels[i]]++;
        let ok = true;
        for (let j = 0; j < k; j++) {
          if (sizes[j] < minSize || sizes[j] > maxSize) ok = false;
          sizes[j] = 0;
        }
        if (ok) return relabelInPlace(labels, k);
      }
    },
  };
}
