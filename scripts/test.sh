#!/usr/bin/env bash
# npm test: every suite, with what they need started here and stopped afterwards.
#   engine (jest) · shared rules (jest) · server unit (jest) · server integration (jest, real
#   MariaDB on 127.0.0.1:3308, fresh schema) · simulator (jest) · client (vitest) · browser (vitest
#   + playwright-core + Debian Chromium) · cluster (Debian Redis on 127.0.0.1:6390, two API nodes
#   and two workers on the test database) · start (a clean clone of HEAD through npm run dev,
#   bench:ingest and npm start, twice)
# Ends with one line "N passed, N failed" and a non-zero exit if anything failed.
# Run one suite alone: scripts/test.sh engine|shared|unit|integration|simulators|client|e2e|cluster|lint|start
# (unit includes shared: the operating-day, role and zone-code rules the server and the desk both use)
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

only="${1:-all}"
reports="$ROOT/.data/test-reports"
rm -rf "$reports"; mkdir -p "$reports"
export TEST_DB_PORT="${TEST_DB_PORT:-3308}"
export TEST_APP_PORT="${TEST_APP_PORT:-3100}"
export TEST_REDIS_PORT="${TEST_REDIS_PORT:-6390}"
failures=()
pids=()

cleanup() {
  trap '' INT TERM
  for pid in "${pids[@]}"; do kill "$pid" 2>/dev/null; done
  wait 2>/dev/null
  bash "$ROOT/scripts/db.sh" stop test >/dev/null 2>&1 || true
  bash "$ROOT/scripts/redis.sh" stop test >/dev/null 2>&1 || true
}
trap cleanup EXIT
trap 'exit 130' INT TERM

want() { [ "$only" = all ] || [ "$only" = "$1" ]; }
# suite NAME COMMAND... — run one suite; a suite that fails (or crashes) is remembered.
suite() {
  local name="$1"; shift
  log "suite: $name"
  if ! "$@"; then failures+=("$name"); fi
  [ -f "$reports/$name.json" ] || echo '{"numPassedTests":0,"numFailedTests":1,"crashed":true}' >"$reports/$name.json"
}

npm_deps
apt_install mariadb-server mariadb-client
want e2e && apt_install chromium
npm run -s build -w shared || die "shared build failed"
# The server and its worker threads load the compiled engine (engine/dist), as in production.
npm run -s build -w engine || die "engine build failed"

# Environment for everything that talks to the test database.
export NODE_ENV=test DB_PORT="$TEST_DB_PORT" DB_NAME=morrowline_test DB_USER=morrowline DB_PASSWORD=morrowline-test
export LOGIN_ATTEMPTS_PER_MINUTE=10

if want engine; then
  suite engine npx --workspace engine jest --json --outputFile="$reports/engine.json"
fi

if want shared || want unit; then
  suite shared npx --workspace shared jest --json --outputFile="$reports/shared.json"
fi

if want unit; then
  suite unit npx --workspace server jest --selectProjects unit --json --outputFile="$reports/unit.json"
fi

if want simulators; then
  suite simulators npx --workspace simulators jest --json --outputFile="$reports/simulators.json"
fi

if want integration || want e2e || want cluster; then
  # The SMTP fake the schedule publication tests read their e-mails from.
  export SMTP_PORT="${TEST_SMTP_PORT:-2526}" MAIL_FAKE_DIR="$ROOT/.data/mail/test"
  node scripts/smtp-fake.mjs --port "$SMTP_PORT" --dir "$MAIL_FAKE_DIR" >"$reports/smtp-fake.log" 2>&1 &
  pids+=($!)
  bash "$ROOT/scripts/db.sh" start test "$TEST_DB_PORT" || die "test MariaDB did not start"
  bash "$ROOT/scripts/db.sh" reset test "$TEST_DB_PORT" || die "could not reset the test database"
fi

if want integration; then
  # Fresh schema from the migrations, then the demo users and zones the tests sign in with.
  (cd server && npx tsx src/database/manage.ts migrate >/dev/null && npx tsx src/database/manage.ts seed >/dev/null) \
    || die "could not migrate the test database"
  suite integration npx --workspace server jest --selectProjects integration --runInBand --json --outputFile="$reports/integration.json"
fi

if want client; then
  suite client npx --workspace client vitest run --reporter=default --reporter=json --outputFile.json="$reports/client.json"
fi

if want e2e; then
  bash "$ROOT/scripts/db.sh" reset test "$TEST_DB_PORT" >/dev/null
  log "building server and client for the browser tests"
  if npm run -s build -w server && npm run -s build -w client; then
    (cd server && node dist/database/manage.js migrate >/dev/null && node dist/database/manage.js seed >/dev/null) || die "test database set-up failed"
    # The browser tests sign the demo users in many times a minute on a fast machine; the sign-in
    # limits themselves are tested in the integration suite (sessions.e2e-spec), so this server
    # gets room enough that a quick run is never refused with 429.
    LOGIN_ATTEMPTS_PER_MINUTE=600 LOGIN_ATTEMPTS_PER_ADDRESS_PER_MINUTE=600 \
      PORT="$TEST_APP_PORT" node server/dist/main.js >"$reports/e2e-server.log" 2>&1 &
    pids+=($!)
    for _ in $(seq 1 60); do curl -fs "http://127.0.0.1:$TEST_APP_PORT/api/health" >/dev/null && break; sleep 0.5; done
    MORROWLINE_URL="http://127.0.0.1:$TEST_APP_PORT" suite e2e npx --workspace client vitest run --config vitest.e2e.config.ts \
      --reporter=default --reporter=json --outputFile.json="$reports/e2e.json"
  else
    failures+=(build)
  fi
fi

if want cluster; then
  # Cluster mode on this machine: Redis (Debian's redis-server, installed if missing), a fresh
  # schema, the compiled server; the suite starts two API nodes (TEST_APP_PORT+1, +2), a fail-over
  # proxy (+3) and two workers itself, their logs in .data/test-reports/cluster-*.log.
  bash "$ROOT/scripts/redis.sh" start test "$TEST_REDIS_PORT" && bash "$ROOT/scripts/redis.sh" flush test "$TEST_REDIS_PORT" \
    || die "test Redis did not start"
  bash "$ROOT/scripts/db.sh" reset test "$TEST_DB_PORT" >/dev/null
  if npm run -s build -w server && (cd server && node dist/database/manage.js migrate >/dev/null && node dist/database/manage.js seed >/dev/null); then
    REDIS_URL="redis://127.0.0.1:$TEST_REDIS_PORT" CLUSTER_LOG_DIR="$reports" \
      suite cluster npx --workspace server jest --selectProjects cluster --runInBand --json --outputFile="$reports/cluster.json"
  else
    failures+=(cluster-build)
  fi
  bash "$ROOT/scripts/redis.sh" stop test >/dev/null
fi

if want lint; then
  # eslint (the engine's boundary) and the folder-cycle check, counted as one test.
  log "suite: lint"
  if npm run -s lint; then echo '{"numPassedTests":1,"numFailedTests":0}' >"$reports/lint.json"
  else echo '{"numPassedTests":0,"numFailedTests":1}' >"$reports/lint.json"; failures+=(lint); fi
fi

if want start; then
  # Last, on ports of its own: a clean clone of HEAD goes through npm run dev, bench:ingest and
  # npm start as a new user would (scripts/start-test.mjs).
  suite start node scripts/start-test.mjs "$reports/start.json"
fi

summary=$(node scripts/summarize-tests.mjs "$reports")
echo
[ ${#failures[@]} -gt 0 ] && log "failed suites: ${failures[*]}"
echo "$summary"
[ ${#failures[@]} -eq 0 ]
