import { describe, expect, it } from 'vitest';
import { compositionRanker } from '../../src/core/ranks/composition-ranker.js';
import { partitionRanker } from '../../src/core/ranks/partition-ranker.js';
import { listAll } from '../ranks/support.js';
import { PROJECT_ROOT } from '../edge/runtimes.js';
import { apiBody, runBin, runCommand, runInProcess } from './run-bin.js';

const hasScript = (await runCommand('sh', ['-c', 'command -v script'])).code === 0;

/**
 * partsmith list, rank and unrank: the API's bodies, with long listings paged with start and
 * joined (JSON) or concatenated (text, NDJSON) as they arrive.
 */
describe('partsmith list, rank, unrank', () => {
  it('list, as a child process: one page is the API body byte for byte', async () => {
    const result = await runBin(['list', '--n', '12', '--max-length', '4', '--format', 'text']);
    expect(result).toEqual({ code: 0, stdout: await apiBody('/v1/partitions/list?n=12&maxLength=4&format=text&count=10000'), stderr: '' });
    expect(result.stdout.split('\n')[0]).toBe('0\t12');
  });

  it('lists every member over several pages: JSON joins into one document', async () => {
    const result = await runInProcess(['list', '--n', '35']);
    expect(result.code).toBe(0);
    const doc = JSON.parse(result.stdout);
    const expected = listAll(partitionRanker({ kind: 'partition', n: 35 }));
    expect(expected.length).toBe(14883); // p(35), OEIS A000041: two pages of 10,000
    expect(doc).toMatchObject({ family: { kind: 'partition', n: 35 }, total: String(expected.length), start: '0' });
    expect(doc.members).toEqual(expected.map((parts, i) => ({ rank: String(i), parts })));
  });

  it('list compositions from a start, for a count over the page limit: NDJSON pages concatenate', async () => {
    const result = await runInProcess(['list', 'compositions', '--n', '15', '--start', '100', '--count', '12000', '--format', 'ndjson']);
    expect(result.code).toBe(0);
    const lines = result.stdout.split('\n').filter(Boolean).map((line) => JSON.parse(line));
    const expected = listAll(compositionRanker({ kind: 'composition', n: 15 }), 100n).slice(0, 12000);
    expect(lines).toEqual(expected.map((parts, i) => ({ rank: String(100 + i), parts })));
  });

  it('stops at the end of the family, and an empty family lists nothing', async () => {
    const tail = await runInProcess(['list', '--n', '10', '--start', '40', '--count', '100', '--format', 'text']);
    expect(tail).toEqual({ code: 0, stdout: await apiBody('/v1/partitions/list?n=10&start=40&count=100&format=text'), stderr: '' });
    expect(tail.stdout.trim().split('\n')).toHaveLength(2); // p(10) = 42 (OEIS A000041)
    const empty = await runInProcess(['list', '--n', '7', '--allowed', '2,4', '--format', 'text']);
    expect(empty).toEqual({ code: 0, stdout: '', stderr: '' });
  });

  it('list set-partitions: every member over several pages (B_9 = 21147, OEIS A000110), text pages concatenated', async () => {
    const result = await runInProcess(['list', 'set-partitions', '--n', '9', '--as', 'rgs', '--format', 'text']);
    expect(result.code).toBe(0);
    const lines = result.stdout.split('\n').filter(Boolean);
    expect(lines).toHaveLength(21147);
    expect(lines[0]).toBe('0\t0 0 0 0 0 0 0 0 0');
    expect(lines.at(-1)).toBe('21146\t0 1 2 3 4 5 6 7 8');
    const page = await runInProcess(['list', 'set-partitions', '--n', '6', '--blocks', '2', '--format', 'json']);
    expect(page).toEqual({ code: 0, stdout: await apiBody('/v1/set-partitions/list?n=6&blocks=2&format=json&count=10000'), stderr: '' });
  });

  it.each([
    [['rank', '--parts', '5,4,2,1'], '/v1/partitions/rank?parts=5,4,2,1'],
    [['rank', 'compositions', '--parts', '1,3,1'], '/v1/compositions/rank?parts=1,3,1'],
    [['unrank', '--n', '30', '--rank', '100', '--distinct'], '/v1/partitions/unrank?n=30&rank=100&distinct=true'],
    [['unrank', 'compositions', '--n', '10', '--rank', '17', '--length', '4'], '/v1/compositions/unrank?n=10&rank=17&length=4'],
    [['rank', 'set-partitions', '--rgs', '0,1,0,2', '--max-blocks', '3'], '/v1/set-partitions/rank?rgs=0,1,0,2&maxBlocks=3'],
    [['unrank', 'set-partitions', '--n', '10', '--rank', '1234', '--blocks', '3'], '/v1/set-partitions/unrank?n=10&rank=1234&blocks=3'],
    [['unrank', 'set-partitions', '--n', '10', '--rank', '1234', '--as', 'rgs'], '/v1/set-partitions/unrank?n=10&rank=1234&as=rgs'],
  ])('%j prints the API document', async (args, path) => {
    expect(await runInProcess(args)).toEqual({ code: 0, stdout: await apiBody(path), stderr: '' });
  });

  it('names the flag of a non-member or a rank past the end', async () => {
    const notMember = await runInProcess(['rank', '--parts', '1,2']);
    expect(notMember.code).toBe(1);
    expect(notMember.stderr).toMatch(/^partsmith rank: --parts not a member of the family: the parts of a partition are listed largest first/);
    const past = await runInProcess(['unrank', 'compositions', '--n', '3', '--rank', '4']);
    expect(past.code).toBe(1);
    expect(past.stderr).toMatch(/^partsmith unrank compositions: --rank must be a rank of this family \(from 0 to 3/);
  });

  it.skipIf(!hasScript)('shows a progress bar in members for a long listing on a terminal', async () => {
    // A terminal from script(1); the quiet period is shortened so the check does not depend on this machine's speed.
    const list = ['list', '--n', '35', '--format', 'ndjson', '--out', '/dev/null'];
    const command = [`PATH=${PROJECT_ROOT}/node_modules/.bin:$PATH`, 'TSX_DISABLE_CACHE=1', 'PARTSMITH_PROGRESS_AFTER_MS=0', `${PROJECT_ROOT}/src/cli.ts`, ...list].join(' ');
    const result = await runCommand('script', ['-qec', command, '/dev/null']);
    expect(result.code).toBe(0);
    // p(35) = 14883 (OEIS A000041).
    expect(result.stdout).toMatch(/\[#*\.*\] +\d+% \d+\/14883 members/);
  });
});
