import { describe, expect, it } from 'vitest';
import { partsOf, type Partition } from '../../src/core/partition.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';
import { compositionAsParts, partitionAsMultiplicities, partitionAsParts } from '../../src/http/encode.js';

describe('sample encoders', () => {
  // The JSON text is written by hand for speed; it must be exactly what JSON.stringify gives.
  const partitions: Partition[] = [
    { sizes: [], multiplicities: [] },
    { sizes: [1], multiplicities: [1] },
    { sizes: [7, 1], multiplicities: [1, 40000] },
    { sizes: [123456, 4096, 4095, 3], multiplicities: [2, 1, 3, 1] }, // past the cached texts
    ...[1, 2, 10, 100, 1000, 5000].flatMap((n) => [0, 1, 2].map((i) => unrestrictedPartitionSampler(n).sample(sampleSource('encode', i, `n=${n}`)))),
  ];

  it('partition parts: the JSON list of parts, largest first', () => {
    for (const p of partitions) expect(partitionAsParts.json(p)).toBe(JSON.stringify(partsOf(p)));
  });

  it('partition multiplicities: the JSON list of [part, multiplicity] pairs', () => {
    for (const p of partitions) expect(partitionAsMultiplicities.json(p)).toBe(JSON.stringify(p.sizes.map((size, i) => [size, p.multiplicities[i]])));
  });

  it('the three formats agree: text lines hold the same parts', () => {
    for (const p of partitions) {
      expect(partitionAsParts.text(p)).toBe(partsOf(p).join(' '));
      expect(compositionAsParts.json(partsOf(p))).toBe(partitionAsParts.json(p));
    }
  });
});
