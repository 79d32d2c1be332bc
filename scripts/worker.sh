#!/usr/bin/env bash
# npm run worker — one cluster worker process: takes refit and forecast-update jobs from the queue
# on REDIS_URL and fits them in its compute pool, writing to the MariaDB of DB_HOST/DB_PORT (the
# same database as the API nodes). Start as many as the fits need, on any machine that reaches
# Redis and MariaDB. Builds first when a source file changed (as npm start does). Serves nothing.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
[ -n "${REDIS_URL:-}" ] || die "REDIS_URL is not set: a worker takes its jobs from the cluster's Redis (README, 'Running a cluster')"
npm_deps
build_all
cd "$ROOT/server"
export NODE_ENV="${NODE_ENV:-production}"
exec node dist/worker.js
