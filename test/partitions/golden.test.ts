import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { familyKey } from '../../src/core/family.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';

// Golden vectors: what seed "golden" produces for sample index i of the family {partition, n}
// under ALGORITHM_VERSION 2. Recorded from this implementation; if one of these changes, what a
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
    expect(draw(10, 0)).toEqual({ sizes: [2, 1], multiplicities: [4, 2] });
    expect(draw(10, 1)).toEqual({ sizes: [2, 1], multiplicities: [1, 8] });
    expect(draw(10, 7)).toEqual({ sizes: [7, 2, 1], multiplicities: [1, 1, 1] });
  });

  it('n = 1000 (table method, its largest n)', () => {
    expect(fingerprint(1000, 0)).toEqual({ distinct: 25, largest: 126, ones: 26, sha256: '695c052d0608d766' });
    expect(fingerprint(1000, 1)).toEqual({ distinct: 22, largest: 131, ones: 51, sha256: 'b72156d5a3d0e1a0' });
    expect(fingerprint(1000, 7)).toEqual({ distinct: 24, largest: 144, ones: 24, sha256: '5658a45ac0bac8d1' });
  });

  it('n = 1001 (self-similar method, its smallest n)', () => {
    expect(fingerprint(1001, 0)).toEqual({ distinct: 25, largest: 87, ones: 13, sha256: '2a54a8fef2f04206' });
    expect(fingerprint(1001, 1)).toEqual({ distinct: 23, largest: 100, ones: 37, sha256: '9bef4ed5aee3155f' });
    expect(fingerprint(1001, 7)).toEqual({ distinct: 24, largest: 87, ones: 123, sha256: 'f0f8b3ad7a7bc928' });
  });

  it('n = 1,000,000 (self-similar method)', () => {
    expect(fingerprint(1_000_000, 0)).toEqual({ distinct: 796, largest: 4981, ones: 593, sha256: '3624a96affd2f901' });
    expect(fingerprint(1_000_000, 1)).toEqual({ distinct: 791, largest: 7168, ones: 1807, sha256: '275bb8c2dea07b31' });
    expect(fingerprint(1_000_000, 7)).toEqual({ distinct: 789, largest: 6439, ones: 2411, sha256: '93a9f9a696e7f426' });
  });

  it('sample i does not depend on other samples (fresh sampler vs reused sampler)', () => {
    for (const n of [1000, 1001]) {
      const sampler = unrestrictedPartitionSampler(n);
      const key = familyKey({ kind: 'partition', n });
      const reused = [0, 1, 7].map((i) => sampler.sample(sampleSource('golden', i, key)));
      expect(reused).toEqual([draw(n, 0), draw(n, 1), draw(n, 7)]);
    }
  });
});
