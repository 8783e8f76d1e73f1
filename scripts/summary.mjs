// Reads vitest's JSON report and prints the plain summary line CI reads: `N passed, N failed`.
// A suite that failed to load counts as a failure; skipped tests are named, never hidden.
import { readFileSync, existsSync } from 'node:fs';

const file = process.argv[2];
if (!existsSync(file)) {
  console.log('vitest wrote no report');
  console.log('0 passed, 1 failed');
  process.exit(1);
}
const report = JSON.parse(readFileSync(file, 'utf8'));
let passed = 0;
let failed = 0;
let skipped = 0;
for (const suite of report.testResults ?? []) {
  const tests = suite.assertionResults ?? [];
  if (suite.status === 'failed' && tests.every((t) => t.status !== 'failed')) {
    failed += 1;
    console.log(`suite failed to run: ${suite.name}: ${(suite.message ?? '').split('\n')[0]}`);
  }
  for (const t of tests) {
    if (t.status === 'passed') passed += 1;
    else if (t.status === 'failed') failed += 1;
    else {
      skipped += 1;
      console.log(`not run (${t.status}): ${t.fullName}`);
    }
  }
}
if (passed + failed === 0) failed = 1;
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed === 0 ? 0 : 1);
