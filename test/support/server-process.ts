import { spawn, type ChildProcess } from 'node:child_process';

export interface RunningServer {
  readonly baseUrl: string;
  readonly output: () => string;
  stop(): Promise<void>;
}

/**
 * Starts the service exactly as `npm start` does, on an ephemeral port (PORT=0), and waits for
 * the line that announces its address. The server runs in its own process group so that
 * stopping it also ends the node process that npm and tsx start beneath it.
 */
export async function startServer(extraEnv: Record<string, string> = {}, timeoutMs = 30_000): Promise<RunningServer> {
  const child: ChildProcess = spawn('npm', ['start', '--silent'], {
    cwd: new URL('../..', import.meta.url).pathname,
    env: { ...process.env, PORT: '0', HOST: '127.0.0.1', TSX_DISABLE_CACHE: '1', ...extraEnv },
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (chunk) => (output += chunk));
  child.stderr!.on('data', (chunk) => (output += chunk));
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
    try {
      process.kill(-child.pid!, 'SIGTERM');
    } catch {
      return;
    }
    const timer = setTimeout(() => {
      try {
        process.kill(-child.pid!, 'SIGKILL');
      } catch {
        /* already gone */
      }
    }, 5000);
    await exited;
    clearTimeout(timer);
  };
  const baseUrl = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start within ${timeoutMs} ms:\n${output}`)), timeoutMs);
    const check = () => {
      // The example line is printed last: once it is there, the whole banner is.
      const match = /listening on (http:\/\/\S+)/.exec(output);
      if (match && /try: curl/.test(output)) {
        clearTimeout(timer);
        resolve(match[1]);
      }
    };
    child.stdout!.on('data', check);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited with code ${code}:\n${output}`));
    });
  }).catch(async (error) => {
    await stop();
    throw error;
  });
  return { baseUrl, output: () => output, stop };
}
