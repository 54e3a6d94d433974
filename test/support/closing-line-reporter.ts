import type { Reporter, TestModule } from 'vitest/node';

/**
 * Prints one plain closing line, "N passed, N failed[, N skipped]", after vitest's own summary,
 * so that CI can read the outcome of a run without parsing vitest's output.
 */
export default class ClosingLineReporter implements Reporter {
  onTestRunEnd(testModules: ReadonlyArray<TestModule>): void {
    let passed = 0;
    let failed = 0;
    let skipped = 0;
    for (const module of testModules) {
      if (module.state() === 'failed' && [...module.children.allTests()].length === 0) failed++;
      for (const test of module.children.allTests()) {
        const state = test.result().state;
        if (state === 'passed') passed++;
        else if (state === 'failed') failed++;
        else skipped++;
      }
    }
    const tail = skipped > 0 ? `, ${skipped} skipped` : '';
    process.stdout.write(`\n${passed} passed, ${failed} failed${tail}\n`);
  }
}
