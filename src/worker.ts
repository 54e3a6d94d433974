import type { Hono } from 'hono';
import { createApp } from './http/app.js';
import { ConfigurationError, limitsFromEnvironment } from './http/limits.js';
import { ProblemError, problemResponse } from './http/problem.js';

/**
 * Workers runtime entry point: the same app, one instance per isolate, created on the first
 * request because the `env` bindings (PARTSMITH_* limits, set in wrangler.toml [vars]) arrive
 * with it. A bad setting is logged and every request gets a 500 until it is fixed.
 * Note: in Workers the clock only advances across I/O, so the deadline rarely fires there; the
 * runtime's own CPU limit is the backstop.
 */
let app: Hono | undefined;

export default {
  fetch(request: Request, env: Record<string, unknown> = {}, executionContext?: unknown): Response | Promise<Response> {
    if (!app) {
      try {
        app = createApp({ limits: limitsFromEnvironment(env) });
      } catch (error) {
        if (!(error instanceof ConfigurationError)) throw error;
        console.error(`partsmith: ${error.message}`);
        return problemResponse(new ProblemError(500, 'The service is misconfigured; its operator has been told.'));
      }
    }
    return app.fetch(request, env, executionContext as never);
  },
};
