import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { createApp } from '../../src/http/app.js';
import { PROJECT_ROOT } from '../edge/runtimes.js';

export interface BinResult {
  readonly code: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

/**
 * Runs the real `partsmith` bin (src/cli.ts through its `#!/usr/bin/env tsx` line, with the
 * project's node_modules/.bin on PATH as npm exec would put it) as a child process.
 */
export function runBin(args: readonly string[], options: { cwd?: string } = {}): Promise<BinResult> {
  return runCommand(join(PROJECT_ROOT, 'src/cli.ts'), args, options.cwd);
}

export function runCommand(command: string, args: readonly string[], cwd = PROJECT_ROOT): Promise<BinResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      cwd,
      env: { ...process.env, PATH: `${join(PROJECT_ROOT, 'node_modules/.bin')}:${process.env.PATH ?? ''}`, TSX_DISABLE_CACHE: '1' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (c: Buffer) => (stdout += c.toString('utf8')));
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString('utf8')));
    child.once('error', reject);
    child.once('close', (code) => resolve({ code, stdout, stderr }));
  });
}

const app = createApp();

/** The API's body for a path and query, from the app in-process. */
export async function apiBody(pathAndQuery: string): Promise<string> {
  return (await app.fetch(new Request(`http://api${pathAndQuery}`))).text();
}

/**
 * The same CLI in this process (runCli with captured streams): for the many small cases whose
 * child-process twin is already covered, so the suite stays fast.
 */
export async function runInProcess(args: readonly string[]): Promise<BinResult> {
  const { PassThrough } = await import('node:stream');
  const { runCli } = await import('../../src/cli/main.js');
  const stdout = new PassThrough();
  const stderr = new PassThrough();
  const out: Buffer[] = [];
  const err: Buffer[] = [];
  stdout.on('data', (c: Buffer) => out.push(c));
  stderr.on('data', (c: Buffer) => err.push(c));
  const code = await runCli(args, { stdout, stderr });
  return { code, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8') };
}
