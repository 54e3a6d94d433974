import type { z } from 'zod';
import type { compositionsCountQuery, compositionsQuery } from '../schemas/compositions.js';
import type { partitionsCountQuery, partitionsQuery } from '../schemas/partitions.js';
import type { setPartitionsCountQuery, setPartitionsQuery } from '../schemas/set-partitions.js';
import type {
  compositionsListQuery,
  compositionsRankQuery,
  compositionsUnrankQuery,
  partitionsListQuery,
  partitionsRankQuery,
  partitionsUnrankQuery,
  setPartitionsListQuery,
  setPartitionsRankQuery,
  setPartitionsUnrankQuery,
} from '../schemas/ranks.js';

/**
 * Request parameters as typed values, derived from the endpoints' zod query schemas (the single
 * source of truth): a key is optional exactly when the schema accepts it absent (optional or
 * defaulted), and its value has the schema's output type (number, boolean, number[], a choice).
 * Query values are strings on the wire and the schemas preprocess them, so z.input alone would
 * type every number as `unknown`; the output types are what a caller means.
 */
export type ParamsOf<S extends z.ZodType> = { [K in keyof z.input<S>]: K extends keyof z.output<S> ? z.output<S>[K] : never };

export type PartitionsParams = ParamsOf<typeof partitionsQuery>;
export type PartitionsCountParams = ParamsOf<typeof partitionsCountQuery>;

export type CompositionsParams = ParamsOf<typeof compositionsQuery>;
export type CompositionsCountParams = ParamsOf<typeof compositionsCountQuery>;

export type SetPartitionsParams = ParamsOf<typeof setPartitionsQuery>;
export type SetPartitionsCountParams = ParamsOf<typeof setPartitionsCountQuery>;

export type PartitionsListParams = ParamsOf<typeof partitionsListQuery>;
export type PartitionsRankParams = ParamsOf<typeof partitionsRankQuery>;
export type PartitionsUnrankParams = ParamsOf<typeof partitionsUnrankQuery>;
export type CompositionsListParams = ParamsOf<typeof compositionsListQuery>;
export type CompositionsRankParams = ParamsOf<typeof compositionsRankQuery>;
export type CompositionsUnrankParams = ParamsOf<typeof compositionsUnrankQuery>;
export type SetPartitionsListParams = ParamsOf<typeof setPartitionsListQuery>;
export type SetPartitionsRankParams = ParamsOf<typeof setPartitionsRankQuery>;
export type SetPartitionsUnrankParams = ParamsOf<typeof setPartitionsUnrankQuery>;

/** The JSON document of a sampling endpoint (format=json). */
export interface SamplesDocument<Sample> {
  readonly family: Readonly<Record<string, unknown>> & { readonly kind: string; readonly n: number };
  readonly seed: string;
  readonly start: number;
  readonly method: string;
  readonly samples: Sample[];
}

/** A partition as parts (largest first) or as [part, multiplicity] pairs (largest part first). */
export type PartitionSample = number[] | [number, number][];
export type PartitionsDocument = SamplesDocument<PartitionSample>;
export type CompositionsDocument = SamplesDocument<number[]>;
/** A set partition as blocks (lists of items 1..n) or, with as=rgs, as its restricted growth string. */
export type SetPartitionSample = number[][] | number[];
export type SetPartitionsDocument = SamplesDocument<SetPartitionSample>;

/** One NDJSON line of a sampling endpoint. */
export interface SampleLine<Sample> {
  readonly index: number;
  /** Present for as=parts (partitions) and for compositions. */
  readonly parts?: Sample;
  /** Present for as=multiplicities. */
  readonly multiplicities?: [number, number][];
  /** Set partitions: present for as=blocks. */
  readonly blocks?: number[][];
  /** Set partitions: present for as=rgs. */
  readonly rgs?: number[];
}

/**
 * One NDJSON line of a listing (GET .../list): the member's rank (a decimal string) and the
 * member in the form asked for (`as`).
 */
export interface ListLine {
  readonly rank: string;
  /** Partitions (as=parts) and compositions. */
  readonly parts?: number[];
  /** Partitions, as=multiplicities. */
  readonly multiplicities?: [number, number][];
  /** Set partitions, as=blocks (the default). */
  readonly blocks?: number[][];
  /** Set partitions, as=rgs. */
  readonly rgs?: number[];
}

/** The document of GET .../rank: the member as given, its rank and the family's number of members (decimal strings). */
export interface RankDocument {
  readonly family: Readonly<Record<string, unknown>> & { readonly kind: string; readonly n: number };
  readonly parts?: number[];
  readonly rgs?: number[];
  readonly rank: string;
  readonly total: string;
}

/** The document of GET .../unrank: the rank, the family's number of members, and the member in the form asked for. */
export interface UnrankDocument extends Omit<ListLine, 'rank'> {
  readonly family: Readonly<Record<string, unknown>> & { readonly kind: string; readonly n: number };
  readonly rank: string;
  readonly total: string;
}

/** The document of a count endpoint; the count is a decimal string since it may exceed 2^53. */
export interface CountDocument {
  readonly family: Readonly<Record<string, unknown>> & { readonly kind: string; readonly n: number };
  readonly count: string;
}

/**
 * Writes typed parameters as a query string in the order given: lists comma-separated,
 * booleans as true/false, absent values left out. Validation is the server's (or, in-process,
 * the same schema's): nothing is checked or defaulted here, so there is one set of rules.
 */
export function toQueryString(params: object): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null) continue;
    search.append(key, Array.isArray(value) ? value.join(',') : String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : '';
}
