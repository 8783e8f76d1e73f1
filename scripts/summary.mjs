// Reads vitest's JSON reports (one or more files) and prints the plain summary line CI reads: `N passed, N failed`.
// A suite that failed to load counts as a failure; skipped tests are named, never hidden.
import { readFileSync, existsSync } from 'node:fs';

const files = process.argv.slice(2);
const missing = files.filter((f) => !existsSync(f));
if (files.length === 0 || missing.length > 0) {
  console.log(`vitest wrote no report${missing.length ? `: ${missing.join(', ')}` : ''}`);
  console.log('0 passed, 1 failed');
  process.exit(1);
}
let passed = 0;
let failed = 0;
let skipped = 0;
for (const suite of files.flatMap((f) => JSON.parse(readFileSync(f, 'utf8')).testResults ?? [])) {
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
