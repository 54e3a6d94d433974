import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { compositionFamily, partitionFamily, PartsmithError, setPartitionFamily, type SampledFamily } from 'partsmith';
import { toQueryString } from '../../src/client/params.js';
import { createApp } from '../../src/http/app.js';
import { thrown } from '../support/thrown.js';

/**
 * The synchronous library equals the HTTP API: for the same family and seed it returns the same
 * samples (the JSON documents are rebuilt from the library's values and compared byte for byte
 * with the API's), the same counts, and refuses the same requests with the same problem.
 */
const app = createApp();
async function service(pathAndQuery: string): Promise<{ status: number; text: string }> {
  const response = await app.fetch(new Request(`http://service${pathAndQuery}`));
  return { status: response.status, text: await response.text() };
}

type Constraints = Record<string, unknown> & { n: number };
const make = (kind: 'partition' | 'composition', constraints: Constraints): SampledFamily<number[]> =>
  kind === 'partition' ? partitionFamily(constraints as never) : compositionFamily(constraints as never);
const path = (kind: 'partition' | 'composition') => (kind === 'partition' ? '/v1/partitions' : '/v1/compositions');

/** The API's JSON document for samples start..start+count-1, written from the library's values. */
function libraryDocument(family: SampledFamily<number[]>, seed: string, start: number, count: number): string {
  return JSON.stringify({ family: family.description, seed, start, method: family.method, samples: [...family.samples(seed, start, count)] });
}

async function expectSameSamples(kind: 'partition' | 'composition', constraints: Constraints, seed: string, start: number, count: number): Promise<void> {
  const family = make(kind, constraints);
  const answer = await service(`${path(kind)}${toQueryString({ ...constraints, seed, start, count })}`);
  expect(answer.status, JSON.stringify(constraints)).toBe(200);
  expect(libraryDocument(family, seed, start, count), JSON.stringify(constraints)).toBe(answer.text);
}

describe('the library returns the samples of the API, byte for byte', () => {
  const partitionCases: Constraints[] = [
    { n: 0 },
    { n: 1 },
    { n: 40 },
    { n: 1000 },
    { n: 5000 },
    { n: 1_000_000 },
    { n: 100, distinct: true, maxPart: 30 },
    { n: 97, allowed: [1, 2, 5, 10, 20, 50] },
    { n: 1000, length: 8 },
    { n: 200, minPart: 3, maxLength: 12 },
    { n: 60, maxPart: 20 },
  ];
  it.each(partitionCases)('partitions %j', async (constraints) => {
    await expectSameSamples('partition', constraints, 'parity', 0, 5);
    await expectSameSamples('partition', constraints, 'parity', 17, 3);
  });

  const compositionCases: Constraints[] = [
    { n: 0 },
    { n: 20 },
    { n: 100000 },
    { n: 8, length: 3, minPart: 0 },
    { n: 500, minPart: 2, maxPart: 5 },
    { n: 15, allowed: [1, 2] },
    { n: 100_000_000, length: 1000 },
  ];
  it.each(compositionCases)('compositions %j', async (constraints) => {
    await expectSameSamples('composition', constraints, 'parity', 0, 4);
    await expectSameSamples('composition', constraints, 'parity', 1_000_000, 2);
  });

  const setPartitionCases: Constraints[] = [
    { n: 0 },
    { n: 12 },
    { n: 12, blocks: 3 },
    { n: 20, maxBlocks: 4, maxBlockSize: 6 },
    { n: 30, minBlockSize: 2 },
    { n: 5000, blocks: 10 },
    { n: 20000 },
  ];
  it.each(setPartitionCases)('set partitions %j (members as blocks, the API\'s as=blocks)', async (constraints) => {
    const family = setPartitionFamily(constraints as never);
    for (const [start, count] of [[0, 3], [99, 2]]) {
      const answer = await service(`/v1/set-partitions${toQueryString({ ...constraints, seed: 'parity', start, count })}`);
      expect(answer.status).toBe(200);
      const doc = JSON.stringify({ family: family.description, seed: 'parity', start, method: family.method, samples: [...family.samples('parity', start, count)] });
      expect(doc).toBe(answer.text);
    }
    if (constraints.n <= 1000) expect(String(family.count)).toBe(JSON.parse((await service(`/v1/set-partitions/count${toQueryString(constraints)}`)).text).count);
    for (const blocks of family.samples('members', 0, 20)) expect(family.contains(blocks)).toBe(true);
  });

  it('sample(seed, i) is sample i of samples(seed, ...) and of the API, whatever framing', async () => {
    const family = partitionFamily({ n: 50, maxPart: 9 });
    const all = [...family.samples('frame', 0, 10)];
    expect([...family.samples('frame', 6, 4)]).toEqual(all.slice(6));
    expect(family.sample('frame', 7)).toEqual(all[7]);
    expect(family.sample('frame')).toEqual(all[0]);
    // An unbounded iterator, read as far as needed.
    const open = family.samples('frame');
    expect([open.next().value, open.next().value]).toEqual(all.slice(0, 2));
    // NDJSON lines of the API, one per sample.
    const ndjson = await service('/v1/partitions?n=50&maxPart=9&seed=frame&count=10&format=ndjson');
    expect(all.map((parts, index) => `${JSON.stringify({ index, parts })}\n`).join('')).toBe(ndjson.text);
  });

  it('random small families: the same samples or the same refusal as the API (200 families, fixed seed)', async () => {
    const rng = seedrandom('library-parity');
    const statuses: Record<number, number> = {};
    const below = (k: number) => Math.floor(rng() * k);
    for (let i = 0; i < 200; i++) {
      const kind = rng() < 0.5 ? 'partition' : 'composition';
      const c: Constraints = { n: below(40) };
      if (kind === 'partition' && rng() < 0.3) c.distinct = true;
      if (rng() < 0.3) c.minPart = kind === 'composition' ? below(4) : 1 + below(4);
      if (rng() < 0.3) c.maxPart = 1 + below(12);
      if (rng() < 0.3) c.length = below(8);
      if (kind === 'partition' && rng() < 0.2) c.maxLength = below(8);
      if (rng() < 0.2) c.allowed = [1 + below(9), 1 + below(9), 1 + below(9)];
      const target = `${path(kind)}${toQueryString({ ...c, seed: `r${i}`, count: 3 })}`;
      const answer = await service(target);
      statuses[answer.status] = (statuses[answer.status] ?? 0) + 1;
      let family: SampledFamily<number[]> | undefined;
      let error: Record<string, unknown> | undefined;
      try {
        family = make(kind, c);
        libraryDocument(family, `r${i}`, 0, 3);
      } catch {
        error = thrown(() => libraryDocument(make(kind, c), `r${i}`, 0, 3));
      }
      if (answer.status === 200) {
        expect(error, target).toBeUndefined();
        expect(libraryDocument(family!, `r${i}`, 0, 3), target).toBe(answer.text);
        const count = await service(`${path(kind)}/count${toQueryString(c)}`);
        expect(JSON.parse(count.text).count, target).toBe(family!.count.toString());
      } else {
        expect(error, target).toEqual(JSON.parse(answer.text));
      }
    }
    // Both paths are exercised: families served, and families refused (empty, contradictory, malformed).
    expect(statuses[200]).toBeGreaterThan(50);
    expect((statuses[400] ?? 0) + (statuses[422] ?? 0)).toBeGreaterThan(20);
  });
});

describe('counts', () => {
  it('are the API counts, as BigInt', async () => {
    // p(200) = 3972999029388, OEIS A000041.
    expect(partitionFamily({ n: 200 }).count).toBe(3972999029388n);
    // Compositions of 15 into 1s and 2s: Fibonacci F(16) = 987 (OEIS A000045).
    expect(compositionFamily({ n: 15, allowed: [1, 2] }).count).toBe(987n);
    // Partitions of 100 into distinct parts: 444793 (OEIS A000009).
    expect(partitionFamily({ n: 100, distinct: true }).count).toBe(444793n);
    // An empty family counts 0, as GET .../count says; sampling it is refused (below).
    expect(partitionFamily({ n: 7, allowed: [2, 4] }).count).toBe(0n);
    expect(JSON.parse((await service('/v1/partitions/count?n=7&allowed=2,4')).text).count).toBe('0');
  });
});

describe('refusals: PartsmithError with the problem the API answers', () => {
  const cases: [string, () => unknown, string][] = [
    ['n out of range', () => partitionFamily({ n: -1 }), '/v1/partitions/count?n=-1'],
    ['n too large', () => compositionFamily({ n: 2e9 }), '/v1/compositions/count?n=2000000000'],
    ['n missing', () => partitionFamily({} as never), '/v1/partitions/count'],
    ['a fraction', () => partitionFamily({ n: 10, maxPart: 2.5 }), '/v1/partitions/count?n=10&maxPart=2.5'],
    ['an unknown parameter', () => partitionFamily({ n: 10, maxpart: 3 } as never), '/v1/partitions/count?n=10&maxpart=3'],
    ['length with maxLength', () => partitionFamily({ n: 10, length: 2, maxLength: 3 }), '/v1/partitions/count?n=10&length=2&maxLength=3'],
    ['weak compositions without length', () => compositionFamily({ n: 10, minPart: 0 }), '/v1/compositions/count?n=10&minPart=0'],
    ['an empty family, sampled', () => partitionFamily({ n: 7, allowed: [2, 4] }).sample('x'), '/v1/partitions?n=7&allowed=2,4&seed=x'],
    ['contradictory bounds, sampled', () => compositionFamily({ n: 10, minPart: 5, maxPart: 3 }).sample('x'), '/v1/compositions?n=10&minPart=5&maxPart=3&seed=x'],
    ['a count over its limit', () => partitionFamily({ n: 1_000_000_000 }).count, '/v1/partitions/count?n=1000000000'],
    ['a bad seed', () => partitionFamily({ n: 10 }).sample('white space'), '/v1/partitions?n=10&seed=white%20space'],
  ];
  it.each(cases)('%s', async (_what, call, request) => {
    const answer = await service(request);
    expect(answer.status).toBeGreaterThanOrEqual(400);
    expect(thrown(call)).toEqual(JSON.parse(answer.text));
  });

  it('the index and start of a sample are checked like the API start parameter', async () => {
    const family = partitionFamily({ n: 10 });
    const api = JSON.parse((await service('/v1/partitions?n=10&seed=x&start=1000000000000001')).text);
    const index = thrown(() => family.sample('x', 1e15 + 1));
    expect(index.detail).toBe(api.detail.replace('start', 'index'));
    expect(thrown(() => family.samples('x', -1).next())).toEqual(JSON.parse((await service('/v1/partitions?n=10&seed=x&start=-1')).text));
    expect(thrown(() => family.samples('x', 0, 2.5).next()).detail).toMatch(/^Invalid query: count must be a whole number >= 0/);
  });

  it('the error names the equivalent API request', () => {
    const error = (() => {
      try {
        partitionFamily({ n: 7, allowed: [2, 4] }).sample('x');
      } catch (e) {
        return e as PartsmithError;
      }
    })();
    expect(error?.url).toBe('/v1/partitions?n=7&allowed=2%2C4');
    expect(error?.message).toBe('422 Request cannot be served: no partition of 7 has all parts in {2, 4}');
  });
});

describe('membership and resizing', () => {
  it('contains() accepts exactly the members, written as the library writes them', () => {
    const family = partitionFamily({ n: 10, distinct: true, maxPart: 6 });
    expect(family.contains([6, 4])).toBe(true);
    expect(family.contains([6, 3, 1])).toBe(true);
    expect(family.contains([4, 6])).toBe(false); // not largest first
    expect(family.contains([5, 5])).toBe(false); // not distinct
    expect(family.contains([7, 3])).toBe(false); // over maxPart
    expect(family.contains([6, 3])).toBe(false); // sums to 9
    expect(family.contains('6,4')).toBe(false);
    for (const parts of family.samples('m', 0, 50)) expect(family.contains(parts)).toBe(true);
    const weak = compositionFamily({ n: 4, length: 3, minPart: 0, maxPart: 3 });
    expect(weak.contains([0, 1, 3])).toBe(true);
    expect(weak.contains([4, 0, 0])).toBe(false);
    expect(weak.contains([1, 3])).toBe(false);
  });

  it('resize() keeps the constraints and checks n like the schema', () => {
    const family = partitionFamily({ n: 30, maxPart: 4, distinct: true });
    const small = family.resize(7);
    expect(small.description).toEqual({ kind: 'partition', n: 7, distinct: true, maxPart: 4 });
    expect(small.count).toBe(partitionFamily({ n: 7, maxPart: 4, distinct: true }).count);
    expect(thrown(() => family.resize(-3)).detail).toBe('Invalid query: n must be a whole number from 0 to 1000000000, written with digits only.');
  });
});
