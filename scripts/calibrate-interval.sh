#!/usr/bin/env bash
# The threshold interval's calibration in one command (development seeds only):
#   bash scripts/calibrate-interval.sh [seedsPerCell] [pairs]
# 1. dumps one JSON line per development test and threshold (tests/validation/interval-dump.ts:
#    detection grids from seed 5000 of both families, day-2 pairs from 9000 / 49000) to
#    .test-results/interval-dev.jsonl;
# 2. fits the interval's weights and prints the coverage per set
#    (tests/validation/calibration/fit-interval.py; needs python3 with numpy and scipy).
# Re-run after any detector change in core/thresholds; copy the printed weights into
# INTERVAL_CALIBRATION (core/thresholds/uncertainty.ts) only after reading docs/validation.md.
set -euo pipefail
cd "$(dirname "$0")/.."
K="${1:-6}"
PAIRS="${2:-200}"
mkdir -p .test-results
out=.test-results/interval-dev.jsonl
python3 -c 'import numpy, scipy' || { echo "calibrate-interval: python3 with numpy and scipy is needed" >&2; exit 2; }
start=$(date +%s)
npx tsx tests/validation/interval-dump.ts "$K" "$PAIRS" > "$out"
mid=$(date +%s)
echo "dump: $(wc -l < "$out") lines in $((mid - start)) s ($out)"
python3 tests/validation/calibration/fit-interval.py "$out"
echo "fit: $(( $(date +%s) - mid )) s"
