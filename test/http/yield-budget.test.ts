import { describe, expect, it } from 'vitest';
import { bodyStream } from '../../src/http/sampling.js';
import { YieldBudget, YIELD_AFTER_MS } from '../../src/http/yield-budget.js';

/** A clock the test moves by hand (no test depends on the machine's speed). */
function manualClock() {
  let now = 0;
  return { read: () => now, advance: (ms: number) => (now += ms) };
}

describe('the yield budget of a streamed body', () => {
  it('is due once the work since the last turn reached the budget, and starts again after a turn', async () => {
    const clock = manualClock();
    const budget = new YieldBudget(clock.read);
    expect(budget.due()).toBe(false);
    clock.advance(YIELD_AFTER_MS - 0.5);
    expect(budget.due()).toBe(false);
    clock.advance(0.5);
    expect(budget.due()).toBe(true);
    await budget.giveWay();
    expect(budget.due()).toBe(false);
  });

  it('lets a stream hand over chunk after chunk without a turn while the budget lasts, and give way when it is used up', async () => {
    const clock = manualClock();
    // Ten chunks of 64 KiB; the clock advances 1 ms per chunk made, so the budget runs out every few chunks.
    function* pieces() {
      for (let i = 0; i < 10; i++) {
        clock.advance(1);
        yield 'x'.repeat(64 * 1024);
      }
    }
    // Turns of the event loop are counted by an immediate that re-arms itself whenever it ran.
    let turns = 0;
    const reader = bodyStream(pieces(), { turnClock: clock.read }).getReader();
    let chunks = 0;
    let immediateSeen = false;
    setImmediate(() => (immediateSeen = true));
    for (;;) {
      const { done } = await reader.read();
      if (done) break;
      chunks++;
      if (immediateSeen) {
        turns++;
        immediateSeen = false;
        setImmediate(() => (immediateSeen = true));
      }
    }
    expect(chunks).toBe(10);
    // 10 ms of work with a budget of YIELD_AFTER_MS: a turn about every YIELD_AFTER_MS chunks, not one per chunk.
    expect(turns).toBeGreaterThanOrEqual(1);
    expect(turns).toBeLessThanOrEqual(Math.ceil(10 / YIELD_AFTER_MS));
  });
});
