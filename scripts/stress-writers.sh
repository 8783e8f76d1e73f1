#!/usr/bin/env bash
# The concurrent-writer stress run (npm run stress:writers): tests/cli/concurrent-writers.test.ts
# (4 `twofold override` processes at once on one case, TWOFOLD_WRITER_ROUNDS rounds, default
# 30) repeated TWOFOLD_STRESS_REPEATS times (default 3, as the issue's three runs). Prints each
# run's outcome and wall time. Exit status: 1 when any run failed.
set -uo pipefail
cd "$(dirname "$0")/.."
ROUNDS="${TWOFOLD_WRITER_ROUNDS:-30}"
REPEATS="${TWOFOLD_STRESS_REPEATS:-3}"
node -e "import('./scripts/cli-build.mjs').then((m) => m.currentCliBuild())" || exit 1
failed=0
for run in $(seq 1 "$REPEATS"); do
  start=$(date +%s)
  if TWOFOLD_WRITER_ROUNDS="$ROUNDS" npx vitest run tests/cli/concurrent-writers.test.ts >".test-results/stress-writers-$run.log" 2>&1; then
    outcome="0 lost (every entry of every writer present, chain verified)"
  else
    outcome="FAILED (see .test-results/stress-writers-$run.log)"
    failed=1
  fi
  echo "run $run: 4 writers × $ROUNDS rounds: $outcome, $(( $(date +%s) - start )) s"
done
exit $failed
