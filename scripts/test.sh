#!/usr/bin/env bash
# The project's test command (npm test): system tools, then every vitest suite, then one
# plain summary line `N passed, N failed` (the last line of output).
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
rm -f .test-results/vitest.json
npx vitest run --reporter=default --reporter=json --outputFile.json=.test-results/vitest.json
node scripts/summary.mjs .test-results/vitest.json
