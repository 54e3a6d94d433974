import type { Limits } from './limits.js';

/**
 * A monotonic clock in milliseconds, injected by the entry point (`performance.now` in Node) so
 * the app never reads the time itself and tests can drive it. Only differences are used.
 */
export type Clock = () => number;

/** Why a running request stopped before it was done. */
export type StopReason = 'deadline' | 'disconnected';

/**
 * Thrown between two samples when a request must stop: its deadline passed, or the client went
 * away. Sampling is cooperative — the loop asks `Deadline.check()` before every sample — so a
 * request stops at most one sample's work after the event, whatever the runtime.
 */
export class RequestStopped extends Error {
  constructor(
    readonly reason: StopReason,
    /** Samples finished before the stop. */
    readonly produced: number,
    readonly budgetMs: number,
  ) {
    super(reason === 'deadline' ? `deadline of ${budgetMs} ms passed after ${produced} samples` : `client disconnected after ${produced} samples`);
    this.name = 'RequestStopped';
  }
}

/**
 * Requests younger than this never look at their AbortSignal: in Node, creating a request's
 * signal costs about as much as answering a small request, and a client that goes away within
 * a few milliseconds costs nothing worth saving.
 */
export const SIGNAL_AFTER_MS = 5;

/**
 * The time budget of one request, started when the request arrives. It also watches the
 * request's AbortSignal (aborted by the server when the client disconnects), so one check
 * covers both reasons to stop. The signal is fetched lazily, once the request has run for
 * SIGNAL_AFTER_MS.
 */
export class Deadline {
  readonly startedAt: number;
  readonly at: number;
  private signal: AbortSignal | undefined;

  constructor(
    private readonly clock: Clock,
    readonly budgetMs: number,
    private readonly signalOf?: () => AbortSignal | undefined,
  ) {
    this.startedAt = clock();
    this.at = this.startedAt + budgetMs;
  }

  /** The reason to stop now, if there is one. Costs one clock read. */
  stopReason(): StopReason | undefined {
    const now = this.clock();
    if (now - this.startedAt >= SIGNAL_AFTER_MS && this.signalOf) {
      this.signal ??= this.signalOf();
      if (this.signal?.aborted) return 'disconnected';
    }
    if (now >= this.at) return 'deadline';
    return undefined;
  }

  /** Throws RequestStopped when the request must stop; `produced` is reported in the error. */
  check(produced: number): void {
    const reason = this.stopReason();
    if (reason) throw new RequestStopped(reason, produced, this.budgetMs);
  }

  /** Seconds a client should wait before retrying a request that ran out of time. */
  retryAfterSeconds(): number {
    return Math.max(1, Math.ceil(this.budgetMs / 1000));
  }
}

/**
 * The limits of one running request: the configured limits plus that request's deadline. The
 * app builds one per request, so the sampling code reaches the deadline through the `limits`
 * it already receives.
 */
export interface RequestLimits extends Limits {
  readonly deadline: Deadline;
  /**
   * The clock of a streamed body's yield budget (see yield-budget.ts): it decides when the
   * event loop gets a turn, never what is written. Separate from the deadline's clock, so a
   * test can drive one without moving the other.
   */
  readonly turnClock?: Clock;
}

/** The running request's deadline, when the limits carry one (they do inside the app). */
export function deadlineOf(limits: Limits): Deadline | undefined {
  const deadline = (limits as Partial<RequestLimits>).deadline;
  return deadline instanceof Deadline ? deadline : undefined;
}

/** The clock of the running request's yield budget, when the app was given one. */
export function turnClockOf(limits: Limits): Clock | undefined {
  return (limits as Partial<RequestLimits>).turnClock;
}

/** The clocks a request is timed by: its deadline's, and (optionally) its yield budget's. */
export interface RequestClocks {
  readonly clock: Clock;
  readonly turnClock?: Clock;
}

/** The context of one request: the app's context with limits that carry a fresh deadline. */
export function requestContext<C extends { readonly limits: Limits }>(context: C, request: Request, clocks: RequestClocks): C {
  const deadline = new Deadline(clocks.clock, context.limits.deadlineMs, () => request.signal);
  const timing: Pick<RequestLimits, 'deadline' | 'turnClock'> = clocks.turnClock ? { deadline, turnClock: clocks.turnClock } : { deadline };
  // Object.assign rather than spreads: the same copies, measured 3x faster on this per-request path.
  return Object.assign({}, context, { limits: Object.assign({}, context.limits, timing) });
}
