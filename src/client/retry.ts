/**
 * When and how long to wait before trying a request again. Only failures that say nothing about
 * the request itself are retried: the connection failed before an answer arrived, or the server
 * said "too many requests" (429) or "unavailable" (503). Every other 4xx is the caller's to fix,
 * and retrying a 5xx other than 503 would only repeat the failure.
 */

/** Error codes of Node and undici that mean the connection failed or was lost before an answer. */
const CONNECTION_CODES = new Set([
  'ECONNRESET',
  'ECONNREFUSED',
  'ECONNABORTED',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'EAI_AGAIN',
  'UND_ERR_SOCKET',
  'UND_ERR_CLOSED',
  'UND_ERR_CONNECT_TIMEOUT',
]);

export function isConnectionError(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && CONNECTION_CODES.has(code)) return true;
  }
  return false;
}

export const RETRYABLE_STATUSES: ReadonlySet<number> = new Set([429, 503]);

/**
 * "Full jitter" exponential backoff: a uniform delay in [0, min(cap, base * 2^attempt)), so
 * many load-test workers that failed together do not retry together (common practice; see the
 * AWS Architecture Blog, "Exponential Backoff And Jitter", 2015).
 */
export function backoffDelay(attempt: number, baseMs: number, capMs: number, random: () => number = Math.random): number {
  return Math.floor(random() * Math.min(capMs, baseMs * 2 ** attempt));
}

/** Retry-After in milliseconds (delta-seconds or an HTTP date, RFC 9110 §10.2.3), or undefined. */
export function parseRetryAfter(value: string | string[] | undefined, now: number = Date.now()): number | undefined {
  const text = Array.isArray(value) ? value[0] : value;
  if (text === undefined) return undefined;
  if (/^\s*\d+\s*$/.test(text)) return Number(text) * 1000;
  const date = Date.parse(text);
  return Number.isNaN(date) ? undefined : Math.max(0, date - now);
}

/** Waits, but stops early (rejecting with the signal's reason) when the signal aborts. */
export function sleep(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(signal.reason);
    const onAbort = () => {
      clearTimeout(timer);
      reject(signal!.reason);
    };
    const timer = setTimeout(() => {
      signal?.removeEventListener('abort', onAbort);
      resolve();
    }, ms);
    signal?.addEventListener('abort', onAbort, { once: true });
  });
}
