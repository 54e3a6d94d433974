/**
 * When a streamed body lets the event loop run other work. Node's writer asks for the next
 * chunk from a promise callback for as long as the socket takes data (megabytes on loopback),
 * so a stream that never gave way would keep other requests, and the close event of a client
 * that went away, waiting until the body is done. Giving way after every chunk costs a timer
 * per chunk instead (setTimeout(0) waits at least 1 ms: a 1.7 MB body spent a third of its
 * wall time idle). So the stream measures its own work and gives way once it has run for
 * YIELD_AFTER_MS since it last did.
 *
 * The clock here only decides when other work gets a turn, never what is written: it is
 * performance.now (present in Node and Workers) unless the app is given a turn clock
 * (AppOptions.turnClock), its own, apart from the deadline's clock.
 */
export const YIELD_AFTER_MS = 4;

export class YieldBudget {
  private since: number;

  constructor(
    private readonly clock: () => number = () => performance.now(),
    private readonly afterMs: number = YIELD_AFTER_MS,
  ) {
    this.since = clock();
  }

  /** Whether the work since the last turn used up the budget. */
  due(): boolean {
    return this.clock() - this.since >= this.afterMs;
  }

  /** Lets pending I/O events (new requests, closed sockets, timers) run, then starts a new budget. */
  async giveWay(): Promise<void> {
    await nextMacrotask();
    this.since = this.clock();
  }
}

/**
 * Resolves after the event loop has processed pending I/O: setImmediate where it exists (Node:
 * right after the poll phase, no minimum delay), otherwise setTimeout(0) (Workers).
 */
function nextMacrotask(): Promise<void> {
  const immediate = (globalThis as { setImmediate?: (callback: () => void) => unknown }).setImmediate;
  return new Promise((resolve) => (immediate ? immediate(resolve) : setTimeout(resolve, 0)));
}
