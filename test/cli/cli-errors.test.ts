import { spawn } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { PROJECT_ROOT } from '../edge/runtimes.js';
import { runBin, runCommand, runInProcess } from './run-bin.js';

// `script` gives the child a terminal; the terminal test is skipped where util-linux script is missing.
const hasScript = (await runCommand('sh', ['-c', 'command -v script'])).code === 0;

/** Bad command lines give one clear line on stderr, nothing on stdout and a non-zero exit. */
describe.concurrent('partsmith CLI errors, help and progress', () => {
  const bad: Array<[string, string[], number, RegExp]> = [
    ['unknown flag', ['partitions', '--n', '10', '--cout', '5'], 2, /--cout is not a flag of this command/],
    ['malformed value, named as a flag', ['partitions', '--n', '10', '--max-part', '3.5'], 2, /--max-part must be a whole number from 1 to/],
    ['missing value', ['partitions', '--n'], 2, /--n needs a value/],
    ['missing required flag', ['partitions', '--count', '3'], 2, /--n is required/],
    ['two problems at once', ['partitions', '--n', 'x', '--format', 'xml'], 2, /--n must be .*; --format must be one of: json, ndjson, text/],
    ['unknown command', ['frobnicate'], 2, /unknown command "frobnicate"/],
    ['request that cannot be served (422)', ['partitions', '--n', '10', '--seed', 'x', '--start', '1000000000000000', '--count', '2'], 1, /start \+ count - 1 must be at most/],
    ['unreachable --url', ['count', '--n', '5', '--url', 'http://127.0.0.1:9'], 1, /could not reach the service/],
    ['bad --url', ['count', '--n', '5', '--url', 'ftp://x'], 1, /--url must be an http/],
  ];
  it('a bad flag, as a child process', async () => {
    const result = await runBin(['partitions', '--n', '10', '--cout', '5']);
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toBe('partsmith partitions: --cout is not a flag of this command (see --help)\n');
  });

  for (const [name, args, code, message] of bad) {
    it(`${name} (runCli in-process)`, async () => {
      const result = await runInProcess(args);
      expect(result.code).toBe(code);
      expect(result.stdout).toBe('');
      expect(result.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(result.stderr).toMatch(message);
    });
  }

  it('--help on every command lists its flags', async () => {
    const [partitions, top, count, serve] = await Promise.all([
      runInProcess(['partitions', '--help']),
      runInProcess(['--help']),
      runInProcess(['count', '--help']),
      runInProcess(['serve', '--help']),
    ]);
    for (const result of [top, partitions, count, serve]) expect(result.code).toBe(0);
    expect(top.stdout).toMatch(/partsmith partitions/);
    for (const flag of ['--n <integer>', '--max-part <integer>', '--format json|ndjson|text', '--distinct', '--out FILE', '--url URL']) expect(partitions.stdout).toContain(flag);
    expect(count.stdout).toContain('--max-length <integer>');
    expect(count.stdout).not.toContain('--format');
    expect(serve.stdout).toContain('--port');
  });

  it('serve --port 0 answers like npm start', async () => {
    const child = spawn(`${PROJECT_ROOT}/src/cli.ts`, ['serve', '--port', '0'], {
      cwd: PROJECT_ROOT,
      env: { ...process.env, PATH: `${PROJECT_ROOT}/node_modules/.bin:${process.env.PATH}`, TSX_DISABLE_CACHE: '1' },
      detached: true,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    try {
      const url = await new Promise<string>((resolve, reject) => {
        let out = '';
        child.stdout.on('data', (c: Buffer) => {
          out += c.toString('utf8');
          const match = /listening on (http:\/\/\S+)/.exec(out);
          if (match) resolve(match[1]);
        });
        child.once('exit', (code) => reject(new Error(`serve exited with ${code}`)));
      });
      const response = await fetch(`${url}/healthz`);
      expect(response.status).toBe(200);
      expect((await response.json()).status).toBe('ok');
    } finally {
      process.kill(-child.pid!, 'SIGTERM');
    }
  });

  // A run of about 1.5 s (60 000 samples of n = 100; the bar appears after 1 s).
  const bulk = ['partitions', '--n', '100', '--count', '60000', '--seed', 'bar', '--format', 'ndjson', '--out', '/dev/null'];

  it('shows no progress bar when stderr is not a terminal', async () => {
    const result = await runInProcess(bulk);
    expect(result).toEqual({ code: 0, stdout: '', stderr: '' });
  });

  it.skipIf(!hasScript)('shows a progress bar on a terminal once the quiet period is over', async () => {
    // The quiet period is shortened so the check does not depend on how fast this machine samples.
    const command = [`PATH=${PROJECT_ROOT}/node_modules/.bin:$PATH`, 'TSX_DISABLE_CACHE=1', 'PARTSMITH_PROGRESS_AFTER_MS=0', `${PROJECT_ROOT}/src/cli.ts`, ...bulk].join(' ');
    const result = await runCommand('script', ['-qec', command, '/dev/null']);
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/\[#*\.*\] +\d+% \d+\/60000 samples/);
  });
});
