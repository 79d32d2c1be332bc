#!/usr/bin/env bash
# A private Redis server on loopback for cluster mode (its tests and benchmarks), one per purpose,
# each with its own data directory under .data/, the way scripts/db.sh runs MariaDB. Usage:
#   scripts/redis.sh start NAME PORT   install Debian's redis-server if missing, start it
#   scripts/redis.sh stop NAME         stop it (by pid) and wait until it is gone
#   scripts/redis.sh flush NAME PORT   empty it (tests start from nothing)
# Settings BullMQ needs: `maxmemory-policy noeviction` (an evicted job key loses the job) and the
# append-only file on, fsynced every second (a restart keeps the queues). Only 127.0.0.1 is bound.
# Never needed by `npm start` or the single-machine suites.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

cmd="${1:-}"; name="${2:-}"; port="${3:-6379}"
[ -n "$cmd" ] && [ -n "$name" ] || die "usage: scripts/redis.sh start|stop|flush NAME [PORT]"
dir="$ROOT/.data/redis-$name"
pidfile="$dir/redis.pid"

running() { [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null; }

start() {
  command -v redis-server >/dev/null || apt_install redis-server
  mkdir -p "$dir"
  if running; then
    log "Redis '$name' already running (pid $(cat "$pidfile"))"
    return 0
  fi
  log "starting Redis '$name' on 127.0.0.1:$port"
  redis-server --bind 127.0.0.1 --port "$port" --protected-mode yes --dir "$dir" --daemonize yes \
    --pidfile "$pidfile" --logfile "$dir/redis.log" --maxmemory-policy noeviction \
    --appendonly yes --appendfsync everysec --save '' >/dev/null
  for _ in $(seq 1 40); do
    redis-cli -h 127.0.0.1 -p "$port" ping 2>/dev/null | grep -q PONG && return 0
    sleep 0.25
  done
  tail -20 "$dir/redis.log" >&2
  die "Redis did not start"
}

stop() {
  stop_pid_file "Redis '$name'" "$pidfile" 10
}

flush() {
  running || start
  redis-cli -h 127.0.0.1 -p "$port" flushall >/dev/null
}

case "$cmd" in
  start) start ;;
  stop) stop ;;
  flush) flush ;;
  *) die "unknown command $cmd" ;;
esac
