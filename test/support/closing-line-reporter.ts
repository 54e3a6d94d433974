import type { SerializedError } from 'vitest';
import type { Reporter, TestModule, TestRunEndReason } from 'vitest/node';

/**
 * Prints one plain closing line, "N passed, N failed[, N skipped]", after vitest's own summary,
 * so that CI can read the outcome of a run without parsing vitest's output. A file that failed
 * outside its tests (an import error, a failing beforeAll) counts as one failure even though its
 * tests are reported as skipped, and so does every unhandled error: the line never says
 * "0 failed" for a broken run.
 */
export default class ClosingLineReporter implements Reporter {
  onTestRunEnd(testModules: ReadonlyArray<TestModule>, unhandledErrors: ReadonlyArray<SerializedError>, reason: TestRunEndReason): void {
    let passed = 0;
    let failed = unhandledErrors.length;
    let skipped = 0;
    for (const module of testModules) {
      let failedHere = 0;
      for (const test of module.children.allTests()) {
        const state = test.result().state;
        if (state === 'passed') passed++;
        else if (state === 'failed') failedHere++;
        else skipped++;
      }
      if (failedHere === 0 && module.state() === 'failed') failedHere = 1;
      failed += failedHere;
    }
    if (reason === 'failed' && failed === 0) failed = 1;
    const tail = skipped > 0 ? `, ${skipped} skipped` : '';
    process.stdout.write(`\n${passed} passed, ${failed} failed${tail}\n`);
  }
}
