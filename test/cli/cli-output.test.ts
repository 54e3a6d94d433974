import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../support/server-process.js';
import { apiBody, runBin, runInProcess } from './run-bin.js';

/**
 * The CLI prints exactly the API's body for the same request: --format json is the API's
 * document, text and ndjson the API's lines, whether computed in-process or asked of a running
 * service with --url. Each case runs the real bin as a child process.
 */
describe.concurrent('partsmith CLI output equals the API body', () => {
  let server: RunningServer;
  let dir: string;
  beforeAll(async () => {
    [server, dir] = await Promise.all([startServer(), mkdtemp(join(tmpdir(), 'partsmith-cli-'))]);
  }, 30_000);
  afterAll(async () => {
    await server?.stop();
    if (dir) await rm(dir, { recursive: true, force: true });
  });

  it('ndjson with --url against a running server (npm start), as a child process', async () => {
    const args = ['partitions', '--n=60', '--count=4', '--seed=m', '--format', 'ndjson', '--as', 'multiplicities', '--start', '99', '--distinct', 'false'];
    const result = await runBin([...args, '--url', server.baseUrl]);
    const expected = await apiBody('/v1/partitions?n=60&count=4&seed=m&format=ndjson&as=multiplicities&start=99&distinct=false');
    expect(result).toEqual({ code: 0, stdout: expected, stderr: '' });
  });

  const cases: Array<[string, string[], string]> = [
    ['json', ['partitions', '--n', '100', '--count', '5', '--seed', 'demo'], '/v1/partitions?n=100&count=5&seed=demo'],
    ['text', ['partitions', '--n', '40', '--count', '7', '--seed', 'demo', '--format', 'text'], '/v1/partitions?n=40&count=7&seed=demo&format=text'],
    [
      'ndjson, multiplicities, --name=value and a switch with an explicit value',
      ['partitions', '--n=60', '--count=4', '--seed=m', '--format', 'ndjson', '--as', 'multiplicities', '--start', '99', '--distinct', 'false'],
      '/v1/partitions?n=60&count=4&seed=m&format=ndjson&as=multiplicities&start=99&distinct=false',
    ],
    ['count', ['count', '--n', '100'], '/v1/partitions/count?n=100'],
    ['count partitions', ['count', 'partitions', '--n', '7'], '/v1/partitions/count?n=7'],
    ['compositions, text, exact length', ['compositions', '--n', '20', '--length', '4', '--seed', 'demo', '--format', 'text'], '/v1/compositions?n=20&length=4&seed=demo&format=text'],
    ['compositions, json', ['compositions', '--n', '12', '--count', '5', '--seed', 'demo'], '/v1/compositions?n=12&count=5&seed=demo'],
    [
      'compositions, ndjson, weak with kebab-case bounds',
      ['compositions', '--n', '9', '--count', '6', '--seed', 'w', '--length', '4', '--min-part', '0', '--max-part', '5', '--format', 'ndjson'],
      '/v1/compositions?n=9&count=6&seed=w&length=4&minPart=0&maxPart=5&format=ndjson',
    ],
    ['compositions, allowed sizes', ['compositions', '--n', '15', '--count', '3', '--seed', 'a', '--allowed', '1,3,4', '--format', 'text'], '/v1/compositions?n=15&count=3&seed=a&allowed=1,3,4&format=text'],
    ['count compositions', ['count', 'compositions', '--n', '10'], '/v1/compositions/count?n=10'],
    ['count compositions with constraints', ['count', 'compositions', '--n', '10', '--allowed', '1,2'], '/v1/compositions/count?n=10&allowed=1,2'],
    ['set partitions, text, kebab-case bounds', ['set-partitions', '--n', '12', '--count', '3', '--seed', 's', '--blocks', '3', '--min-block-size', '2', '--format', 'text'], '/v1/set-partitions?n=12&count=3&seed=s&blocks=3&minBlockSize=2&format=text'],
    ['set partitions, ndjson, restricted growth strings', ['set-partitions', '--n', '9', '--count', '4', '--seed', 's', '--as', 'rgs', '--format', 'ndjson'], '/v1/set-partitions?n=9&count=4&seed=s&as=rgs&format=ndjson'],
    ['count set-partitions', ['count', 'set-partitions', '--n', '30', '--max-block-size', '4'], '/v1/set-partitions/count?n=30&maxBlockSize=4'],
    ['constrained partitions, kebab-case flags', ['partitions', '--n', '30', '--count', '3', '--seed', 'k', '--max-part', '6', '--max-length', '9', '--format', 'text'], '/v1/partitions?n=30&count=3&seed=k&maxPart=6&maxLength=9&format=text'],
  ];
  for (const [name, args, path] of cases) {
    it(`${name} (runCli in-process, local and --url)`, async () => {
      const expected = await apiBody(path);
      for (const result of [await runInProcess(args), await runInProcess([...args, '--url', server.baseUrl])]) {
        expect(result).toEqual({ code: 0, stdout: expected, stderr: '' });
      }
    });
  }

  it('compositions as a child process: --n 20 --length 4 --seed demo --format text is the API body byte for byte', async () => {
    const [text, counted] = await Promise.all([
      runBin(['compositions', '--n', '20', '--length', '4', '--seed', 'demo', '--format', 'text']),
      runBin(['count', 'compositions', '--n', '10']),
    ]);
    expect(text).toEqual({ code: 0, stdout: await apiBody('/v1/compositions?n=20&length=4&seed=demo&format=text'), stderr: '' });
    expect(text.stdout.trim().split(' ').map(Number).reduce((a, b) => a + b, 0)).toBe(20);
    expect(counted).toEqual({ code: 0, stdout: await apiBody('/v1/compositions/count?n=10'), stderr: '' });
    // Compositions of 10: 2^9 = 512 (OEIS A011782).
    expect(JSON.parse(counted.stdout).count).toBe('512');
  });

  it('text with --out FILE, as a child process: the body goes to the file, nothing to stdout', async () => {
    const file = join(dir, 'samples.txt');
    const result = await runBin(['partitions', '--n', '30', '--count', '50', '--seed', 'out', '--format', 'text', '--out', file]);
    expect(result).toEqual({ code: 0, stdout: '', stderr: '' });
    expect(await readFile(file, 'utf8')).toBe(await apiBody('/v1/partitions?n=30&count=50&seed=out&format=text'));
  });

  it('json, as a child process; counts over the API limit are paged with start: JSON pages join into one document, text pages concatenate', async () => {
    const [json, text] = await Promise.all([
      runBin(['partitions', '--n', '8', '--count', '12000', '--seed', 'pages']),
      runInProcess(['partitions', '--n', '8', '--count', '12000', '--seed', 'pages', '--start', '5', '--format', 'text']),
    ]);
    expect(json.code).toBe(0);
    const doc = JSON.parse(json.stdout);
    const first = JSON.parse(await apiBody('/v1/partitions?n=8&count=10000&seed=pages'));
    const second = JSON.parse(await apiBody('/v1/partitions?n=8&count=2000&seed=pages&start=10000'));
    expect(doc).toEqual({ ...first, samples: [...first.samples, ...second.samples] });
    // Byte-level: the document is the one a single request would give, i.e. the head plus all samples.
    expect(json.stdout).toBe(`${JSON.stringify({ family: first.family, seed: 'pages', start: 0, method: first.method }).slice(0, -1)},"samples":${JSON.stringify(doc.samples)}}`);
    expect(text.code).toBe(0);
    expect(text.stdout).toBe(
      (await apiBody('/v1/partitions?n=8&count=10000&seed=pages&start=5&format=text')) + (await apiBody('/v1/partitions?n=8&count=2000&seed=pages&start=10005&format=text')),
    );
  });

  it('an unseeded paged run keeps the one seed the service drew for every page', async () => {
    const result = await runInProcess(['partitions', '--n', '9', '--count', '10001']);
    expect(result.code).toBe(0);
    const doc = JSON.parse(result.stdout);
    expect(doc.samples).toHaveLength(10001);
    const replay = JSON.parse(await apiBody(`/v1/partitions?n=9&count=1&start=10000&seed=${doc.seed}`));
    expect(doc.samples[10000]).toEqual(replay.samples[0]);
  });
});
