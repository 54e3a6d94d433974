import { spawn } from 'node:child_process';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { Miniflare } from 'miniflare';
import { Agent, request } from 'undici';
import { createApp } from '../../src/http/app.js';
import { startServer } from '../support/server-process.js';

/**
 * The three ways partsmith runs, each reduced to "send this request, give me status, headers and
 * body bytes", so a test can hold them side by side. Servers are real processes: no mocks.
 */
export interface Answer {
  readonly status: number;
  /** Lower-case header names. */
  readonly headers: Readonly<Record<string, string>>;
  readonly body: Buffer;
}

export interface Runtime {
  readonly name: string;
  send(path: string, init?: { method?: string; headers?: Record<string, string> }): Promise<Answer>;
  close(): Promise<void>;
}

export const PROJECT_ROOT = resolve(import.meta.dirname, '../..');

const BASE = 'http://partsmith.test';

function headersOf(headers: Headers): Record<string, string> {
  const out: Record<string, string> = {};
  headers.forEach((value, key) => {
    out[key.toLowerCase()] = value;
  });
  return out;
}

/** (1) createApp().fetch, no network. */
export function inProcessRuntime(): Runtime {
  const app = createApp();
  return {
    name: 'in-process',
    async send(path, init = {}) {
      const response = await app.fetch(new Request(BASE + path, init));
      return { status: response.status, headers: headersOf(response.headers), body: Buffer.from(await response.arrayBuffer()) };
    },
    close: async () => {},
  };
}

/** (2) The Node server over HTTP, with undici and a keep-alive agent. */
export async function nodeRuntime(): Promise<Runtime> {
  const server = await startServer();
  const agent = new Agent({ keepAliveTimeout: 10_000 });
  return {
    name: 'node',
    async send(path, init = {}) {
      // The same Host as the other runtimes' URLs, so pages that print their own address agree.
      const headers = { host: new URL(BASE).host, ...init.headers };
      // reset: one connection per request. The in-process runtime shares this thread and can
      // block it for seconds (an exact count of p(50001)), so undici's idle-socket timer fires
      // late, after the server has closed the socket at its 5 s keep-alive timeout: reusing it
      // failed with "other side closed" under load.
      const response = await request(server.baseUrl + path, { method: (init.method ?? 'GET') as 'GET', headers, dispatcher: agent, reset: true });
      const answerHeaders: Record<string, string> = {};
      for (const [key, value] of Object.entries(response.headers)) {
        if (value !== undefined) answerHeaders[key.toLowerCase()] = Array.isArray(value) ? value.join(', ') : value;
      }
      return { status: response.statusCode, headers: answerHeaders, body: Buffer.from(await response.body.arrayBuffer()) };
    },
    async close() {
      await agent.close();
      await server.stop();
    },
  };
}

/** compatibility_date from wrangler.toml, so the test runs the worker exactly as configured. */
export async function compatibilityDate(): Promise<string> {
  const toml = await readFile(join(PROJECT_ROOT, 'wrangler.toml'), 'utf8');
  const match = /^compatibility_date\s*=\s*"([0-9-]+)"/m.exec(toml);
  if (!match) throw new Error('wrangler.toml has no compatibility_date');
  return match[1];
}

/**
 * Bundles the worker as `npm run worker:build` does (wrangler's dry-run deploy, offline) into a
 * temporary directory and returns the script path.
 */
export async function bundleWorker(): Promise<{ scriptPath: string; dir: string }> {
  const dir = await mkdtemp(join(tmpdir(), 'partsmith-worker-'));
  await new Promise<void>((done, reject) => {
    const child = spawn('npx', ['wrangler', 'deploy', '--dry-run', '--outdir', dir], {
      cwd: PROJECT_ROOT,
      // wrangler keeps its settings under XDG_CONFIG_HOME; keep them out of the user's home.
      env: { ...process.env, XDG_CONFIG_HOME: join(dir, 'config'), WRANGLER_SEND_METRICS: 'false', CLOUDFLARE_CF_FETCH_ENABLED: 'false' },
      detached: true,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let log = '';
    child.stdout!.on('data', (c: Buffer) => (log += c.toString('utf8')));
    child.stderr!.on('data', (c: Buffer) => (log += c.toString('utf8')));
    child.once('exit', (code) => (code === 0 ? done() : reject(new Error(`wrangler bundle failed (${code}): ${log}`))));
  });
  return { scriptPath: join(dir, 'worker.js'), dir };
}

/** (3) The bundled worker in workerd, through the Miniflare API. */
export async function workerRuntime(): Promise<Runtime> {
  const { scriptPath, dir } = await bundleWorker();
  const mf = new Miniflare({ modules: true, modulesRoot: dir, scriptPath, compatibilityDate: await compatibilityDate(), cf: false });
  await mf.ready;
  return {
    name: 'workerd',
    async send(path, init = {}) {
      const response = await mf.dispatchFetch(BASE + path, { method: init.method ?? 'GET', headers: init.headers });
      const headers: Record<string, string> = {};
      response.headers.forEach((value, key) => {
        headers[key.toLowerCase()] = value;
      });
      return { status: response.status, headers, body: Buffer.from(await response.arrayBuffer()) };
    },
    async close() {
      await mf.dispose();
      await rm(dir, { recursive: true, force: true });
    },
  };
}
