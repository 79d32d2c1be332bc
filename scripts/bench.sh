#!/usr/bin/env bash
# npm run bench: the forecasting engine's benchmark (fit times, the automatic pipeline, accuracy
# on real demand data, and R's arima timed in the same run where R is installed).
# Ingest and refit have their own: npm run bench:ingest, npm run bench:refit.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
npm_deps
npm run -s build -w shared
npm run -s bench:engine -w server -- "$@"
