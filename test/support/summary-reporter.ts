// Prints the plain closing line `vitest: N passed, N failed, N skipped` that CI reads.
import type { Reporter, TestModule } from 'vitest/node';

export default class SummaryReporter implements Reporter {
  onTestRunEnd(testModules: ReadonlyArray<TestModule>, unhandledErrors: ReadonlyArray<unknown>): void {
    let passed = 0;
    let failed = 0;
    let skipped = 0;
    for (const m of testModules) {
      for (const t of m.children.allTests()) {
        const s = t.result().state;
        if (s === 'passed') passed++;
        else if (s === 'failed') failed++;
        else skipped++;
      }
      if (m.state() === 'failed' && m.children.size === 0) failed++; // a test file that failed to import
    }
    failed += unhandledErrors.length;
    process.stdout.write(`vitest: ${passed} passed, ${failed} failed, ${skipped} skipped\n`);
  }
}
