#!/usr/bin/env bash
# npm run bench: the forecasting engine's benchmark (fit times, the automatic pipeline, accuracy
# on real demand data, and R's arima timed in the same run: R and jsonlite come from Debian
# (r-base-core, r-cran-jsonlite), installed here when missing; MORROWLINE_BENCH_NO_R=1 skips them
# and the R columns).
# Ingest and refit have their own: npm run bench:ingest, npm run bench:refit.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
npm_deps
[ "${MORROWLINE_BENCH_NO_R:-0}" = "1" ] || apt_install r-base-core r-cran-jsonlite
# The compiled engine (engine/dist), the same code the server runs.
npm run -s build -w engine
npm run -s bench -w engine -- "$@"
