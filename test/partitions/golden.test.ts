import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { familyKey } from '../../src/core/family.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';

// Golden vectors: what seed "golden" produces for sample index i of the family {partition, n}
// under ALGORITHM_VERSION 3. Recorded from this implementation; if one of these changes, what a
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
    expect(draw(10, 0)).toEqual({ sizes: [8, 2], multiplicities: [1, 1] });
    expect(draw(10, 1)).toEqual({ sizes: [5, 3, 2], multiplicities: [1, 1, 1] });
    expect(draw(10, 7)).toEqual({ sizes: [5, 3, 2], multiplicities: [1, 1, 1] });
  });

  it('n = 1000 (table method, its largest n)', () => {
    expect(fingerprint(1000, 0)).toEqual({ distinct: 24, largest: 85, ones: 51, sha256: '0967c5b507c1ceb8' });
    expect(fingerprint(1000, 1)).toEqual({ distinct: 21, largest: 73, ones: 16, sha256: '2d538aa6103d8f9d' });
    expect(fingerprint(1000, 7)).toEqual({ distinct: 26, largest: 128, ones: 46, sha256: 'd21124e17d18904b' });
  });

  it('n = 1001 (self-similar method, its smallest n)', () => {
    expect(fingerprint(1001, 0)).toEqual({ distinct: 24, largest: 108, ones: 57, sha256: 'f7251cdc36f9483c' });
    expect(fingerprint(1001, 1)).toEqual({ distinct: 27, largest: 101, ones: 26, sha256: '6bf3cd6ddcacb0fe' });
    expect(fingerprint(1001, 7)).toEqual({ distinct: 23, largest: 133, ones: 9, sha256: '60a27c9f5ffb0f4a' });
  });

  it('n = 1,000,000 (self-similar method)', () => {
    expect(fingerprint(1_000_000, 0)).toEqual({ distinct: 755, largest: 4079, ones: 156, sha256: '98f62f592a485d1d' });
    expect(fingerprint(1_000_000, 1)).toEqual({ distinct: 779, largest: 7148, ones: 1374, sha256: '81967063dc396833' });
    expect(fingerprint(1_000_000, 7)).toEqual({ distinct: 795, largest: 4846, ones: 38, sha256: 'eb05d74e6a167ed1' });
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
