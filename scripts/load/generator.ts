import { Pool } from 'undici';

/**
 * A closed-loop HTTP load generator on undici: `connections` keep-alive connections, each with
 * one request in flight at a time, for at most `durationMs` and at most `maxRequests`.
 */
export interface LoadPhase {
  readonly origin: string;
  readonly connections: number;
  readonly durationMs: number;
  readonly maxRequests: number;
  /** The i-th request: its path and the statuses that count as correct for it. */
  readonly request: (i: number) => { readonly path: string; readonly ok: (status: number) => boolean };
}

export interface LoadResult {
  readonly requests: number;
  readonly errors: number;
  readonly seconds: number;
  readonly requestsPerSecond: number;
  readonly p50Ms: number;
  readonly p99Ms: number;
  readonly bytes: number;
  /** First few error descriptions, for the report. */
  readonly errorSamples: string[];
  /** Every latency in ms, sorted. */
  readonly latencies: Float64Array;
}

/** Several runs of the same phase (e.g. interleaved slices) as one result. */
export function mergeResults(results: readonly LoadResult[]): LoadResult {
  const latencies = new Float64Array(results.reduce((sum, r) => sum + r.latencies.length, 0));
  let offset = 0;
  for (const r of results) {
    latencies.set(r.latencies, offset);
    offset += r.latencies.length;
  }
  latencies.sort();
  const requests = results.reduce((sum, r) => sum + r.requests, 0);
  const seconds = results.reduce((sum, r) => sum + r.seconds, 0);
  return {
    requests,
    errors: results.reduce((sum, r) => sum + r.errors, 0),
    seconds,
    requestsPerSecond: requests / seconds,
    p50Ms: quantile(latencies, 0.5),
    p99Ms: quantile(latencies, 0.99),
    bytes: results.reduce((sum, r) => sum + r.bytes, 0),
    errorSamples: results.flatMap((r) => r.errorSamples).slice(0, 3),
    latencies,
  };
}

function quantile(sorted: Float64Array, q: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
}

export async function runLoad(phase: LoadPhase): Promise<LoadResult> {
  const pool = new Pool(phase.origin, { connections: phase.connections, pipelining: 1, keepAliveTimeout: 10_000 });
  const latencies = new Float64Array(phase.maxRequests);
  let issued = 0;
  let completed = 0;
  let errors = 0;
  let bytes = 0;
  const errorSamples: string[] = [];
  const started = performance.now();
  const stopAt = started + phase.durationMs;

  async function worker(): Promise<void> {
    while (performance.now() < stopAt && issued < phase.maxRequests) {
      const i = issued++;
      const { path, ok } = phase.request(i);
      const t0 = performance.now();
      try {
        const response = await pool.request({ path, method: 'GET' });
        const body = await response.body.arrayBuffer();
        bytes += body.byteLength;
        if (!ok(response.statusCode)) {
          errors++;
          if (errorSamples.length < 3) errorSamples.push(`${response.statusCode} ${path.slice(0, 80)} ${Buffer.from(body).toString('utf8', 0, 160)}`);
        }
      } catch (error) {
        errors++;
        if (errorSamples.length < 3) errorSamples.push(`${String(error)} ${path.slice(0, 80)}`);
      }
      latencies[completed++] = performance.now() - t0;
    }
  }

  await Promise.all(Array.from({ length: phase.connections }, worker));
  const seconds = (performance.now() - started) / 1000;
  await pool.close();
  const sorted = latencies.slice(0, completed).sort();
  return {
    requests: completed,
    errors,
    seconds,
    requestsPerSecond: completed / seconds,
    p50Ms: quantile(sorted, 0.5),
    p99Ms: quantile(sorted, 0.99),
    bytes,
    errorSamples,
    latencies: sorted,
  };
}
