# Shared helpers for the shell entry points. Source it; it defines functions only.
# shellcheck shell=bash

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"

log() { printf '\033[1;34m[morrowline]\033[0m %s\n' "$*" >&2; }
die() { printf '\033[1;31m[morrowline]\033[0m %s\n' "$*" >&2; exit 1; }

# apt_install PKG... — install Debian packages that are missing (we run as root on CI).
apt_install() {
  local missing=()
  for pkg in "$@"; do
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q 'install ok installed' || missing+=("$pkg")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  log "installing Debian packages: ${missing[*]}"
  local sudo=""
  [ "$(id -u)" -ne 0 ] && sudo="sudo"
  $sudo apt-get update -qq >/dev/null
  DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null \
    || die "apt-get install ${missing[*]} failed"
}

# npm_deps — install npm dependencies when node_modules is missing or older than the lockfile.
# Always with the devDependencies: every entry point builds (TypeScript, Vite, the CLIs), and
# npm would leave them out whenever NODE_ENV=production is in the environment (npm start sets it
# for the server; an operator's shell may have it too).
npm_deps() {
  cd "$ROOT" || exit 1
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] \
     || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm dependencies (npm ci, devDependencies included: the build needs them)"
    NODE_ENV=development npm ci --include=dev --no-audit --no-fund >/dev/null || die "npm ci failed"
  fi
}

# build_engine [quiet] — compiles shared/ and the engine (engine/dist), which the server, its
# worker threads and the benches load as in production; "quiet" keeps tsc's output off the log.
build_engine() {
  cd "$ROOT" || exit 1
  if [ "${1:-}" = quiet ]; then
    npm run -s build -w shared >/dev/null || die "shared build failed"
    npm run -s build -w engine >/dev/null || die "engine build failed"
  else
    npm run -s build -w shared || die "shared build failed"
    npm run -s build -w engine || die "engine build failed"
  fi
}

# Seconds since this script began, for progress lines ("[ 42 s] ...").
SCRIPT_T0=$(date +%s)
step() { log "[$(printf '%3d' $(( $(date +%s) - SCRIPT_T0 ))) s] $*"; }

# build_all — build every workspace (npm run build) unless nothing it reads changed since the last
# build: a second npm start on an unchanged tree goes straight to serving. The stamp records the
# newest source file seen; any newer file (or a missing dist/) means a rebuild.
build_all() {
  cd "$ROOT" || exit 1
  local stamp="$ROOT/.data/build-stamp" ws newer=""
  mkdir -p "$ROOT/.data"
  # the workspaces that have a build script (the same ones `npm run build` builds)
  local built; built="$(node -p "require('./package.json').workspaces.filter((w) => require('./' + w + '/package.json').scripts?.build).join(' ')")"
  for ws in $built; do
    [ -d "$ws/dist" ] || { newer="$ws/dist missing"; break; }
  done
  if [ -z "$newer" ] && [ -f "$stamp" ]; then
    newer="$(find package.json package-lock.json tsconfig.base.json $(node -p "require('./package.json').workspaces.join(' ')") \
      \( -name node_modules -o -name dist -o -name .data \) -prune -o -type f -newer "$stamp" -print -quit 2>/dev/null)"
  else
    newer="${newer:-no earlier build}"
  fi
  if [ -z "$newer" ]; then
    step "build is up to date (nothing changed since the last one)"
    return 0
  fi
  step "building every workspace ($newer)"
  touch "$stamp.new"
  npm run -s build >"$ROOT/.data/build.log" 2>&1 || { tail -30 "$ROOT/.data/build.log" >&2; rm -f "$stamp.new"; die "build failed (full output in .data/build.log)"; }
  mv "$stamp.new" "$stamp"
}

# stop_pid_file WHAT PIDFILE SECONDS — stops the process a pid file names (the private MariaDB and
# Redis servers): SIGTERM, up to SECONDS for it to finish writing and go, then SIGKILL.
stop_pid_file() {
  local what="$1" pidfile="$2" seconds="$3" pid
  [ -f "$pidfile" ] && kill -0 "$(cat "$pidfile")" 2>/dev/null || return 0
  pid="$(cat "$pidfile")"
  log "stopping $what (pid $pid)"
  kill "$pid" 2>/dev/null || true
  for _ in $(seq 1 $((seconds * 4))); do kill -0 "$pid" 2>/dev/null || return 0; sleep 0.25; done
  kill -9 "$pid" 2>/dev/null || true
}
