import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { familyKey } from '../../src/core/family.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';

// Golden vectors: what seed "golden" produces for sample index i of the family {partition, n}
// under ALGORITHM_VERSION 1. Recorded from this implementation; if one of these changes, what a
// seed produces has changed, and ALGORITHM_VERSION must be bumped (see src/core/seeding.ts).
// Large samples are pinned by their number of distinct sizes, largest part, number of 1s and
// the first 16 hex digits of the SHA-256 of JSON.stringify({sizes, multiplicities}).
function draw(n: number, index: number) {
  return unrestrictedPartitionSampler(n).sample(sampleSource('golden', index, familyKey({ kind: 'partition', n })));
}

function fingerprint(n: number, index: number) {
  const p = draw(n, index);
  const last = p.sizes.length - 1;
  return {
    distinct: p.sizes.length,
    largest: p.sizes[0],
    ones: p.sizes[last] === 1 ? p.multiplicities[last] : 0,
    sha256: createHash('sha256').update(JSON.stringify(p)).digest('hex').slice(0, 16),
  };
}

describe('golden vectors (seed "golden")', () => {
  it('n = 10 (table method)', () => {
    expect(draw(10, 0)).toEqual({ sizes: [4, 2], multiplicities: [1, 3] });
    expect(draw(10, 1)).toEqual({ sizes: [3, 2, 1], multiplicities: [2, 1, 2] });
    expect(draw(10, 7)).toEqual({ sizes: [3, 1], multiplicities: [1, 7] });
  });

  it('n = 1000 (self-similar method)', () => {
    expect(fingerprint(1000, 0)).toEqual({ distinct: 29, largest: 72, ones: 18, sha256: '35e213cd8a1369f1' });
    expect(fingerprint(1000, 1)).toEqual({ distinct: 24, largest: 109, ones: 4, sha256: 'a442fd6a8adc3620' });
    expect(fingerprint(1000, 7)).toEqual({ distinct: 23, largest: 113, ones: 114, sha256: 'a161a4d298569083' });
  });

  it('n = 1,000,000 (self-similar method)', () => {
    expect(fingerprint(1_000_000, 0)).toEqual({ distinct: 767, largest: 6357, ones: 1436, sha256: '15719276952d7e92' });
    expect(fingerprint(1_000_000, 1)).toEqual({ distinct: 774, largest: 5276, ones: 2057, sha256: 'b160bc65ff43084d' });
    expect(fingerprint(1_000_000, 7)).toEqual({ distinct: 770, largest: 6184, ones: 822, sha256: 'ab5ce76005259cfd' });
  });

  it('sample i does not depend on other samples (fresh sampler vs reused sampler)', () => {
    const sampler = unrestrictedPartitionSampler(1000);
    const key = familyKey({ kind: 'partition', n: 1000 });
    const reused = [0, 1, 7].map((i) => sampler.sample(sampleSource('golden', i, key)));
    expect(reused).toEqual([draw(1000, 0), draw(1000, 1), draw(1000, 7)]);
  });
});
