#!/usr/bin/env bash
# npm run bench:refit — full refits (differencing and order selection, 7-day scoring backtest,
# forecast) through the server's compute pool: the demo zones, growth with history length, and
# the scaled case of 200 zones x 8 weeks. Engine only: no database or server is started.
# Last line: "refit: Z zones x H hours in S s".
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
npm_deps
build_engine quiet
cd server
exec npx tsx src/cli/bench-refit.ts
