/**
 * partsmith as a library: the same answers as the service, computed in this process.
 *
 * Each call goes through the service's own app in-process (parseQuery, the endpoint handler,
 * bodyPieces) with no server and no network, so a seed gives exactly the samples the HTTP API
 * gives, every validation rule is the API's, and errors are the API's problem documents thrown
 * as PartsmithError. Families served by the API are served here as soon as they land.
 */
import { createApp, type AppOptions } from './http/app.js';
import { PartsmithError } from './client/errors.js';
import { ndjsonRecords } from './client/ndjson.js';
import {
  toQueryString,
  type CompositionsCountParams,
  type CompositionsDocument,
  type CompositionsParams,
  type CountDocument,
  type PartitionsCountParams,
  type PartitionsDocument,
  type PartitionsParams,
  type SampleLine,
} from './client/params.js';

export { PartsmithError, type ProblemParamError } from './client/errors.js';
export type * from './client/params.js';
export type { AppOptions } from './http/app.js';

type Sampling<P> = Omit<P, 'format'>;

/** What `count` counts: partitions (default) or compositions. */
export type CountParams = (PartitionsCountParams & { kind?: 'partition' }) | (CompositionsCountParams & { kind: 'composition' });

export interface Partsmith {
  /** Like GET /v1/partitions (format=json): the same document. */
  partitions(params: Sampling<PartitionsParams>): Promise<PartitionsDocument>;
  /** Like GET /v1/compositions (format=json): the same document. */
  compositions(params: Sampling<CompositionsParams>): Promise<CompositionsDocument>;
  /** Like GET /v1/partitions/count or, with kind 'composition', /v1/compositions/count. */
  count(params: CountParams): Promise<CountDocument>;
  /** Like GET /v1/partitions with format=ndjson, one record at a time. */
  streamPartitions(params: Sampling<PartitionsParams>): AsyncGenerator<SampleLine<number[]>>;
  /** Like GET /v1/compositions with format=ndjson, one record at a time. */
  streamCompositions(params: Sampling<CompositionsParams>): AsyncGenerator<SampleLine<number[]>>;
  /**
   * The raw answer to a GET of `pathAndQuery` (e.g. "/v1/partitions?n=10&seed=a"): status,
   * headers and the body stream, exactly as the service would send them.
   */
  fetch(pathAndQuery: string, init?: RequestInit): Promise<Response>;
}

/** Origin of the in-process requests; never contacted. */
const LOCAL_ORIGIN = 'http://partsmith.local';

/** An in-process partsmith with its own app (and so its own memo tables). */
export function createPartsmith(options: AppOptions = {}): Partsmith {
  const app = createApp(options);
  const fetch = async (pathAndQuery: string, init?: RequestInit) => app.fetch(new Request(LOCAL_ORIGIN + pathAndQuery, init));

  async function ok(path: string, params: object): Promise<Response> {
    const target = path + toQueryString(params);
    const response = await fetch(target);
    if (response.status >= 200 && response.status < 300) return response;
    throw PartsmithError.fromBody(response.status, response.headers.get('content-type') ?? undefined, await response.text(), target);
  }
  async function json<T>(path: string, params: object): Promise<T> {
    return (await (await ok(path, params)).json()) as T;
  }
  async function* stream(path: string, params: object): AsyncGenerator<SampleLine<number[]>> {
    const response = await ok(path, { ...params, format: 'ndjson' });
    // Pull-based body: samples are drawn only as the records are read.
    yield* ndjsonRecords<SampleLine<number[]>>(response.body! as unknown as AsyncIterable<Uint8Array>);
  }

  return {
    partitions: (params) => json('/v1/partitions', { ...params, format: 'json' }),
    compositions: (params) => json('/v1/compositions', { ...params, format: 'json' }),
    count: ({ kind, ...params }: { kind?: string }) => json(kind === 'composition' ? '/v1/compositions/count' : '/v1/partitions/count', params),
    streamPartitions: (params) => stream('/v1/partitions', params),
    streamCompositions: (params) => stream('/v1/compositions', params),
    fetch,
  };
}

/** The instance behind the plain functions below (its memo tables fill as it is used). */
const shared: Partsmith = createPartsmith();

/** Uniformly random partitions of n, exactly as GET /v1/partitions returns them. */
export const partitions: Partsmith['partitions'] = (params) => shared.partitions(params);
/** Uniformly random compositions of n, exactly as GET /v1/compositions returns them. */
export const compositions: Partsmith['compositions'] = (params) => shared.compositions(params);
/** The exact size of a family, exactly as the count endpoints return it. */
export const count: Partsmith['count'] = (params) => shared.count(params);
/** Partitions one NDJSON record at a time. */
export const streamPartitions: Partsmith['streamPartitions'] = (params) => shared.streamPartitions(params);
/** Compositions one NDJSON record at a time. */
export const streamCompositions: Partsmith['streamCompositions'] = (params) => shared.streamCompositions(params);
