#!/usr/bin/env bash
# npm start: everything from a fresh machine to a running desk, each step timed on the terminal.
#   npm dependencies (devDependencies too: the build needs them) · MariaDB (Debian package, private
#   data directory .data/dev, 127.0.0.1:$DB_PORT) · build (skipped when nothing changed) ·
#   migrations · demo scenario (once) · server on http://127.0.0.1:$PORT · SMTP fake · meter-feed
#   simulator (six weeks backfilled) · the demo history replayed once (forecasts as the desk would
#   have issued them, marked as replayed; the last days' published schedules).
# Ports: PORT (3000), DB_PORT (3307), SMTP_PORT (2525). Ctrl-C or SIGTERM stops everything it started
# and exits 0.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

export PORT="${PORT:-3000}" DB_PORT="${DB_PORT:-3307}" SMTP_PORT="${SMTP_PORT:-2525}"
pids=()
status=0

# Each child runs in a session of its own (setsid), so stopping it stops everything it started.
# Further INT/TERM are ignored while stopping: a Ctrl-C reaches this script twice (from the
# terminal and forwarded by npm), and the second one must not end it before MariaDB is stopped.
stop_all() {
  trap '' INT TERM
  trap - EXIT
  step "stopping"
  for pid in "${pids[@]}"; do kill -TERM -- "-$pid" 2>/dev/null; done
  for _ in $(seq 1 20); do
    alive=0
    for pid in "${pids[@]}"; do kill -0 -- "-$pid" 2>/dev/null && alive=1; done
    [ "$alive" = 0 ] && break
    sleep 0.5
  done
  for pid in "${pids[@]}"; do kill -KILL -- "-$pid" 2>/dev/null; done
  bash "$ROOT/scripts/db.sh" stop dev
  step "stopped"
  exit "$status"
}
trap stop_all INT TERM EXIT

step "checking npm dependencies"
npm_deps
step "starting MariaDB"
bash "$ROOT/scripts/db.sh" start dev "$DB_PORT" || die "MariaDB did not start"

# A signing secret of this installation's own, made once and kept out of git.
secret_file="$ROOT/.data/jwt-secret"
[ -s "$secret_file" ] || { node -e "console.log(require('crypto').randomBytes(48).toString('base64url'))" >"$secret_file"; chmod 600 "$secret_file"; }
JWT_SECRET="$(cat "$secret_file")"
export JWT_SECRET

build_all

# The server runs in production mode; set only now, after the install and the build.
export NODE_ENV=production
step "migrating the database and loading the demo scenario (first start only)"
(cd server && node dist/database/manage.js migrate && node dist/database/manage.js seed) | sed 's/^/    /' || die "database set-up failed"

# The local SMTP fake: publication e-mails land as JSON files in .data/mail/dev.
setsid node scripts/smtp-fake.mjs --port "$SMTP_PORT" --dir "$ROOT/.data/mail/dev" >"$ROOT/.data/smtp-fake.log" 2>&1 &
pids+=($!)

step "starting the server"
setsid node server/dist/main.js >"$ROOT/.data/server.log" 2>&1 &
pids+=($!)
for _ in $(seq 1 120); do curl -fs "http://127.0.0.1:$PORT/api/health" >/dev/null && break; sleep 0.5; done
curl -fs "http://127.0.0.1:$PORT/api/health" >/dev/null || { tail -30 "$ROOT/.data/server.log" >&2; status=1; die "the server did not start"; }
step "the desk is up on http://127.0.0.1:$PORT"

# The demo's meter feeds: a key of its own (rotated each start), six weeks of history backfilled
# (only what is missing is new to the database), then live in real time.
key="$(cd server && node dist/database/manage.js feed-key demo-simulator)" || { status=1; die "could not create the simulator's feed key"; }
sim_log="$ROOT/.data/simulator.log"
: >"$sim_log"
MORROWLINE_FEED_KEY="$key" setsid npm run -s simulate -- --url "http://127.0.0.1:$PORT" --backfill-weeks "${SIM_BACKFILL_WEEKS:-6}" \
  --speed "${SIM_SPEED:-3600}" --quiet >"$sim_log" 2>&1 &
sim_pid=$!
pids+=($sim_pid)

step "meter feeds: sending ${SIM_BACKFILL_WEEKS:-6} weeks of history (log .data/simulator.log)"
last_note=0
for _ in $(seq 1 600); do
  grep -aq '^backfill done' "$sim_log" && break
  kill -0 "$sim_pid" 2>/dev/null || break
  if [ $(( $(date +%s) - last_note )) -ge 15 ]; then
    note="$(grep -ao '… [0-9T:-]*' "$sim_log" | tail -1 | tr -d '…')"
    [ -n "$note" ] && step "meter feeds: backfilled up to${note}"
    last_note=$(date +%s)
  fi
  sleep 1
done
if grep -aq '^backfill done' "$sim_log"; then
  step "meter feeds: $(grep -a '^backfill done' "$sim_log" | tail -1)"
else
  log "the simulator did not finish its backfill (see .data/simulator.log); the desk runs on what arrived"
fi

# The first start replays the desk's own daily work over the backfilled weeks (forecasts issued
# at each day's forecast update before gate closure, from the readings stored by then, marked as
# replayed) and publishes the demo's recent schedules; later starts find it done and say so.
step "demo history: replaying the desk's daily forecasts over the backfilled weeks (first start only)"
(cd server && node dist/database/manage.js demo-replay) 2>&1 | sed 's/^/    /'
[ "${PIPESTATUS[0]}" = 0 ] || log "the demo replay did not finish (see above); the desk runs without it and the next start tries again"

cat <<MSG

  Morrowline is running:  http://127.0.0.1:$PORT
  API documentation:      http://127.0.0.1:$PORT/api/docs
  Meter-feed simulator:   live (log .data/simulator.log)
  Server log:             .data/server.log
  Publication e-mails:    .data/mail/dev (local SMTP fake on 127.0.0.1:$SMTP_PORT)

  Demo logins (Tallowmere Valley Electric Cooperative, invented):
$(node -e "for (const u of require('./shared/dist/demo-scenario').DEMO_USERS) console.log('    ' + u.role.padEnd(11) + u.email.padEnd(36) + u.password)")

  Ready after $(( $(date +%s) - SCRIPT_T0 )) s. Press Ctrl-C to stop.

MSG
wait -n "${pids[@]}"
status=1
log "a process ended on its own; see .data/server.log, .data/simulator.log and .data/smtp-fake.log"
