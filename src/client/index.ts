import { Agent, request, type Dispatcher } from 'undici';
import { PartsmithError } from './errors.js';
import { ndjsonRecords } from './ndjson.js';
import {
  toQueryString,
  type CompositionsCountParams,
  type CompositionsDocument,
  type CompositionsParams,
  type CompositionsListParams,
  type CompositionsRankParams,
  type CompositionsUnrankParams,
  type CountDocument,
  type ListLine,
  type PartitionsCountParams,
  type PartitionsDocument,
  type PartitionsListParams,
  type PartitionsParams,
  type PartitionsRankParams,
  type PartitionsUnrankParams,
  type RankDocument,
  type SampleLine,
  type SetPartitionsCountParams,
  type SetPartitionsDocument,
  type SetPartitionsListParams,
  type SetPartitionsParams,
  type SetPartitionsRankParams,
  type SetPartitionsUnrankParams,
  type UnrankDocument,
} from './params.js';
import { backoffDelay, isConnectionError, parseRetryAfter, RETRYABLE_STATUSES, sleep } from './retry.js';

export { PartsmithError, type ProblemParamError } from './errors.js';
export type * from './params.js';
export { toQueryString } from './params.js';

export interface ClientOptions {
  /** Where the service runs, e.g. "http://127.0.0.1:8787" or "https://partsmith.example.workers.dev". */
  readonly baseUrl: string;
  /** Longest wait for an answer to start, and for each further piece of a body. Default 30 000. */
  readonly timeoutMs?: number;
  /** Further attempts after a connection error, a 429 or a 503. Default 3. */
  readonly retries?: number;
  /** First backoff step (doubled each attempt, fully jittered). Default 100. */
  readonly retryBaseMs?: number;
  /** Longest backoff between attempts. Default 5 000. */
  readonly retryMaxMs?: number;
  /** A Retry-After longer than this is not waited for: the error is thrown instead. Default 60 000. */
  readonly maxRetryAfterMs?: number;
  /** An undici dispatcher (Agent, Pool, ProxyAgent, MockAgent...). Default: a keep-alive Agent owned by the client. */
  readonly dispatcher?: Dispatcher;
  /** Extra request headers, e.g. a user-agent or an authorization header for a gateway. */
  readonly headers?: Readonly<Record<string, string>>;
}

export interface CallOptions {
  /** Aborts the request, a pending retry wait, or a stream being read. */
  readonly signal?: AbortSignal;
}

/** Parameters of a sampling or listing call that picks its own format. */
type Sampling<P> = Omit<P, 'format'>;

/** Ranks (rank, start) may be given as BigInts too: they travel as decimal strings. */
type Ranked<P> = { [K in keyof P]: K extends 'rank' | 'start' ? P[K] | bigint : P[K] };

export interface HealthDocument {
  readonly status: 'ok';
  readonly version: string;
  readonly algorithmVersion: number;
}

export interface PartsmithClient {
  /** GET /v1/partitions as one JSON document. */
  partitions(params: Sampling<PartitionsParams>, options?: CallOptions): Promise<PartitionsDocument>;
  /** GET /v1/partitions as NDJSON, one record per sample, read incrementally. */
  streamPartitions(params: Sampling<PartitionsParams>, options?: CallOptions): AsyncGenerator<SampleLine<number[]>>;
  /** GET /v1/partitions/count. */
  countPartitions(params: PartitionsCountParams, options?: CallOptions): Promise<CountDocument>;
  /** GET /v1/compositions as one JSON document. */
  compositions(params: Sampling<CompositionsParams>, options?: CallOptions): Promise<CompositionsDocument>;
  /** GET /v1/compositions as NDJSON, read incrementally. */
  streamCompositions(params: Sampling<CompositionsParams>, options?: CallOptions): AsyncGenerator<SampleLine<number[]>>;
  /** GET /v1/compositions/count. */
  countCompositions(params: CompositionsCountParams, options?: CallOptions): Promise<CountDocument>;
  /** GET /v1/set-partitions as one JSON document. */
  setPartitions(params: Sampling<SetPartitionsParams>, options?: CallOptions): Promise<SetPartitionsDocument>;
  /** GET /v1/set-partitions as NDJSON, read incrementally (records carry `blocks`, or `rgs` with as=rgs). */
  streamSetPartitions(params: Sampling<SetPartitionsParams>, options?: CallOptions): AsyncGenerator<SampleLine<number[]>>;
  /** GET /v1/set-partitions/count. */
  countSetPartitions(params: SetPartitionsCountParams, options?: CallOptions): Promise<CountDocument>;
  /**
   * GET /v1/partitions/list as NDJSON: the members from rank `start` (default 0), `count` of them
   * (default 1,000; at most the server's count limit, so page with start), each with its rank,
   * read incrementally.
   */
  listPartitions(params: Ranked<Sampling<PartitionsListParams>>, options?: CallOptions): AsyncGenerator<ListLine>;
  /** GET /v1/partitions/rank: the rank of `parts` (a decimal string); a non-member is a 422 PartsmithError naming parts. */
  rankPartition(params: PartitionsRankParams, options?: CallOptions): Promise<RankDocument>;
  /** GET /v1/partitions/unrank: the member at `rank` (a BigInt, or a decimal string). */
  unrankPartition(params: Ranked<PartitionsUnrankParams>, options?: CallOptions): Promise<UnrankDocument>;
  /** GET /v1/compositions/list as NDJSON, read incrementally. */
  listCompositions(params: Ranked<Sampling<CompositionsListParams>>, options?: CallOptions): AsyncGenerator<ListLine>;
  /** GET /v1/compositions/rank. */
  rankComposition(params: CompositionsRankParams, options?: CallOptions): Promise<RankDocument>;
  /** GET /v1/compositions/unrank. */
  unrankComposition(params: Ranked<CompositionsUnrankParams>, options?: CallOptions): Promise<UnrankDocument>;
  /** GET /v1/set-partitions/list as NDJSON, read incrementally (records carry `blocks`, or `rgs` with as=rgs). */
  listSetPartitions(params: Ranked<Sampling<SetPartitionsListParams>>, options?: CallOptions): AsyncGenerator<ListLine>;
  /** GET /v1/set-partitions/rank: the rank of a set partition given as its restricted growth string `rgs`. */
  rankSetPartition(params: SetPartitionsRankParams, options?: CallOptions): Promise<RankDocument>;
  /** GET /v1/set-partitions/unrank. */
  unrankSetPartition(params: Ranked<SetPartitionsUnrankParams>, options?: CallOptions): Promise<UnrankDocument>;
  /** GET /healthz. */
  health(options?: CallOptions): Promise<HealthDocument>;
  /** GET /openapi.json. */
  openapi(options?: CallOptions): Promise<Record<string, unknown>>;
  /**
   * Any GET, with the same retries and error handling; the body is left unread (a stream of
   * bytes) for callers that want the service's exact bytes, such as the CLI. 2xx and 304 only:
   * other statuses throw PartsmithError.
   */
  get(path: string, params?: object, options?: CallOptions & { headers?: Record<string, string> }): Promise<Dispatcher.ResponseData>;
  /** Closes the client's own connections (not those of a dispatcher passed in). */
  close(): Promise<void>;
}

export function createClient(options: ClientOptions): PartsmithClient {
  const base = new URL(options.baseUrl.endsWith('/') ? options.baseUrl : `${options.baseUrl}/`);
  if (base.protocol !== 'http:' && base.protocol !== 'https:') throw new RangeError(`baseUrl must be an http or https URL, got ${options.baseUrl}`);
  const timeoutMs = options.timeoutMs ?? 30_000;
  const retries = options.retries ?? 3;
  const retryBaseMs = options.retryBaseMs ?? 100;
  const retryMaxMs = options.retryMaxMs ?? 5_000;
  const maxRetryAfterMs = options.maxRetryAfterMs ?? 60_000;
  for (const [name, value] of Object.entries({ timeoutMs, retries, retryBaseMs, retryMaxMs, maxRetryAfterMs })) {
    if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be a non-negative number, got ${value}`);
  }
  // Keep-alive: load tests make many small requests to one origin; reusing sockets saves a
  // TCP (and TLS) handshake per request.
  const ownAgent = options.dispatcher ? undefined : new Agent({ keepAliveTimeout: 30_000, keepAliveMaxTimeout: 600_000, connections: 32 });
  const dispatcher = options.dispatcher ?? ownAgent!;

  async function get(path: string, params: object = {}, call: CallOptions & { headers?: Record<string, string> } = {}): Promise<Dispatcher.ResponseData> {
    const target = path.replace(/^\//, '') + toQueryString(params);
    const url = new URL(target, base);
    for (let attempt = 0; ; attempt++) {
      let response: Dispatcher.ResponseData;
      try {
        response = await request(url, {
          method: 'GET',
          dispatcher,
          signal: call.signal,
          headersTimeout: timeoutMs,
          bodyTimeout: timeoutMs,
          headers: { accept: '*/*', ...options.headers, ...call.headers },
        });
      } catch (error) {
        if (call.signal?.aborted || attempt >= retries || !isConnectionError(error)) throw error;
        await sleep(backoffDelay(attempt, retryBaseMs, retryMaxMs), call.signal);
        continue;
      }
      const status = response.statusCode;
      if ((status >= 200 && status < 300) || status === 304) return response;
      const contentType = response.headers['content-type'];
      const body = await response.body.text();
      const error = PartsmithError.fromBody(status, Array.isArray(contentType) ? contentType[0] : contentType, body, `/${target}`);
      if (attempt < retries && RETRYABLE_STATUSES.has(status)) {
        const retryAfter = parseRetryAfter(response.headers['retry-after']);
        if (retryAfter === undefined || retryAfter <= maxRetryAfterMs) {
          await sleep(retryAfter ?? backoffDelay(attempt, retryBaseMs, retryMaxMs), call.signal);
          continue;
        }
      }
      throw error;
    }
  }

  async function json<T>(path: string, params: object, call?: CallOptions): Promise<T> {
    const response = await get(path, params, call);
    return (await response.body.json()) as T;
  }

  async function* stream<Line = SampleLine<number[]>>(path: string, params: object, call?: CallOptions): AsyncGenerator<Line> {
    const response = await get(path, { ...params, format: 'ndjson' }, call);
    // Leaving the loop early (break, throw) returns this generator, which closes the body.
    yield* ndjsonRecords<Line>(response.body);
  }

  return {
    partitions: (params, call) => json('/v1/partitions', { ...params, format: 'json' }, call),
    streamPartitions: (params, call) => stream('/v1/partitions', params, call),
    countPartitions: (params, call) => json('/v1/partitions/count', params, call),
    compositions: (params, call) => json('/v1/compositions', { ...params, format: 'json' }, call),
    streamCompositions: (params, call) => stream('/v1/compositions', params, call),
    countCompositions: (params, call) => json('/v1/compositions/count', params, call),
    setPartitions: (params, call) => json('/v1/set-partitions', { ...params, format: 'json' }, call),
    streamSetPartitions: (params, call) => stream('/v1/set-partitions', params, call),
    countSetPartitions: (params, call) => json('/v1/set-partitions/count', params, call),
    listPartitions: (params, call) => stream<ListLine>('/v1/partitions/list', params, call),
    rankPartition: (params, call) => json('/v1/partitions/rank', params, call),
    unrankPartition: (params, call) => json('/v1/partitions/unrank', params, call),
    listCompositions: (params, call) => stream<ListLine>('/v1/compositions/list', params, call),
    rankComposition: (params, call) => json('/v1/compositions/rank', params, call),
    unrankComposition: (params, call) => json('/v1/compositions/unrank', params, call),
    listSetPartitions: (params, call) => stream<ListLine>('/v1/set-partitions/list', params, call),
    rankSetPartition: (params, call) => json('/v1/set-partitions/rank', params, call),
    unrankSetPartition: (params, call) => json('/v1/set-partitions/unrank', params, call),
    health: (call) => json('/healthz', {}, call),
    openapi: (call) => json('/openapi.json', {}, call),
    get,
    async close() {
      await ownAgent?.close();
    },
  };
}
