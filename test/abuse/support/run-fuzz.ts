import { checkResponse } from './check-response.js';
import { fuzzCases, type EndpointSpec } from './fuzz-queries.js';

export interface FuzzReport {
  readonly total: number;
  readonly byStatus: Record<number, number>;
  /** The first few failing cases, each with its index and what was wrong. */
  readonly failures: string[];
  readonly failureCount: number;
}

/** Every GET endpoint of the app and its query parameters, read from its OpenAPI document. */
/** Anything with a fetch handler: the app, or a wrapper around it. */
export interface Fetcher {
  fetch(request: Request): Response | Promise<Response>;
}

export async function endpointsOf(app: Fetcher): Promise<EndpointSpec[]> {
  const doc = (await (await app.fetch(new Request('http://fuzz.test/openapi.json'))).json()) as {
    paths: Record<string, { get: { parameters: { name: string }[] } }>;
  };
  return Object.entries(doc.paths).map(([path, item]) => ({ path, params: item.get.parameters.map((p) => p.name) }));
}

/** Sends `total` seeded fuzz queries to the app (to the endpoints whose path `only` accepts) and checks every response. */
export async function runFuzz(app: Fetcher, seed: string, total: number, only: (path: string) => boolean = () => true): Promise<FuzzReport> {
  const endpoints = (await endpointsOf(app)).filter((e) => only(e.path));
  const byStatus: Record<number, number> = {};
  const failures: string[] = [];
  let failureCount = 0;
  for (const fuzz of fuzzCases(seed, total, endpoints)) {
    // The URL parser normalises the query (percent-encodes spaces and non-ASCII, drops "#..."),
    // so the checks read the query exactly as the server receives it.
    const url = new URL(`http://fuzz.test${fuzz.path}?${fuzz.query}`);
    const endpoint = endpoints.find((e) => e.path === fuzz.path)!;
    let checked;
    try {
      checked = await checkResponse(endpoint, url.search.slice(1), await app.fetch(new Request(url)));
    } catch (error) {
      checked = { status: 0, violations: [`request threw ${String(error)}`] };
    }
    byStatus[checked.status] = (byStatus[checked.status] ?? 0) + 1;
    if (checked.violations.length > 0) {
      failureCount++;
      if (failures.length < 10) failures.push(`#${fuzz.index} ${fuzz.path}?${url.search.slice(1, 300)} -> ${checked.status}: ${checked.violations.join('; ')}`);
    }
  }
  return { total, byStatus, failures, failureCount };
}

/**
 * A clock that stands still: the fuzzed app's deadline never passes, so whether a case is
 * answered cannot depend on the machine's speed (the deadline has its own tests, on a driven clock).
 */
export const STILL_CLOCK = (): number => 0;
