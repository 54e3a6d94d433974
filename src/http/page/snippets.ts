import type { PageFamily } from './form.js';
import { queryString } from './form.js';

/**
 * Ready-to-copy snippets for the exact request the page made (seed included, so they replay it),
 * spelled as the real tools take them: the CLI's flags are the query parameters in kebab case
 * (maxPart -> --max-part; `distinct` a switch), the client is `partsmith/client` with one
 * method per endpoint (partitions, compositions, setPartitions). test/pictures/page-snippets.test.ts runs
 * them against the CLI and checks the client's method names.
 */
export interface Snippet {
  readonly id: string;
  readonly title: string;
  readonly language: string;
  readonly code: string;
}

/** A query parameter's CLI flag: the same rule as src/cli/flags.ts (the page may not import the CLI). */
export function flagOf(param: string): string {
  return `--${param.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;
}

export function snippetsFor(origin: string, family: PageFamily, params: readonly [string, string][]): Snippet[] {
  const curl = `curl '${origin}${family.apiPath}?${queryString(params)}'`;
  const flags = params.map(([k, v]) => (k === 'distinct' ? flagOf(k) : `${flagOf(k)} ${shellWord(v)}`)).join(' ');
  const cli = `partsmith ${family.command} ${flags}`;
  const options = params.map(([k, v]) => `${k}: ${jsValue(k, v)}`).join(', ');
  const client = [
    `import { createClient } from 'partsmith/client';`,
    ``,
    `const client = createClient({ baseUrl: '${origin}' });`,
    `const { samples } = await client.${family.clientMethod}({ ${options} });`,
  ].join('\n');
  return [
    { id: 'snippet-curl', title: 'curl', language: 'shell', code: curl },
    { id: 'snippet-cli', title: 'Command line', language: 'shell', code: cli },
    { id: 'snippet-client', title: 'JavaScript client', language: 'javascript', code: client },
  ];
}

function shellWord(value: string): string {
  return /^[A-Za-z0-9._~:,-]+$/.test(value) ? value : `'${value.replace(/'/g, `'\\''`)}'`;
}

function jsValue(key: string, value: string): string {
  if (key === 'distinct') return 'true';
  if (key === 'allowed') return `[${value.split(',').join(', ')}]`;
  if (key === 'seed') return `'${value.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;
  return /^[0-9]+$/.test(value) ? value : `'${value}'`;
}
