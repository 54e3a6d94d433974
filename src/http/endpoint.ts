import type { z } from 'zod';
import type { Compositions } from '../library/compositions.js';
import type { Partitions } from '../library/partitions.js';
import type { SetPartitions } from '../library/set-partitions.js';
import type { Limits } from './limits.js';
import type { LruCache } from './lru-cache.js';
import type { QueryMemo } from './query.js';
import type { RankerCache } from './ranking.js';

/** Per-isolate state and settings shared by every request (no request-to-request state). */
export interface AppContext {
  readonly limits: Limits;
  /** Draws a seed for requests that give none. */
  readonly drawSeed: () => string;
  /**
   * The library's partition families by family key: each plans its sampler and hashes its
   * streams' prefix once, for every request for that family.
   */
  readonly partitionFamilies: LruCache<Partitions>;
  /** The library's composition families by family key. */
  readonly compositionFamilies: LruCache<Compositions>;
  /** The library's set-partition families by family key. */
  readonly setPartitionFamilies: LruCache<SetPartitions>;
  /** The library's families the rank endpoints use (with their rankers' counting tables) by family key. */
  readonly rankers: RankerCache;
}

export interface ResponseDoc {
  readonly description: string;
  readonly contentTypes: readonly string[];
}

/**
 * One GET endpoint: its path, its query schema (the single source of truth for validation,
 * types and the OpenAPI document) and its handler.
 */
export interface Endpoint<S extends z.ZodObject = z.ZodObject> {
  readonly path: string;
  readonly summary: string;
  readonly description: string;
  readonly query: S;
  readonly responses: Readonly<Record<string, ResponseDoc>>;
  /** `memo` is shared with every request whose query differs from this one only in its seed. */
  handle(request: Request, query: z.output<S>, context: AppContext, memo: QueryMemo): Promise<Response> | Response;
}

/** Keeps the schema's type attached to the handler's query argument. */
export function defineEndpoint<S extends z.ZodObject>(endpoint: Endpoint<S>): Endpoint<S> {
  return endpoint;
}
