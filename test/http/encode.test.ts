import { describe, expect, it } from 'vitest';
import { partsOf, type Partition } from '../../src/core/partition.js';
import { unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import { sampleSource } from '../../src/core/seeding.js';
import { sampleUnrestricted, unrestrictedSampler } from '../../src/core/compositions/unrestricted.js';
import { compositionAsParts, partitionAsMultiplicities, partitionAsParts } from '../../src/http/encode.js';

/** 80 distinct sizes, largest first, with every decimal length from 10 digits down to 1; multiplicities of every length too. */
function digitBoundaries(): Partition {
  const sizes = [2 ** 31 - 1, 1e9, 999999999, 123456789, 1e8, 1e7, 9999999, 1e6, 999999, 100000, 99999, 10000, 9999, 1000, 999, 100];
  for (let v = 99; sizes.length < 80; v--) sizes.push(v); // down to 36: two digits
  sizes.push(9, 1);
  return { sizes, multiplicities: sizes.map((_, i) => [1, 9, 10, 99, 100, 12345, 2 ** 31 - 1][i % 7]) };
}

describe('sample encoders', () => {
  // The JSON text is written by hand for speed; it must be exactly what JSON.stringify gives.
  const partitions: Partition[] = [
    { sizes: [], multiplicities: [] },
    { sizes: [1], multiplicities: [1] },
    { sizes: [7, 1], multiplicities: [1, 40000] },
    { sizes: [123456, 4096, 4095, 3], multiplicities: [2, 1, 3, 1] }, // past the cached texts
    ...[1, 2, 10, 100, 1000, 5000, 1e6].flatMap((n) => [0, 1, 2].map((i) => unrestrictedPartitionSampler(n).sample(sampleSource('encode', i, `n=${n}`)))),
  ];

  it('partition parts: the JSON list of parts, largest first', () => {
    for (const p of partitions) expect(partitionAsParts.json(p)).toBe(JSON.stringify(partsOf(p)));
  });

  it('partition multiplicities: the JSON list of [part, multiplicity] pairs', () => {
    for (const p of partitions) expect(partitionAsMultiplicities.json(p)).toBe(JSON.stringify(p.sizes.map((size, i) => [size, p.multiplicities[i]])));
  });

  it('long multiplicity lists (written as bytes): exactly JSON.stringify, every digit count up to 2^31 - 1, and at n = 1e9 (24,000 pairs)', () => {
    const long = [digitBoundaries(), ...[0, 1].map((i) => unrestrictedPartitionSampler(1e9).sample(sampleSource('encode', i, 'n=1e9')))];
    for (const p of long) {
      expect(partitionAsMultiplicities.json(p)).toBe(JSON.stringify(p.sizes.map((size, k) => [size, p.multiplicities[k]])));
    }
  });

  it('the three formats agree: text lines hold the same parts', () => {
    for (const p of partitions) {
      expect(partitionAsParts.text(p)).toBe(partsOf(p).join(' '));
      expect(compositionAsParts.json(partsOf(p))).toBe(partitionAsParts.json(p));
    }
  });

  it('compositions from a typed array: exactly JSON.stringify and join of the same parts', () => {
    const lists: number[][] = [
      [],
      [0],
      [7],
      // Each digit-count boundary, and the largest part an Int32Array holds (2^31 - 1).
      [9, 10, 99, 100, 999, 1000, 9999, 10000, 99999, 100000, 999999, 1000000, 123456789, 999999999, 1000000000, 2 ** 31 - 1],
      ...[1, 2, 33, 1000, 100000].flatMap((n) => [0, 1].map((i) => sampleUnrestricted(sampleSource('encode', i, `c=${n}`), n))),
      // Long runs of the longest numbers: the writer's buffer (sized for two digits each) grows many times.
      new Array<number>(10000).fill(2 ** 31 - 1),
      [...new Array<number>(5000).fill(1), ...new Array<number>(5000).fill(123456)],
    ];
    for (const list of lists) {
      const typed = Int32Array.from(list);
      expect(compositionAsParts.json(typed)).toBe(JSON.stringify(list));
      expect(compositionAsParts.text(typed)).toBe(list.join(' '));
    }
  });

  it('the typed form of an unrestricted composition is the list form, draw for draw', () => {
    for (const n of [0, 1, 2, 31, 32, 33, 64, 65, 1000, 100000]) {
      for (const scale of [1, 3]) {
        const sampler = unrestrictedSampler(n, scale);
        for (let i = 0; i < 3; i++) {
          const list = sampler.sample(sampleSource('typed', i, `n=${n}`));
          expect(Array.from(sampler.sampleParts!(sampleSource('typed', i, `n=${n}`)))).toEqual(list);
          expect(list.reduce((a, b) => a + b, 0)).toBe(n * scale);
        }
      }
    }
  });

  it('bytes of large samples framed by a head and tail: exactly the text, as ASCII; small samples give none', () => {
    const decode = (bytes: Uint8Array | undefined) => (bytes === undefined ? undefined : new TextDecoder().decode(bytes));
    const head = '{"family":{"kind":"partition","n":1000000000},"seed":"a-1","start":0,"method":"self-similar/1","samples":[';
    // A long head and tail: the buffer, sized from the sample, must make room for them too.
    for (const [open, close] of [['', ''], [head, ']}'], ['{"index":7,"multiplicities":', '}\n'], [head.repeat(50), ']}'.repeat(500)]]) {
      const long = [digitBoundaries(), ...[0, 1].map((i) => unrestrictedPartitionSampler(1e9).sample(sampleSource('encode', i, 'n=1e9')))];
      for (const p of long) expect(decode(partitionAsMultiplicities.jsonBytes!(p, open, close))).toBe(open + partitionAsMultiplicities.json(p) + close);
      for (const list of [new Array<number>(10000).fill(2 ** 31 - 1), sampleUnrestricted(sampleSource('encode', 0, 'c=100000'), 100000)]) {
        const typed = Int32Array.from(list);
        expect(decode(compositionAsParts.jsonBytes!(typed, open, close))).toBe(open + JSON.stringify(list) + close);
      }
    }
    for (const p of partitions.filter((q) => q.sizes.length < 64)) expect(partitionAsMultiplicities.jsonBytes!(p, '[', ']')).toBeUndefined();
    expect(compositionAsParts.jsonBytes!([1, 2, 3], '[', ']')).toBeUndefined();
  });
});
