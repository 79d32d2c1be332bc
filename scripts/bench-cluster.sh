#!/usr/bin/env bash
# npm run bench:cluster [-- --zones Z] [--workers 1,2,4] — the nightly full refit of Z zones x 8
# weeks (default 2,000) over 1, 2 and 4 worker processes through a BullMQ queue, and the single
# machine's batch pool in the same run (server/src/cli/bench-cluster.ts). Starts its own Redis
# (Debian's redis-server, installed if missing) on 127.0.0.1:$BENCH_REDIS_PORT (default 6392,
# .data/redis-bench/) and stops it at the end. No database.
# Last line: "cluster: Z zones x H hours on W workers in S s".
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
npm_deps
build_engine quiet
port="${BENCH_REDIS_PORT:-6392}"
trap 'bash "$ROOT/scripts/redis.sh" stop bench >/dev/null 2>&1 || true' EXIT
trap 'exit 130' INT TERM
bash "$ROOT/scripts/redis.sh" start bench "$port" >&2
cd server
REDIS_URL="redis://127.0.0.1:$port" npx tsx src/cli/bench-cluster.ts "$@"
