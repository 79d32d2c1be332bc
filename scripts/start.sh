#!/usr/bin/env bash
# npm start: everything from a fresh machine to a running desk.
#   npm dependencies · MariaDB (Debian package, private data directory .data/dev, 127.0.0.1:3307)
#   migrations · demo scenario (once) · build · server on http://127.0.0.1:3000 · meter-feed simulator
# Ctrl-C (or SIGTERM) stops the simulator, the server and MariaDB.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export PORT="${PORT:-3000}" DB_PORT="${DB_PORT:-3307}"
export NODE_ENV=production
pids=()

# Each child runs in a session of its own (setsid), so stopping it stops everything it started.
stop_all() {
  trap - INT TERM EXIT
  log "stopping"
  for pid in "${pids[@]}"; do kill -TERM -- "-$pid" 2>/dev/null; done
  for _ in $(seq 1 20); do
    alive=0
    for pid in "${pids[@]}"; do kill -0 -- "-$pid" 2>/dev/null && alive=1; done
    [ "$alive" = 0 ] && break
    sleep 0.5
  done
  for pid in "${pids[@]}"; do kill -KILL -- "-$pid" 2>/dev/null; done
  bash scripts/db.sh stop dev
  exit 0
}
trap stop_all INT TERM EXIT

npm_deps
bash scripts/db.sh start dev "$DB_PORT" || die "MariaDB did not start"

# A signing secret of this installation's own, made once and kept out of git.
secret_file="$ROOT/.data/jwt-secret"
[ -s "$secret_file" ] || { node -e "console.log(require('crypto').randomBytes(48).toString('base64url'))" >"$secret_file"; chmod 600 "$secret_file"; }
JWT_SECRET="$(cat "$secret_file")"
export JWT_SECRET

log "building (shared, engine, server, client)"
npm run -s build >/dev/null || die "build failed; run 'npm run build' to see why"

(cd server && node dist/database/manage.js migrate && node dist/database/manage.js seed) || die "database set-up failed"

# The local SMTP fake: publication e-mails land as JSON files in .data/mail/dev.
export SMTP_PORT="${SMTP_PORT:-2525}"
setsid node scripts/smtp-fake.mjs --port "$SMTP_PORT" --dir "$ROOT/.data/mail/dev" >"$ROOT/.data/smtp-fake.log" 2>&1 &
pids+=($!)

setsid node server/dist/main.js >"$ROOT/.data/server.log" 2>&1 &
pids+=($!)
for _ in $(seq 1 60); do curl -fs "http://127.0.0.1:$PORT/api/health" >/dev/null && break; sleep 0.5; done
curl -fs "http://127.0.0.1:$PORT/api/health" >/dev/null || { tail -30 "$ROOT/.data/server.log" >&2; die "the server did not start"; }

# The demo's meter feeds: a key of its own (rotated each start), six weeks of history backfilled,
# then the last two days replayed quickly and real time after that.
key="$(cd server && node dist/database/manage.js feed-key demo-simulator)" || die "could not create the simulator's feed key"
MORROWLINE_FEED_KEY="$key" setsid npm run -s simulate -- --url "http://127.0.0.1:$PORT" --backfill-weeks "${SIM_BACKFILL_WEEKS:-6}" \
  --speed "${SIM_SPEED:-3600}" --quiet >"$ROOT/.data/simulator.log" 2>&1 &
pids+=($!)
sim="running (log .data/simulator.log)"

cat <<MSG

  Morrowline is running:  http://127.0.0.1:$PORT
  API documentation:      http://127.0.0.1:$PORT/api/docs
  Meter-feed simulator:   $sim
  Server log:             .data/server.log
  Publication e-mails:    .data/mail/dev (local SMTP fake on 127.0.0.1:$SMTP_PORT)

  Demo logins (Tallowmere Valley Electric Cooperative, invented):
$(node -e "for (const u of require('./shared/dist/demo-scenario').DEMO_USERS) console.log('    ' + u.role.padEnd(11) + u.email.padEnd(36) + u.password)")

  Press Ctrl-C to stop.

MSG
wait -n "${pids[@]}"
log "a process ended on its own; see .data/server.log"
stop_all
