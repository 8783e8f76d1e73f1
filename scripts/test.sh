#!/usr/bin/env bash
# The project's test command (npm test): system tools, then every vitest suite (the workbench
# timing test alone, last), then one plain summary line `N passed, N failed` (the last line of output).
set -uo pipefail
cd "$(dirname "$0")/.."

if ! bash scripts/ensure-system-tools.sh; then
  echo "0 passed, 1 failed"
  exit 1
fi

# The compiled command line that tests spawning `twofold` run, built now if a source changed
# (the bin would do it on its first run; once here, not in parallel test files).
if ! node -e "import('./scripts/cli-build.mjs').then((m) => m.currentCliBuild())"; then
  echo "0 passed, 1 failed"
  exit 1
fi

mkdir -p .test-results
rm -f .test-results/vitest.json .test-results/vitest-timing.json
# The timing tests run after the others, one file at a time: the workbench's requirement
# (override → values painted, p95 ≤ 50 ms) is asserted on an otherwise idle machine (the test
# measures how much other work ran), and the cost per breath at 500 → 32,000 breaths is CPU
# time, which the suite's own parallel files still inflate for the largest tests by sharing the
# caches and memory bandwidth (measured: ×1.21–1.23 against ×1.09–1.18 alone, bound ×1.2).
TIMING=(tests/e2e/review-timing.test.ts tests/bench/scaling.test.ts)
npx vitest run "${TIMING[@]/#/--exclude=}" --reporter=default --reporter=json --outputFile.json=.test-results/vitest.json
npx vitest run "${TIMING[@]}" --no-file-parallelism --reporter=default --reporter=json --outputFile.json=.test-results/vitest-timing.json
node scripts/summary.mjs .test-results/vitest.json .test-results/vitest-timing.json
