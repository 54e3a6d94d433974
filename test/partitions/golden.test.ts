import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { familyKey } from '../../src/core/family.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';

// Golden vectors: what seed "golden" produces for sample index i of the family {partition, n}
// under ALGORITHM_VERSION 4. Recorded from this implementation; if one of these changes, what a
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
    expect(draw(10, 0)).toEqual({ sizes: [2, 1], multiplicities: [2, 6] });
    expect(draw(10, 1)).toEqual({ sizes: [6, 2, 1], multiplicities: [1, 1, 2] });
    expect(draw(10, 7)).toEqual({ sizes: [2, 1], multiplicities: [1, 8] });
  });

  it('n = 1000 (table method, its largest n)', () => {
    expect(fingerprint(1000, 0)).toEqual({ distinct: 23, largest: 89, ones: 1, sha256: '7187f8d43e193c02' });
    expect(fingerprint(1000, 1)).toEqual({ distinct: 21, largest: 118, ones: 7, sha256: 'a5e2aea4f7daedea' });
    expect(fingerprint(1000, 7)).toEqual({ distinct: 26, largest: 90, ones: 10, sha256: 'd0c3ef2382b4ea8f' });
  });

  it('n = 1001 (self-similar method, its smallest n)', () => {
    expect(fingerprint(1001, 0)).toEqual({ distinct: 19, largest: 86, ones: 49, sha256: '5cb868ad63a29542' });
    expect(fingerprint(1001, 1)).toEqual({ distinct: 22, largest: 100, ones: 36, sha256: 'e566692c147768fd' });
    expect(fingerprint(1001, 7)).toEqual({ distinct: 25, largest: 84, ones: 41, sha256: 'eadfe41003ab88f2' });
  });

  it('n = 1,000,000 (self-similar method)', () => {
    expect(fingerprint(1_000_000, 0)).toEqual({ distinct: 792, largest: 6258, ones: 651, sha256: '6f382cd8907cc4a1' });
    expect(fingerprint(1_000_000, 1)).toEqual({ distinct: 787, largest: 5989, ones: 678, sha256: '58c7a48222a88978' });
    expect(fingerprint(1_000_000, 7)).toEqual({ distinct: 807, largest: 4693, ones: 244, sha256: 'cd6c4c880614ef22' });
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
