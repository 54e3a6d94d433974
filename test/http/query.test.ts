import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import type { Endpoint } from '../../src/http/endpoint.js';
import { ProblemError } from '../../src/http/problem.js';
import { parseQuery, QueryReader, queryPairs } from '../../src/http/query.js';
import { checkEndpoint } from '../../src/http/routes/check.js';
import { compositionCheckEndpoint } from '../../src/http/routes/composition-check.js';
import { compositionsCountEndpoint, compositionsEndpoint } from '../../src/http/routes/compositions.js';
import { diagramEndpoint } from '../../src/http/routes/diagram.js';
import { partitionsCountEndpoint, partitionsEndpoint } from '../../src/http/routes/partitions.js';
import { fuzzCases } from '../abuse/support/fuzz-queries.js';

const ENDPOINTS = [
  partitionsEndpoint,
  partitionsCountEndpoint,
  compositionsEndpoint,
  compositionsCountEndpoint,
  diagramEndpoint,
  checkEndpoint,
  compositionCheckEndpoint,
] as unknown as Endpoint[];

/** What reading a query gives: the parsed value with its key order, or the problem thrown. */
function outcome(read: () => unknown): string {
  try {
    const value = read() as Record<string, unknown>;
    return JSON.stringify({ keys: Object.keys(value), value });
  } catch (error) {
    if (!(error instanceof ProblemError)) throw error;
    return JSON.stringify(error.toProblem());
  }
}

/** The fuzz corpus, and each of its queries again with other seeds (valid, invalid, repeated). */
function* corpus(total: number): Generator<{ path: string; query: string }> {
  const rng = seedrandom('partsmith-query-reader');
  const specs = ENDPOINTS.map((e) => ({ path: e.path, params: Object.keys(e.query.shape) }));
  for (const { path, query } of fuzzCases('partsmith-query-reader', total, specs)) {
    // As the server receives it: the URL parser normalises the query.
    const normalised = new URL(`http://q.test${path}?${query}`).search.slice(1);
    yield { path, query: normalised };
    const withoutSeed = normalised.split('&').filter((pair) => !pair.startsWith('seed=')).join('&');
    for (const seed of ['s-1', 's-2', `r${Math.floor(rng() * 1e6)}`, 'bad seed', '', 'x'.repeat(65)]) {
      yield { path, query: `${withoutSeed}&seed=${encodeURIComponent(seed)}` };
    }
    if (rng() < 0.1) yield { path, query: `${withoutSeed}&seed=a&seed=b` };
  }
  // Well-formed queries, in several orders, each with many seeds: the remembered path's usual case.
  const wellFormed: [string, string][] = [
    ['/v1/partitions', 'n=1000'],
    ['/v1/partitions', 'count=3&n=20&as=multiplicities&format=ndjson'],
    ['/v1/partitions', 'n=30&allowed=5,1,2,2&maxLength=9&start=4'],
    ['/v1/partitions', 'distinct=true&n=40&minPart=2'],
    ['/v1/compositions', 'n=12&length=3&allowed=1,2,3,4,5'],
    ['/v1/compositions', 'format=text&n=7'],
    ['/v1/partitions/diagram', 'n=12&index=3'],
    ['/v1/partitions/diagram', 'parts=5,4'], // refused with a seed, whatever its value
  ];
  for (const [path, query] of wellFormed) for (let i = 0; i < 40; i++) yield { path, query: i % 2 ? `seed=s${i}&${query}` : `${query}&seed=s${i}` };
}

describe('QueryReader', () => {
  it('answers exactly as parseQuery (value, key order, or problem) on 14,000 fuzzed queries, remembered or not', () => {
    // Two readers per endpoint: one sees each query once, the other twice in a row (the second
    // time from memory); both must agree with a fresh whole-schema parse every time.
    const readers = new Map(ENDPOINTS.map((e) => [e.path, new QueryReader(e.query as z.ZodObject)]));
    const schemas = new Map(ENDPOINTS.map((e) => [e.path, e.query]));
    let compared = 0;
    let accepted = 0;
    const mismatches: string[] = [];
    for (const { path, query } of corpus(1800)) {
      const url = `http://q.test${path}?${query}`;
      const expected = outcome(() => parseQuery(url, schemas.get(path)!));
      const reader = readers.get(path)!;
      for (const got of [outcome(() => reader.read(url).query), outcome(() => reader.read(url).query)]) {
        if (got !== expected && mismatches.length < 5) mismatches.push(`${url}\n  expected ${expected}\n  got      ${got}`);
      }
      compared++;
      if (expected.startsWith('{"keys"')) accepted++;
    }
    expect(mismatches).toEqual([]);
    expect(compared).toBeGreaterThan(12000);
    expect(accepted).toBeGreaterThan(800); // both sides are exercised
  });

  it('gives each request its own top-level object and shares only frozen values', () => {
    const reader = new QueryReader(partitionsEndpoint.query);
    const first = reader.read('http://q.test/v1/partitions?n=10&allowed=3,1,2&seed=a').query as Record<string, unknown>;
    const second = reader.read('http://q.test/v1/partitions?n=10&allowed=3,1,2&seed=b').query as Record<string, unknown>;
    expect(first).not.toBe(second);
    expect([first.seed, second.seed]).toEqual(['a', 'b']);
    expect(first.allowed).toEqual([1, 2, 3]);
    expect(Object.isFrozen(first.allowed)).toBe(true);
  });
});

describe('queryPairs', () => {
  it('decodes like URLSearchParams, fast path or not', () => {
    const specs = ENDPOINTS.map((e) => ({ path: e.path, params: Object.keys(e.query.shape) }));
    const samples = ['', '&', '&&a=1&&', 'a', 'a=', '=b', 'a=b=c', 'n=10&seed=x.y_z~w:v-u&allowed=1,2', 'a+b=c+d', 'a=%41%zz', 'é=ü', 'a=1;b=2'];
    for (const { query } of fuzzCases('partsmith-query-pairs', 2000, specs)) samples.push(new URL(`http://q.test/?${query}`).search.slice(1));
    // The reference is the URL's own searchParams (a leading '?' of the query is part of its first name).
    samples.push('?', '?a=1', '?%41=1');
    for (const query of samples) expect([...queryPairs(query)], query).toEqual([...new URL(`http://q.test/?${query}`).searchParams]);
  });
});
