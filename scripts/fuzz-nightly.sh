#!/usr/bin/env bash
# The nightly-sized fuzz run (npm run fuzz:nightly): tests/fuzz with TWOFOLD_FUZZ_RUNS cases
# per property (default 10,000; `npm test` runs 1,000). Prints the cases, the crashes (failed
# properties: fast-check stops at the first crash of a property and prints its seed) and the
# wall time. Exit status: vitest's.
set -uo pipefail
cd "$(dirname "$0")/.."
RUNS="${TWOFOLD_FUZZ_RUNS:-10000}"
mkdir -p .test-results
start=$(date +%s)
TWOFOLD_FUZZ_RUNS="$RUNS" npx vitest run tests/fuzz --reporter=default --reporter=json --outputFile.json=.test-results/fuzz-nightly.json
status=$?
end=$(date +%s)
node -e '
const r = JSON.parse(require("fs").readFileSync(".test-results/fuzz-nightly.json", "utf8"));
const tests = r.testResults.flatMap((s) => s.assertionResults);
const failed = tests.filter((t) => t.status !== "passed");
console.log(`fuzz: ${tests.length} properties × ${process.argv[1]} cases, ${failed.length} with a crash, ${process.argv[2]} s`);
for (const t of failed) console.log(`  crashed: ${t.fullName}`);
' "$RUNS" "$((end - start))"
exit $status
