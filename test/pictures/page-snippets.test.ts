import { describe, expect, it } from 'vitest';
import * as clientModule from 'partsmith/client';
import { flagOf as cliFlagOf } from '../../src/cli/flags.js';
import { PAGE_FAMILIES, readForm } from '../../src/http/page/form.js';
import { flagOf, snippetsFor } from '../../src/http/page/snippets.js';
import { apiBody, runInProcess } from '../cli/run-bin.js';

/**
 * The page's snippets are what the real tools take: the CLI line, run by the real CLI, prints
 * the body of the curl URL; the client snippet imports an existing module and calls an existing
 * method with the query's parameters.
 */
const ORIGIN = 'http://partsmith.test';

function snippets(search: string) {
  const form = readForm(new URL(`${ORIGIN}/?${search}`));
  expect(form.errors).toEqual({});
  // As the page passes them: the seed last.
  const params = [...form.apiParams.filter(([k]) => k !== 'seed'), ...form.apiParams.filter(([k]) => k === 'seed')];
  const [curl, cli, client] = snippetsFor(ORIGIN, form.family, params);
  return { curl: curl.code, cli: cli.code, client: client.code };
}

describe('page snippets', () => {
  const cases = [
    'family=partitions&n=30&count=3&seed=s&distinct=true&maxPart=12',
    'family=partitions&n=40&count=2&seed=s&minPart=2&maxLength=8&allowed=2,3,5,7',
    'family=compositions&n=12&count=4&seed=s',
    'family=compositions&n=9&count=3&seed=s&minPart=0&maxPart=4&length=3',
    'family=compositions&n=15&count=2&seed=s&allowed=1,3,4',
    'family=set-partitions&n=9&count=3&seed=s&blocks=3&minBlockSize=2',
    'family=set-partitions&n=12&count=2&seed=s&maxBlocks=4&maxBlockSize=5',
  ];
  for (const search of cases) {
    it(`the CLI line prints the curl URL's body: ${search}`, async () => {
      const { curl, cli } = snippets(search);
      const url = new URL(/'([^']+)'/.exec(curl)![1]);
      const args = cli.split(' ').slice(1);
      expect(await runInProcess(args)).toEqual({ code: 0, stdout: await apiBody(url.pathname + url.search), stderr: '' });
    });
  }

  it('uses the CLI flag spelling (kebab case) for every parameter', () => {
    for (const param of ['n', 'count', 'seed', 'distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed', 'blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize']) expect(flagOf(param)).toBe(cliFlagOf(param));
  });

  it('the client snippet imports partsmith/client and calls a method the client has', async () => {
    const client = clientModule.createClient({ baseUrl: ORIGIN });
    for (const family of PAGE_FAMILIES) {
      const setPartitions = family.kind === 'set-partition';
      const { client: code } = snippets(`family=${family.value}&n=10&count=2&seed=s&${setPartitions ? 'maxBlockSize=2' : 'allowed=1,2'}`);
      expect(code).toContain(`import { createClient } from 'partsmith/client';`);
      const method = /await client\.(\w+)\(/.exec(code)![1];
      expect(typeof (client as unknown as Record<string, unknown>)[method], method).toBe('function');
      expect(code).toContain(`client.${method}({ n: 10, count: 2, ${setPartitions ? 'maxBlockSize: 2' : 'allowed: [1, 2]'}, seed: 's' })`);
    }
    await client.close();
  });
});
