import { describe, expect, it } from 'vitest';
import { blocksOfRgs, compositionFamily, partitionFamily, rgsOfBlocks, setPartitionFamily, type RankedFamily } from 'partsmith';
import { toQueryString } from '../../src/client/params.js';
import { createApp } from '../../src/http/app.js';
import { enumerateSetPartitions } from '../support/enumerate-set-partitions.js';
import { thrown } from '../support/thrown.js';

/**
 * The library's rank, unrank and list equal the API's rank endpoints: the JSON documents are
 * rebuilt from the library's values and compared byte for byte with the API's, and every
 * refusal is a PartsmithError carrying the problem the API answers (same status, detail and
 * parameter names).
 */
const app = createApp();
async function service(pathAndQuery: string): Promise<{ status: number; text: string }> {
  const response = await app.fetch(new Request(`http://service${pathAndQuery}`));
  return { status: response.status, text: await response.text() };
}

type Kind = 'partition' | 'composition' | 'set-partition';
type Constraints = Record<string, unknown> & { n: number };
const BASE: Record<Kind, string> = { partition: '/v1/partitions', composition: '/v1/compositions', 'set-partition': '/v1/set-partitions' };
/** The member field of the rank endpoints' answers, and the member parameter of rank. */
const FIELD: Record<Kind, string> = { partition: 'parts', composition: 'parts', 'set-partition': 'blocks' };
const PARAM: Record<Kind, string> = { partition: 'parts', composition: 'parts', 'set-partition': 'rgs' };

function make(kind: Kind, constraints: Constraints): RankedFamily<unknown> {
  if (kind === 'partition') return partitionFamily(constraints as never) as RankedFamily<unknown>;
  if (kind === 'composition') return compositionFamily(constraints as never) as RankedFamily<unknown>;
  return setPartitionFamily(constraints as never) as RankedFamily<unknown>;
}

/** A member in the rank endpoint's form (set partitions: the restricted growth string). */
const asParam = (kind: Kind, member: unknown) => (kind === 'set-partition' ? rgsOfBlocks(member as number[][]) : (member as number[]));

const FAMILIES: [Kind, Constraints][] = [
  ['partition', { n: 12 }],
  ['partition', { n: 12, maxLength: 4 }],
  ['partition', { n: 30, distinct: true, minPart: 2 }],
  ['partition', { n: 24, allowed: [1, 7, 9] }],
  ['partition', { n: 400 }],
  ['composition', { n: 10, allowed: [1, 2, 3] }],
  ['composition', { n: 9, length: 4, minPart: 0 }],
  ['composition', { n: 90 }],
  ['set-partition', { n: 6 }],
  ['set-partition', { n: 9, blocks: 3 }],
  ['set-partition', { n: 10, minBlockSize: 2, maxBlockSize: 4 }],
  ['set-partition', { n: 40, maxBlocks: 5 }],
];

describe('the library ranks, unranks and lists as the API does, byte for byte', () => {
  it.each(FAMILIES)('%s %j', async (kind, constraints) => {
    const family = make(kind, constraints);
    const base = BASE[kind];
    const total = family.count;
    expect(total).toBe(BigInt(JSON.parse((await service(`${base}/count${toQueryString(constraints)}`)).text).count));
    // A page of the listing from a third of the way in.
    const start = total / 3n;
    const members = [...family.list(start, 20)];
    const listing = { family: family.description, total: String(total), start: String(start), members: members.map((m, i) => ({ rank: String(start + BigInt(i)), [FIELD[kind]]: m })) };
    expect(JSON.stringify(listing)).toBe((await service(`${base}/list${toQueryString({ ...constraints, start, count: 20 })}`)).text);
    // Unrank and rank of the first, the last and a middle member.
    for (const rank of [0n, start, total - 1n]) {
      const member = family.unrank(rank);
      const unranked = { family: family.description, rank: String(rank), total: String(total), [FIELD[kind]]: member };
      expect(JSON.stringify(unranked)).toBe((await service(`${base}/unrank${toQueryString({ ...constraints, rank })}`)).text);
      expect(family.rank(member as never)).toBe(rank);
      const param = asParam(kind, member);
      const ranked = { family: family.description, [PARAM[kind]]: param, rank: String(rank), total: String(total) };
      expect(JSON.stringify(ranked)).toBe((await service(`${base}/rank${toQueryString({ [PARAM[kind]]: param, ...constraints })}`)).text);
    }
  });

  it('unrank takes a BigInt, a whole number or a decimal string; list runs to the end without a count', () => {
    const family = partitionFamily({ n: 12, maxLength: 4 });
    expect(family.unrank(26n)).toEqual([5, 4, 2, 1]);
    expect(family.unrank(26)).toEqual([5, 4, 2, 1]);
    expect(family.unrank('026')).toEqual([5, 4, 2, 1]);
    expect([...family.list(30)]).toEqual([[4, 4, 3, 1], [4, 4, 2, 2], [4, 3, 3, 2], [3, 3, 3, 3]]);
    expect([...family.list(34)]).toEqual([]);
    expect([...family.list(0, 0)]).toEqual([]);
  });

  it('set partitions: members as blocks, rank in either form, the list in the order of the restricted growth strings (brute force)', () => {
    const family = setPartitionFamily({ n: 7, maxBlocks: 3, minBlockSize: 2 });
    const members = enumerateSetPartitions({ n: 7, maxBlocks: 3, minBlockSize: 2 });
    expect([...family.list()].map(rgsOfBlocks)).toEqual(members);
    members.forEach((rgs, i) => {
      expect(family.rank(blocksOfRgs(rgs))).toBe(BigInt(i));
      expect(family.rank(rgs)).toBe(BigInt(i));
      expect(family.contains(blocksOfRgs(rgs))).toBe(true);
    });
    expect(blocksOfRgs([0, 1, 0, 2])).toEqual([[1, 3], [2], [4]]);
    expect(rgsOfBlocks([[1, 3], [2], [4]])).toEqual([0, 1, 0, 2]);
  });
});

describe('refusals: PartsmithError with the problem the API answers', () => {
  const cases: [string, () => unknown, string][] = [
    ['a partition out of order', () => partitionFamily({ n: 12 }).rank([1, 2, 9]), '/v1/partitions/rank?parts=1,2,9&n=12'],
    ['a partition of another n', () => partitionFamily({ n: 12 }).rank([5, 4, 2]), '/v1/partitions/rank?parts=5,4,2&n=12'],
    ['a part over maxPart', () => partitionFamily({ n: 10, maxPart: 5 }).rank([6, 4]), '/v1/partitions/rank?parts=6,4&maxPart=5'],
    ['a composition of another length', () => compositionFamily({ n: 4, length: 3 }).rank([2, 2]), '/v1/compositions/rank?parts=2,2&length=3&n=4'],
    ['a rank past the end', () => partitionFamily({ n: 12 }).unrank(77n), '/v1/partitions/unrank?n=12&rank=77'],
    ['a rank of an empty family', () => partitionFamily({ n: 7, allowed: [2, 4] }).unrank(0), '/v1/partitions/unrank?n=7&allowed=2,4&rank=0'],
    ['a negative rank', () => partitionFamily({ n: 12 }).unrank(-1n), '/v1/partitions/unrank?n=12&rank=-1'],
    ['a fraction of a rank', () => compositionFamily({ n: 5 }).unrank(1.5), '/v1/compositions/unrank?n=5&rank=1.5'],
    ['a start past the end', () => compositionFamily({ n: 5 }).list(17n), '/v1/compositions/list?n=5&start=17'],
    ['a malformed start', () => compositionFamily({ n: 5 }).list('x'), '/v1/compositions/list?n=5&start=x'],
    ['a family past the rank tables', () => partitionFamily({ n: 5000 }).unrank(0), '/v1/partitions/unrank?n=5000&rank=0'],
    ['compositions past the rank tables', () => compositionFamily({ n: 2 ** 20 + 2 }).list(), `/v1/compositions/list?n=${2 ** 20 + 2}`],
    ['a set partition with too many blocks', () => setPartitionFamily({ n: 3, blocks: 2 }).rank([0, 1, 2]), '/v1/set-partitions/rank?rgs=0,1,2&blocks=2'],
    ['a string that is not a restricted growth string', () => setPartitionFamily({ n: 3 }).rank([0, 2, 1]), '/v1/set-partitions/rank?rgs=0,2,1'],
    ['set partitions past the ranking limit', () => setPartitionFamily({ n: 6000 }).unrank(0), '/v1/set-partitions/unrank?n=6000&rank=0'],
    ['more blocks than items', () => setPartitionFamily({ n: 4, blocks: 5 }), '/v1/set-partitions/count?n=4&blocks=5'],
    ['minBlockSize over maxBlockSize', () => setPartitionFamily({ n: 4, minBlockSize: 3, maxBlockSize: 2 }).list(), '/v1/set-partitions/list?n=4&minBlockSize=3&maxBlockSize=2'],
    ['blocks with maxBlocks', () => setPartitionFamily({ n: 4, blocks: 2, maxBlocks: 3 }), '/v1/set-partitions/count?n=4&blocks=2&maxBlocks=3'],
    ['an empty set-partition family, sampled', () => setPartitionFamily({ n: 10, blocks: 3, minBlockSize: 4 }).sample('x'), '/v1/set-partitions?n=10&blocks=3&minBlockSize=4&seed=x'],
  ];
  it.each(cases)('%s', async (_what, call, request) => {
    const answer = await service(request);
    expect(answer.status).toBeGreaterThanOrEqual(400);
    expect(thrown(call)).toEqual(JSON.parse(answer.text));
  });

  it('blocks that are not a set partition are refused naming the member (rgs), with what is wrong', () => {
    const family = setPartitionFamily({ n: 4 });
    expect(thrown(() => family.rank([[1, 2], [2, 3, 4]]))).toMatchObject({ status: 422, errors: [{ param: 'rgs', message: 'not a member of the family: item 2 is in two blocks' }] });
    expect(thrown(() => family.rank([[2, 3], [1, 4]])).detail).toMatch(/blocks are ordered by their smallest item/);
    expect(thrown(() => family.rank([[1, 3, 2], [4]])).detail).toMatch(/listed in increasing order/);
    expect(thrown(() => family.rank([[1, 2], [3]])).detail).toMatch(/places 3 items, not n = 4/);
    expect(thrown(() => blocksOfRgs([0, 2]))).toMatchObject({ status: 400, errors: [{ param: 'rgs' }] });
    expect(thrown(() => rgsOfBlocks([[1], []]))).toMatchObject({ status: 400, errors: [{ param: 'blocks' }] });
  });

  it('a refused ranking is remembered by the family and thrown for every call', () => {
    const family = partitionFamily({ n: 100_000 });
    const first = thrown(() => family.rank([100_000]));
    expect(thrown(() => family.unrank(0))).toEqual(first);
    expect(thrown(() => family.list())).toEqual(first);
  });
});
