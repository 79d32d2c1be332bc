#!/usr/bin/env bash
# npm run dev: MariaDB as for npm start, the server recompiled and restarted on change
# (tsc --watch + node --watch) and the client through Vite's dev server with hot reload
# on http://127.0.0.1:5173 (it forwards /api and /socket.io to the server on :3000), with the
# SMTP fake and the meter-feed simulator as for npm start.
# Ports: PORT (server, 3000), DEV_CLIENT_PORT (Vite, 5173), DB_PORT (3307), SMTP_PORT (2525).
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
export NODE_ENV=development DB_PORT="${DB_PORT:-3307}" PORT="${PORT:-3000}" DEV_CLIENT_PORT="${DEV_CLIENT_PORT:-5173}"
pids=()
# Children of the background jobs (npx → vite, npm → the simulator) go too, also when only this
# script gets the signal (Ctrl-C in a terminal reaches the whole group anyway).
kill_tree() { local child; for child in $(pgrep -P "$1"); do kill_tree "$child"; done; kill "$1" 2>/dev/null; }
# Further INT/TERM are ignored while stopping (a Ctrl-C arrives twice: from the terminal and from npm).
stop_all() { trap '' INT TERM; trap - EXIT; for pid in "${pids[@]}"; do kill_tree "$pid"; done; wait; bash "$ROOT/scripts/db.sh" stop dev; exit 0; }
trap stop_all INT TERM EXIT

npm_deps
bash "$ROOT/scripts/db.sh" start dev "$DB_PORT" || die "MariaDB did not start"
# shared, the engine and the server once before the watchers start (the client is served from source by Vite)
build_engine
npm run -s build -w server >/dev/null || log "the server build has errors; tsc --watch below shows them"
(cd server && node dist/database/manage.js migrate && node dist/database/manage.js seed) || die "database set-up failed"
(cd shared && npx tsc -p tsconfig.build.json --watch --preserveWatchOutput >/dev/null) & pids+=($!)
(cd engine && npx tsc -p tsconfig.build.json --watch --preserveWatchOutput >/dev/null) & pids+=($!)
(cd server && npx tsc -p tsconfig.build.json --watch --preserveWatchOutput) & pids+=($!)
(cd server && node --watch-path=dist --watch-path=../shared/dist --watch-path=../engine/dist dist/main.js) & pids+=($!)
(cd client && npx vite --host 127.0.0.1 --port "$DEV_CLIENT_PORT" --strictPort) & pids+=($!)

# As npm start does: the SMTP fake for publication e-mails and the meter-feed simulator, so the
# dev desk has live data (the simulator reconnects and resends while the server restarts).
export SMTP_PORT="${SMTP_PORT:-2525}"
node scripts/smtp-fake.mjs --port "$SMTP_PORT" --dir "$ROOT/.data/mail/dev" >"$ROOT/.data/smtp-fake.log" 2>&1 & pids+=($!)
for _ in $(seq 1 60); do curl -fs "http://127.0.0.1:$PORT/api/health" >/dev/null && break; sleep 0.5; done
if key="$(cd server && node dist/database/manage.js feed-key demo-simulator)"; then
  MORROWLINE_FEED_KEY="$key" npm run -s simulate -- --url "http://127.0.0.1:$PORT" --backfill-weeks "${SIM_BACKFILL_WEEKS:-6}" \
    --speed "${SIM_SPEED:-3600}" --quiet >"$ROOT/.data/simulator.log" 2>&1 & pids+=($!)
else
  log "no simulator: the feed key could not be made (the desk runs without live readings)"
fi
log "dev desk on http://127.0.0.1:$DEV_CLIENT_PORT (API on :$PORT, simulator log .data/simulator.log, e-mails .data/mail/dev). Ctrl-C stops everything."
wait
