#!/usr/bin/env bash
# A private MariaDB server on loopback, one per purpose (demo or tests), each with its own data
# directory under .data/. Usage:
#   scripts/db.sh start NAME PORT   initialise if needed, start, create database and user
#   scripts/db.sh stop NAME         stop it (by pid) and wait until it is gone
#   scripts/db.sh reset NAME PORT   drop and recreate the application database (tests)
# The application database and user are both "morrowline"; the password is DB_PASSWORD
# (default morrowline-local). Only 127.0.0.1 is bound; nothing listens elsewhere.
# Durable: every commit is flushed to disk before it returns (innodb_flush_log_at_trx_commit=1,
# and sync_binlog=1 should a binary log be turned on), so an acknowledged reading survives a power
# cut; ingest keeps its rate by committing whole batches, not by relaxing this.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

cmd="${1:-}"; name="${2:-}"; port="${3:-3307}"
[ -n "$cmd" ] && [ -n "$name" ] || die "usage: scripts/db.sh start|stop|reset NAME [PORT]"
dir="$ROOT/.data/$name"
datadir="$dir/mariadb"
sock="$dir/mysqld.sock"
pidfile="$dir/mysqld.pid"
db_name="${DB_NAME:-morrowline}"
db_user="${DB_USER:-morrowline}"
db_password="${DB_PASSWORD:-morrowline-local}"

client() { mariadb --no-defaults --socket="$sock" -uroot "$@"; }

create_app_db() {
  client <<SQL
CREATE DATABASE IF NOT EXISTS \`$db_name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$db_user'@'127.0.0.1' IDENTIFIED BY '$db_password';
ALTER USER '$db_user'@'127.0.0.1' IDENTIFIED BY '$db_password';
GRANT ALL PRIVILEGES ON \`$db_name\`.* TO '$db_user'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

running() { [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; }

start() {
  command -v mariadbd >/dev/null || [ -x /usr/sbin/mariadbd ] || apt_install mariadb-server mariadb-client
  export PATH="$PATH:/usr/sbin"
  mkdir -p "$dir"
  if [ ! -d "$datadir/mysql" ]; then
    log "initialising MariaDB data directory $datadir"
    mariadb-install-db --no-defaults --datadir="$datadir" --auth-root-authentication-method=normal \
      --user="$(id -un)" >"$dir/install.log" 2>&1 || { cat "$dir/install.log" >&2; die "mariadb-install-db failed"; }
  fi
  if running; then
    log "MariaDB '$name' already running (pid $(cat "$pidfile"))"
  else
    log "starting MariaDB '$name' on 127.0.0.1:$port"
    nohup mariadbd --no-defaults --datadir="$datadir" --socket="$sock" --port="$port" \
      --bind-address=127.0.0.1 --user="$(id -un)" --skip-name-resolve --pid-file="$pidfile" \
      --log-error="$dir/error.log" --innodb-buffer-pool-size=256M --max-connections=200 \
      --innodb-flush-log-at-trx-commit=1 --sync-binlog=1 >/dev/null 2>&1 &
    for _ in $(seq 1 60); do
      mariadb-admin --no-defaults --socket="$sock" -uroot ping >/dev/null 2>&1 && break
      sleep 0.5
    done
    mariadb-admin --no-defaults --socket="$sock" -uroot ping >/dev/null 2>&1 \
      || { tail -20 "$dir/error.log" >&2; die "MariaDB did not start"; }
  fi
  create_app_db
}

stop() {
  stop_pid_file "MariaDB '$name'" "$pidfile" 30
}

reset() {
  running || start
  client -e "DROP DATABASE IF EXISTS \`$db_name\`;"
  create_app_db
}

case "$cmd" in
  start) start ;;
  stop) stop ;;
  reset) reset ;;
  *) die "unknown command $cmd" ;;
esac
