import type { PageFamily } from './form.js';
import { queryString } from './form.js';

/**
 * Ready-to-copy snippets for the exact request the page made (seed included, so they replay it).
 * TODO(cli, client): flag and option spellings follow the query parameters one to one; align
 * them with the CLI and client once those are merged.
 */
export interface Snippet {
  readonly id: string;
  readonly title: string;
  readonly language: string;
  readonly code: string;
}

export function snippetsFor(origin: string, family: PageFamily, params: readonly [string, string][]): Snippet[] {
  const curl = `curl '${origin}${family.apiPath}?${queryString(params)}'`;
  const flags = params.map(([k, v]) => (k === 'distinct' ? `--${k}` : `--${k} ${shellWord(v)}`)).join(' ');
  const cli = `partsmith ${family.command} ${flags}`;
  const options = params.map(([k, v]) => `${k}: ${jsValue(k, v)}`).join(', ');
  const client = [
    `import { createClient } from 'partsmith';`,
    ``,
    `const client = createClient({ baseUrl: '${origin}' });`,
    `const { samples } = await client.${family.command}({ ${options} });`,
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
  if (key === 'seed') return `'${value}'`;
  return /^[0-9]+$/.test(value) ? value : `'${value}'`;
}
