import type { z } from 'zod';
import type { CompositionSampler, PartitionSampler } from '../core/sampler.js';
import type { SampleStreams } from '../core/seeding.js';
import type { Limits } from './limits.js';
import type { LruCache } from './lru-cache.js';
import type { QueryMemo } from './query.js';
import type { RankerCache } from './ranking.js';

/** Per-isolate state and settings shared by every request (no request-to-request state). */
export interface AppContext {
  readonly limits: Limits;
  /** Draws a seed for requests that give none. */
  readonly drawSeed: () => string;
  /** Planned partition samplers (with their families' streams) by family key. */
  readonly partitionSamplers: LruCache<PlannedFamily<PartitionSampler>>;
  /** Planned composition samplers (with their families' streams) by family key. */
  readonly compositionSamplers: LruCache<PlannedFamily<CompositionSampler>>;
  /** Rankers (with their counting tables) by family key. */
  readonly rankers: RankerCache;
}

/** What is prepared once per family and reused by every request for it. */
export interface PlannedFamily<S> {
  readonly sampler: S;
  readonly streams: SampleStreams;
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
