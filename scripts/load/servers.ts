import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';

/** A server child process on a loopback port, started and stopped by the load script. */
export interface RunningServer {
  readonly name: string;
  readonly origin: string;
  readonly pid: number;
  stop(): Promise<void>;
}

const LOOPBACK = /^http:\/\/(127\.0\.0\.1|\[::1\]|localhost):[0-9]+$/;

/**
 * Starts `node --import tsx <script>` with PORT=0 on 127.0.0.1 and waits for its
 * "listening on http://..." line. Refuses any origin that is not loopback: the load generator
 * must never be pointed at another machine.
 */
export function startServer(name: string, script: string, env: Record<string, string> = {}): Promise<RunningServer> {
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', script], {
    env: { ...process.env, ...env, PORT: '0', HOST: '127.0.0.1', NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (chunk) => (stderr += chunk));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${name} did not start within 30 s: ${stderr}`)), 30_000);
    let stdout = '';
    child.stdout!.on('data', (chunk) => {
      stdout += chunk;
      const match = /listening on (http:\/\/\S+)/.exec(stdout);
      if (!match) return;
      clearTimeout(timer);
      if (!LOOPBACK.test(match[1])) {
        child.kill('SIGTERM');
        reject(new Error(`${name} is not on loopback (${match[1]}); refusing to load it`));
        return;
      }
      resolve({
        name,
        origin: match[1],
        pid: child.pid!,
        stop: () =>
          new Promise((done) => {
            if (child.exitCode !== null) return done();
            child.once('exit', () => done());
            child.kill('SIGTERM');
            setTimeout(() => child.kill('SIGKILL'), 5000).unref();
          }),
      });
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`${name} exited with ${code}: ${stderr}`));
    });
  });
}

/** Resident set size of a process in MB (Linux /proc), or NaN where that is not available. */
export function rssMb(pid: number): number {
  try {
    const match = /VmRSS:\s+([0-9]+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return match ? Number(match[1]) / 1024 : NaN;
  } catch {
    return NaN;
  }
}

/** Clock ticks per second of /proc/<pid>/stat's CPU times (getconf CLK_TCK; 100 on Linux). */
let clockTicks: number | undefined;

/**
 * CPU time (user + system) a process has used so far, in microseconds (Linux /proc), or NaN
 * where that is not available. Resolution: one clock tick (10 ms), so measure many requests.
 */
export function cpuUs(pid: number): number {
  try {
    clockTicks ??= Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' })) || 100;
    // The fields after the command name (which may hold spaces) start at the state, field 3.
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return ((Number(fields[11]) + Number(fields[12])) * 1e6) / clockTicks;
  } catch {
    return NaN;
  }
}
