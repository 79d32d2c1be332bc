#!/usr/bin/env bash
# npm run dev: MariaDB as for npm start, the server recompiled and restarted on change
# (tsc --watch + node --watch) and the client through Vite's dev server with hot reload
# on http://127.0.0.1:5173 (it forwards /api and /socket.io to the server on :3000).
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
export NODE_ENV=development DB_PORT="${DB_PORT:-3307}"
pids=()
stop_all() { trap - INT TERM EXIT; for pid in "${pids[@]}"; do kill "$pid" 2>/dev/null; done; wait; bash scripts/db.sh stop dev; exit 0; }
trap stop_all INT TERM EXIT

npm_deps
bash scripts/db.sh start dev "$DB_PORT" || die "MariaDB did not start"
npm run -s build -w shared
npm run -s build -w server >/dev/null || true
(cd server && node dist/database/manage.js migrate && node dist/database/manage.js seed) || die "database set-up failed"
(cd shared && npx tsc -p tsconfig.build.json --watch --preserveWatchOutput >/dev/null) & pids+=($!)
(cd server && npx tsc -p tsconfig.build.json --watch --preserveWatchOutput) & pids+=($!)
(cd server && node --watch-path=dist --watch-path=../shared/dist dist/main.js) & pids+=($!)
(cd client && npx vite --host 127.0.0.1) & pids+=($!)
log "dev desk on http://127.0.0.1:5173 (API on :3000). Ctrl-C stops everything."
wait
