import type { z } from 'zod';
import { invalidParamsDetail, paramErrors, printableParam, type ParamError } from '../schemas/issues.js';
import { ProblemError } from './problem.js';
import { LruCache } from './lru-cache.js';

/** Longest accepted query string (characters); longer ones are refused before parsing. */
export const MAX_QUERY_LENGTH = 4096;

/**
 * Reads a query string against an endpoint's schema. Strict on purpose: a repeated parameter is
 * ambiguous and an unknown one is usually a typo (`cout=5`) that would otherwise be silently
 * ignored, so both are errors. Every problem is reported at once, each naming its parameter.
 */
export function parseQuery<S extends z.ZodType>(url: string, schema: S): z.output<S> {
  return readQuery(url, schema, (raw) => schema.safeParse(raw));
}

/**
 * Parameters that differ on nearly every request to the same family (a client drawing many
 * samples changes the seed each time). QueryReader validates them on their own.
 */
const PER_REQUEST_PARAM = 'seed';

/** How many distinct queries (without their seed) each endpoint remembers. */
const REMEMBERED_QUERIES = 256;

/**
 * A valid seed that stands in for the real one while the rest of a query is parsed: checks of
 * the whole query may depend on whether a seed is given, but not on which (see QueryReader).
 */
const SEED_STAND_IN = 'stand-in';

/**
 * `parseQuery` for one endpoint, remembering what the schema made of each query it has seen,
 * apart from the seed: a load test, or any client drawing many samples of a family, sends the
 * same query with a new seed every time. The seed is checked by the schema's own `seed` field;
 * the rest of the query by the whole schema, with a stand-in seed, once per distinct rest (up to
 * REMEMBERED_QUERIES). The answer is the schema's answer: zod checks an object's fields
 * independently, and the endpoints' checks of the whole query look at most at whether a seed is
 * given (GET /v1/partitions/diagram refuses one with parts), never at its value. Any query that
 * fails is parsed again whole, so the errors are exactly the schema's. Tested against parseQuery
 * on the fuzz corpus and well-formed queries (test/http/query.test.ts).
 *
 * Each remembered query also has a QueryMemo, handed to every request that sends it, for what
 * the endpoint derives from the query without its seed. Memory: at most REMEMBERED_QUERIES
 * entries per endpoint, each a few times the size of its query (at most MAX_QUERY_LENGTH characters).
 */
export class QueryReader<S extends z.ZodObject> {
  private readonly seedField: z.ZodType | undefined;
  /** Per distinct rest of a query: its parse with the stand-in seed (frozen: shared by every request that sends it) and its memo. */
  private readonly remembered = new LruCache<{ readonly parsed: Readonly<Record<string, unknown>>; readonly memo: QueryMemo }>(REMEMBERED_QUERIES);

  constructor(private readonly schema: S) {
    this.seedField = schema.shape[PER_REQUEST_PARAM] as z.ZodType | undefined;
  }

  /** The parsed query, and a memo shared with every request whose query differs only in its seed. */
  read(url: string): QueryAndMemo<z.output<S>> {
    let memo: QueryMemo | undefined;
    const query = readQuery(url, this.schema, (raw, repeats, plainQuery) => {
      const result = this.validate(raw, repeats, plainQuery);
      memo = result.memo;
      return result.parsed;
    });
    return { query, memo: memo ?? new QueryMemo() };
  }

  private validate(raw: Record<string, string>, repeats: boolean, plainQuery: string | undefined): { parsed: z.ZodSafeParseResult<z.output<S>>; memo?: QueryMemo } {
    const seedField = this.seedField;
    if (seedField === undefined || repeats || !Object.hasOwn(raw, PER_REQUEST_PARAM)) return { parsed: this.schema.safeParse(raw) };
    const seed = raw[PER_REQUEST_PARAM];
    const restKey = (plainQuery !== undefined ? withoutSeedPiece(plainQuery) : undefined) ?? restJson(raw);
    let entry = this.remembered.get(restKey);
    if (entry === undefined) {
      const { [PER_REQUEST_PARAM]: _seed, ...rest } = raw;
      const result = this.schema.safeParse({ ...rest, [PER_REQUEST_PARAM]: SEED_STAND_IN });
      if (!result.success) return { parsed: this.schema.safeParse(raw) };
      entry = this.remembered.set(restKey, { parsed: deepFreeze(result.data as Record<string, unknown>), memo: new QueryMemo() });
    }
    const parsedSeed = seedField.safeParse(seed);
    if (!parsedSeed.success) return { parsed: this.schema.safeParse(raw) };
    // A copy keeps the schema's key order; the seed replaces the stand-in in its place.
    const data: Record<string, unknown> = Object.assign({}, entry.parsed);
    data[PER_REQUEST_PARAM] = parsedSeed.data;
    return { parsed: { success: true, data: data as z.output<S> }, memo: entry.memo };
  }
}

/**
 * The key of a query's rest (the query without its seed) for a plain query (see plainPairs,
 * which splits it as written): the query with its one `seed=...` piece cut out. Equal keys are equal texts without
 * the seed, so they split into the same parameters (a text that differs only in empty pieces
 * gets a key of its own: a cache miss, never a wrong answer). Cutting the text cost 0.1 µs
 * where serialising the pairs without the seed cost 0.6 µs (.scratch micro-timing; the bench
 * row is http's QueryReader.read). Never starts with '{', as every restJson key does.
 * Undefined when no piece starts with `seed=` (a bare `seed`, which the schema refuses).
 */
function withoutSeedPiece(plainQuery: string): string | undefined {
  const text = `&${plainQuery}&`;
  const at = text.indexOf(SEED_PIECE);
  if (at < 0) return undefined;
  return text.slice(0, at) + text.slice(text.indexOf('&', at + 1), -1);
}

const SEED_PIECE = `&${PER_REQUEST_PARAM}=`;

/** The key of a query's rest (the query without its seed) from its decoded pairs, as JSON. */
function restJson(raw: Record<string, string>): string {
  const { [PER_REQUEST_PARAM]: _seed, ...rest } = raw;
  return JSON.stringify(rest);
}

export interface QueryAndMemo<Q> {
  readonly query: Q;
  /** Shared by every request whose query differs from this one only in its seed (see QueryMemo). */
  readonly memo: QueryMemo;
}

/**
 * Values an endpoint derives from a query without its seed (the family and its key, the ETag's
 * fixed part), kept for as long as QueryReader remembers the query. Only small values belong
 * here: samplers live in their own, smaller cache, which bounds the memory they hold.
 */
export class QueryMemo {
  private readonly values = new Map<string, unknown>();

  /** The value stored under `name`, made by `make` the first time. */
  get<T>(name: string, make: () => T): T {
    let value = this.values.get(name) as T | undefined;
    if (value === undefined) {
      value = make();
      this.values.set(name, value);
    }
    return value;
  }
}

/**
 * Splits and decodes the query of `url`, collects the parameters, and reports every problem
 * (repeats, and whatever `validate` found) at once.
 */
function readQuery<S extends z.ZodType>(
  url: string,
  schema: S,
  validate: (raw: Record<string, string>, repeats: boolean, plainQuery: string | undefined) => z.ZodSafeParseResult<z.output<S>>,
): z.output<S> {
  const queryStart = url.indexOf('?');
  const query = queryStart < 0 ? '' : url.slice(queryStart + 1);
  if (query.length > MAX_QUERY_LENGTH) {
    throw new ProblemError(414, `The query string is ${query.length} characters long; the limit is ${MAX_QUERY_LENGTH}.`);
  }
  // A plain object (zod parses it several times faster than a null-prototype one), so keys are
  // looked up with Object.hasOwn and "__proto__" is defined as an own property, never assigned.
  // (No parameter is named like an Object.prototype member, which zod would read through.)
  const raw: Record<string, string> = {};
  const errors: ParamError[] = [];
  let repeated: Set<string> | undefined;
  const plain = plainPairs(query);
  for (const [key, value] of plain ?? decodedPairs(query)) {
    if (Object.hasOwn(raw, key)) {
      repeated ??= new Set();
      if (!repeated.has(key)) errors.push({ param: printableParam(key), message: 'is given more than once; give it once' });
      repeated.add(key);
      continue;
    }
    if (key === '__proto__') Object.defineProperty(raw, key, { value, enumerable: true, writable: true, configurable: true });
    else raw[key] = value;
  }
  const result = validate(raw, repeated !== undefined, plain !== undefined ? query : undefined);
  if (!result.success) {
    errors.push(...paramErrors(result.error, (param) => Object.hasOwn(raw, param), (param) => repeated?.has(param) === true));
  }
  if (errors.length > 0) throw new ProblemError(400, invalidParamsDetail(errors), errors);
  return result.data as z.output<S>;
}

/**
 * The name/value pairs of a query string, decoded as URLSearchParams does
 * (application/x-www-form-urlencoded). A plain query — printable ASCII without '%' escapes or
 * '+' (a space), as every query partsmith's own clients write — decodes to itself, so it is
 * split directly, with the same result: pieces between '&', empty ones skipped, each split at
 * its first '=' (none: the value is '').
 */
export function queryPairs(query: string): Iterable<readonly [string, string]> {
  return plainPairs(query) ?? decodedPairs(query);
}

function plainPairs(query: string): [string, string][] | undefined {
  const pairs: [string, string][] = [];
  let start = 0; // of the current piece
  let equals = -1; // first '=' in the current piece
  for (let at = 0; at <= query.length; at++) {
    const code = at < query.length ? query.charCodeAt(at) : AMPERSAND;
    if (code === AMPERSAND) {
      if (at > start) pairs.push(equals < 0 ? [query.slice(start, at), ''] : [query.slice(start, equals), query.slice(equals + 1, at)]);
      start = at + 1;
      equals = -1;
    } else if (code === EQUALS) {
      if (equals < 0) equals = at;
    } else if (code === PERCENT || code === PLUS || code < 0x21 || code > 0x7e) {
      return undefined;
    }
  }
  return pairs;
}

function decodedPairs(query: string): Iterable<readonly [string, string]> {
  try {
    // URLSearchParams drops one leading '?' of its input; the query has none of its own to drop.
    return new URLSearchParams(query.startsWith('?') ? `?${query}` : query);
  } catch {
    throw new ProblemError(400, 'The query string could not be decoded.');
  }
}

const AMPERSAND = 0x26;
const EQUALS = 0x3d;
const PERCENT = 0x25;
const PLUS = 0x2b;

/** Freezes a parsed query and the arrays in it (a remembered answer must not be changed by a request). */
function deepFreeze<T extends Record<string, unknown>>(value: T): Readonly<T> {
  for (const field of Object.values(value)) if (typeof field === 'object' && field !== null) Object.freeze(field);
  return Object.freeze(value);
}
