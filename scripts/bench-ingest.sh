#!/usr/bin/env bash
# npm run bench:ingest — readings per second from a socket.io feed client through the server to
# committed rows, against the raw batched-upsert rate of the same MariaDB, in one run.
# Uses its own MariaDB ("bench", 127.0.0.1:3309, fresh database) and server (127.0.0.1:3110).
# Last line: "ingest: N readings/s, raw M rows/s, ratio R".
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

db_port="${BENCH_DB_PORT:-3309}"
app_port="${BENCH_APP_PORT:-3110}"
out="$ROOT/.data/bench"
mkdir -p "$out"
export NODE_ENV=test DB_PORT="$db_port" DB_NAME=morrowline_bench DB_USER=morrowline DB_PASSWORD=morrowline-bench
server_pid=""

# Stops the server and this bench's MariaDB whatever happened, and keeps the script's own exit
# status: under `set -e`, a `wait` on the server it just killed (status 143) used to end the
# script inside this handler, before MariaDB was stopped. db.sh by its absolute path: the script
# has moved into server/ by the time it ends.
cleanup() {
  local rc=$?
  set +e
  trap '' INT TERM
  trap - EXIT
  if [ -n "$server_pid" ]; then
    kill "$server_pid" 2>/dev/null
    wait "$server_pid" 2>/dev/null
  fi
  bash "$ROOT/scripts/db.sh" stop bench >/dev/null 2>&1
  exit "$rc"
}
trap cleanup EXIT
trap 'exit 130' INT TERM

npm_deps
apt_install mariadb-server mariadb-client
bash "$ROOT/scripts/db.sh" start bench "$db_port" >/dev/null || die "bench MariaDB did not start"
bash "$ROOT/scripts/db.sh" reset bench "$db_port" >/dev/null || die "could not reset the bench database"
log "building shared, engine and server"
build_engine
npm run -s build -w server || die "server build failed"
(cd server && node dist/database/manage.js migrate >/dev/null && node dist/database/manage.js seed >/dev/null) || die "could not set up the bench database"
key="$(cd server && node dist/database/manage.js feed-key bench-feed)"

log "starting the server on 127.0.0.1:$app_port"
PORT="$app_port" node ${BENCH_NODE_FLAGS:-} server/dist/main.js >"$out/server.log" 2>&1 &
server_pid=$!
for _ in $(seq 1 120); do curl -fs "http://127.0.0.1:$app_port/api/health" >/dev/null && break; sleep 0.5; done
curl -fs "http://127.0.0.1:$app_port/api/health" >/dev/null || { tail -20 "$out/server.log" >&2; die "server did not start"; }

log "measuring (raw upsert and feed path in alternating rounds)"
# The server's CPU time (user + system, in clock ticks) around the measurement: the raw rounds do
# not touch the server, so what it spends is the feed path's, per reading.
server_ticks() { awk '{print $14 + $15}' "/proc/$server_pid/stat" 2>/dev/null || echo 0; }
ticks_before="$(server_ticks)"
cd server
BENCH_URL="http://127.0.0.1:$app_port" MORROWLINE_FEED_KEY="$key" npx tsx src/cli/bench-ingest.ts | tee "$out/result.txt" | grep -v '^ingest:'
ticks_after="$(server_ticks)"
readings="$(sed -n 's/^feed ingest: .*(\([0-9]*\) stored.*/\1/p' "$out/result.txt")"
if [ -n "$readings" ] && [ "$ticks_after" -gt 0 ]; then
  awk -v t="$((ticks_after - ticks_before))" -v hz="$(getconf CLK_TCK)" -v n="$readings" \
    'BEGIN { printf "server CPU on the feed path: %.1f us per reading (%.2f s for %d readings)\n", t / hz / n * 1e6, t / hz, n }'
fi
grep '^ingest:' "$out/result.txt"
