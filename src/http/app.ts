import { Hono } from 'hono';
import { PartsmithError } from '../client/errors.js';
import { LimitExceededError } from '../core/errors.js';
import { familyProblem, limitDetail } from '../library/problems.js';
import { requestContext, type Clock } from './deadline.js';
import { hardening, otherMethods, oversizedUrlProblem } from './middleware/index.js';
import type { AppContext, Endpoint } from './endpoint.js';
import { DEFAULT_LIMITS, type Limits } from './limits.js';
import { ProblemError, problemResponse } from './problem.js';
import { QueryReader } from './query.js';
import { LruCache } from './lru-cache.js';
import { compositionsCountEndpoint, compositionsEndpoint } from './routes/compositions.js';
import { healthEndpoint, openApiEndpoint } from './routes/meta.js';
import { partitionsCountEndpoint, partitionsEndpoint } from './routes/partitions.js';
import { checkEndpoint } from './routes/check.js';
import { compositionCheckEndpoint } from './routes/composition-check.js';
import { diagramEndpoint } from './routes/diagram.js';
import { PAGE_PATHS, registerPage } from './routes/page.js';
import { setPartitionsCountEndpoint, setPartitionsEndpoint } from './routes/set-partitions.js';
import { rankEndpoints } from './routes/ranks.js';
import { RankerCache } from './ranking.js';

export interface AppOptions {
  readonly limits?: Partial<Limits>;
  /** Seed for requests that give none; defaults to 16 random characters from Web Crypto. */
  readonly drawSeed?: () => string;
  /** Monotonic milliseconds for request deadlines; defaults to performance.now. */
  readonly clock?: Clock;
  /**
   * Monotonic milliseconds by which a streamed body decides when to give the event loop a turn
   * (see yield-budget.ts); defaults to performance.now. Separate from `clock`: tests drive it
   * to make every chunk end a turn, without moving any deadline.
   */
  readonly turnClock?: Clock;
  /** Where unexpected errors (answered with 500) are reported; defaults to console.error. */
  readonly logError?: (error: unknown, request: Request) => void;
}

const SEED_ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** 16 characters from a 62-letter alphabet (~95 bits); the modulo bias of 256 % 62 is irrelevant here. */
export function drawRandomSeed(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return [...bytes].map((b) => SEED_ALPHABET[b % SEED_ALPHABET.length]).join('');
}

/**
 * The partsmith HTTP app: Request -> Response, nothing runtime-specific, no state between
 * requests (only per-isolate memo tables). Node, the Workers runtime and tests all run this.
 */
export function createApp(options: AppOptions = {}): Hono {
  const context: AppContext = {
    limits: { ...DEFAULT_LIMITS, ...options.limits },
    drawSeed: options.drawSeed ?? drawRandomSeed,
    partitionFamilies: new LruCache(64),
    compositionFamilies: new LruCache(64),
    setPartitionFamilies: new LruCache(64),
    rankers: new RankerCache(),
  };
  const endpoints: Endpoint[] = [];
  endpoints.push(
    partitionsEndpoint as unknown as Endpoint,
    partitionsCountEndpoint as unknown as Endpoint,
    diagramEndpoint as unknown as Endpoint,
    checkEndpoint as unknown as Endpoint,
    compositionsEndpoint as unknown as Endpoint,
    compositionsCountEndpoint as unknown as Endpoint,
    compositionCheckEndpoint as unknown as Endpoint,
    setPartitionsEndpoint as unknown as Endpoint,
    setPartitionsCountEndpoint as unknown as Endpoint,
    ...rankEndpoints,
    healthEndpoint as unknown as Endpoint,
    openApiEndpoint(() => endpoints) as unknown as Endpoint,
  );

  const clocks = { clock: options.clock ?? (() => performance.now()), turnClock: options.turnClock };

  const app = new Hono();
  const harden = hardening();
  for (const endpoint of endpoints) {
    const other = otherMethods(endpoint.path);
    const queries = new QueryReader(endpoint.query);
    // One handler per path for every method, so Hono calls it directly (see Hardening.route).
    app.all(
      endpoint.path,
      harden.route((c) => {
        const method = c.req.method;
        if (method !== 'GET' && method !== 'HEAD') return other(c, async () => {}) as Response;
        const { query, memo } = queries.read(c.req.url);
        let response: Response | Promise<Response>;
        try {
          response = endpoint.handle(c.req.raw, query, requestContext(context, c.req.raw, clocks), memo);
        } catch (error) {
          throw familyError(error, query);
        }
        return response instanceof Promise ? response.catch((error: unknown) => Promise.reject(familyError(error, query))) : response;
      }),
    );
  }
  for (const path of PAGE_PATHS) app.use(path, harden.middleware());
  registerPage(app, context);
  // Unmatched paths pass no middleware: the URL limits are checked here (a problem response is complete).
  app.notFound((c) => problemResponse(oversizedUrlProblem(c.req.url) ?? new ProblemError(404, `There is nothing at ${new URL(c.req.url).pathname}. See /openapi.json for the endpoints.`)));
  const logError = options.logError ?? ((error: unknown, request: Request) => console.error(`500 for ${request.url}:`, error));
  app.onError((error, c) => {
    const problem = toProblem(error);
    if (problem.status >= 500 && !(error instanceof ProblemError)) logError(error, c.req.raw);
    return problemResponse(problem);
  });
  return app;
}

/** Parameters that define a family (as opposed to how many samples and in which form). */
const FAMILY_PARAMS = ['n', 'parts', 'rgs', 'distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed', 'blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize'] as const;

/**
 * An error the library or the core raised for the request's family, as the library reports it
 * (see familyProblem): a limit, or an empty family naming the family's parameters.
 */
function familyError(error: unknown, query: Record<string, unknown>): unknown {
  if (error instanceof PartsmithError) return new ProblemError(error.status, error.detail, error.errors);
  const problem = familyProblem(error, FAMILY_PARAMS.filter((param) => query[param] !== undefined));
  return problem ? new ProblemError(problem.status, problem.detail, problem.errors) : error;
}

/** Maps anything thrown while handling a request to a problem; internals never leak into the body. */
export function toProblem(error: unknown): ProblemError {
  if (error instanceof ProblemError) return error;
  if (error instanceof PartsmithError) return new ProblemError(error.status, error.detail, error.errors);
  if (error instanceof LimitExceededError) return new ProblemError(422, limitDetail(error));
  // The core raises RangeErrors (EmptyFamilyError and LimitExceededError among them) for
  // requests that are well-formed but cannot be served; their messages are written for users.
  if (error instanceof RangeError) return new ProblemError(422, error.message);
  return new ProblemError(500, 'The service failed to answer this request. Please report the URL.');
}
