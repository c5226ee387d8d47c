import type { Reporter, TestModule } from 'vitest/node';

/** Prints one closing line CI can read: `N passed, N failed` (and `, N skipped`). */
export default class CountReporter implements Reporter {
  onTestRunEnd(testModules: ReadonlyArray<TestModule>, unhandledErrors: ReadonlyArray<unknown>) {
    let passed = 0;
    let failed = unhandledErrors.length;
    let skipped = 0;
    for (const mod of testModules) {
      if (mod.state() === 'failed' && [...mod.children.allTests()].length === 0) failed += 1;
      for (const test of mod.children.allTests()) {
        const state = test.result().state;
        if (state === 'passed') passed += 1;
        else if (state === 'failed') failed += 1;
        else skipped += 1;
      }
    }
    const tail = skipped > 0 ? `, ${skipped} skipped` : '';
    process.stdout.write(`\n${passed} passed, ${failed} failed${tail}\n`);
  }
}
