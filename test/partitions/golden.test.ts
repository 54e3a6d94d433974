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
    expect(draw(10, 0)).toEqual({ sizes: [2, 1], multiplicities: [3, 4] });
    expect(draw(10, 1)).toEqual({ sizes: [2, 1], multiplicities: [1, 8] });
    expect(draw(10, 7)).toEqual({ sizes: [7, 1], multiplicities: [1, 3] });
  });

  it('n = 1000 (self-similar method)', () => {
    expect(fingerprint(1000, 0)).toEqual({ distinct: 22, largest: 47, ones: 43, sha256: '85c2468ecb5b70e2' });
    expect(fingerprint(1000, 1)).toEqual({ distinct: 27, largest: 78, ones: 3, sha256: '79065e60af8ae855' });
    expect(fingerprint(1000, 7)).toEqual({ distinct: 21, largest: 73, ones: 75, sha256: 'f848ab59f77e5bf7' });
  });

  it('n = 1,000,000 (self-similar method)', () => {
    expect(fingerprint(1_000_000, 0)).toEqual({ distinct: 794, largest: 4981, ones: 593, sha256: '9db34d329d62f4af' });
    expect(fingerprint(1_000_000, 1)).toEqual({ distinct: 789, largest: 4917, ones: 1807, sha256: '0c55db1f347bea36' });
    expect(fingerprint(1_000_000, 7)).toEqual({ distinct: 790, largest: 6439, ones: 2411, sha256: '30148733437ed5dd' });
  });

  it('sample i does not depend on other samples (fresh sampler vs reused sampler)', () => {
    const sampler = unrestrictedPartitionSampler(1000);
    const key = familyKey({ kind: 'partition', n: 1000 });
    const reused = [0, 1, 7].map((i) => sampler.sample(sampleSource('golden', i, key)));
    expect(reused).toEqual([draw(1000, 0), draw(1000, 1), draw(1000, 7)]);
  });
});
