#!/usr/bin/env bash
# Shared pieces of the start and test bootstraps: dependencies, Debian packages, and a
# project-local PostgreSQL cluster run as the `postgres` user on loopback.
set -euo pipefail

ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)
log() { printf '\033[1;34m[fluxwright]\033[0m %s\n' "$*"; }

apt_updated=0
apt_install() {
  command -v apt-get >/dev/null || { log "apt-get not found: install $* by hand"; return 1; }
  if [ $apt_updated = 0 ]; then apt-get update -qq >/dev/null; apt_updated=1; fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

# The command-line tools the scripts call, all from the lock file. Each runs through `tool`, never
# npx: npx would fetch whatever version the registry has when one is missing.
DEV_TOOLS=(vite tsc tsx vitest rolldown)

# Every dependency, devDependencies included whatever NODE_ENV or the npm configuration says: the
# start, the build and the tests all need the development tools. Installs when node_modules is
# missing, older than the lock file, or lacks one of the tools (an install that left them out).
ensure_node_modules() {
  local missing=()
  for t in "${DEV_TOOLS[@]}"; do [ -x "$ROOT/node_modules/.bin/$t" ] || missing+=("$t"); done
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ] || [ ${#missing[@]} -gt 0 ]; then
    log "installing npm dependencies (npm ci --include=dev)"
    (cd "$ROOT" && npm ci --include=dev --no-audit --no-fund --loglevel=error)
  else
    log "npm dependencies are installed (install skipped)"
  fi
}

# tool NAME ARGS…: runs the project's own copy of a command-line tool from node_modules/.bin.
tool() {
  local bin="$ROOT/node_modules/.bin/$1"
  if [ ! -x "$bin" ]; then
    printf '\033[1;31m[fluxwright]\033[0m %s is not installed in node_modules: run `npm ci --include=dev` in %s\n' "$1" "$ROOT" >&2
    return 127
  fi
  shift
  "$bin" "$@"
}

# The linter lives in a package of its own (scripts/lint: eslint and typescript-eslint, which needs
# a TypeScript with the compiler API beside the project's TypeScript 7), with its own lock file.
ensure_lint_modules() {
  local dir="$ROOT/scripts/lint"
  if [ ! -x "$dir/node_modules/.bin/eslint" ] || [ "$dir/package-lock.json" -nt "$dir/node_modules/.package-lock.json" ]; then
    log "installing the linter (npm ci in scripts/lint)"
    (cd "$dir" && npm ci --include=dev --no-audit --no-fund --loglevel=error)
  fi
}

# The builds `npm start` serves: the client bundle (dist/) and the compiled server (build/). Skipped
# when nothing they are made from changed since the last build.
BUILD_STAMP=build/.built
build_is_current() {
  [ -f "$ROOT/$BUILD_STAMP" ] && [ -f "$ROOT/dist/index.html" ] || return 1
  [ -z "$(cd "$ROOT" && find server shared src index.html package.json package-lock.json vite.config.ts tailwind.config.ts tsconfig.json scripts/build-server.mjs -newer "$BUILD_STAMP" -print -quit 2>/dev/null)" ]
}
build_all() {
  (cd "$ROOT" && tool vite build --logLevel warn && node scripts/build-server.mjs && touch "$BUILD_STAMP")
}

# The local stand-ins for hosted services that `npm start` and `npm run dev` run beside the app and
# stop with it: one line each. (The tests start their own in tests/support/database-setup.ts.)
STAND_INS=(
  fake-services/mail/index.ts
  fake-services/payments/index.ts
)

pg_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1; }

ensure_postgres_binaries() {
  if [ -z "$(pg_bin)" ] || [ ! -x "$(pg_bin)/initdb" ]; then
    log "installing PostgreSQL from Debian"
    apt_install postgresql
    # Debian's package starts its own cluster on 5432; ours is separate, so stop that one.
    command -v pg_ctlcluster >/dev/null && pg_lsclusters -h 2>/dev/null | while read -r ver name _; do pg_ctlcluster "$ver" "$name" stop || true; done
  fi
  id postgres >/dev/null 2>&1 || useradd --system --home-dir /var/lib/postgresql --shell /usr/sbin/nologin postgres
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    log "installing Chromium from Debian (browser tests)"
    apt_install chromium
  fi
}

# pdftotext and pdfinfo: the tests read the PDFs the app renders with an extractor of their own.
ensure_poppler() {
  if ! command -v pdftotext >/dev/null; then
    log "installing poppler-utils from Debian (PDF checks in the tests)"
    apt_install poppler-utils
  fi
}

# wrk: the scan benchmark's load generator (scripts/bench/scans.lua), a C client as pgbench's is.
ensure_wrk() {
  if ! command -v wrk >/dev/null; then
    log "installing wrk from Debian (the scan benchmark's load generator)"
    apt_install wrk
  fi
}

# The cluster lives in .data/ of the checkout when the postgres user can reach it, else in a
# folder of its own under the temporary folder, named after a hash of the checkout path.
pg_root_for() { # $1 = name (start|test)
  local name=$1 candidate="$ROOT/.data/pg-$1"
  mkdir -p "$ROOT/.data"
  if runuser -u postgres -- test -x "$ROOT/.data" 2>/dev/null; then
    echo "$candidate"
  else
    echo "${TMPDIR:-/tmp}/fluxwright-$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)-pg-$name"
  fi
}

# pg_start ROOTDIR PORT [fast]  — "fast" turns fsync off (test clusters only).
pg_start() {
  local dir=$1 port=$2 mode=${3:-safe} bin
  bin=$(pg_bin)
  install -d -o postgres -g postgres -m 700 "$dir"
  install -d -o postgres -g postgres -m 700 "$dir/sock"
  if [ ! -s "$dir/data/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in $dir"
    runuser -u postgres -- "$bin/initdb" -D "$dir/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  fi
  if runuser -u postgres -- "$bin/pg_ctl" -D "$dir/data" status >/dev/null 2>&1; then
    log "PostgreSQL already running in $dir"
    return 0
  fi
  local opts="-c listen_addresses=127.0.0.1 -p $port -k $dir/sock"
  [ "$mode" = fast ] && opts="$opts -c fsync=off -c synchronous_commit=off -c full_page_writes=off"
  runuser -u postgres -- "$bin/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -t 30 -o "$opts" start >/dev/null
  log "PostgreSQL listening on 127.0.0.1:$port (data in $dir/data)"
}

pg_stop() {
  local dir=$1
  runuser -u postgres -- "$(pg_bin)/pg_ctl" -D "$dir/data" -m fast -w stop >/dev/null 2>&1 || true
}

# pg_createdb PORT NAME — idempotent.
pg_createdb() {
  local port=$1 name=$2
  if ! psql -h 127.0.0.1 -p "$port" -U postgres -tAc "select 1 from pg_database where datname='$name'" | grep -q 1; then
    psql -h 127.0.0.1 -p "$port" -U postgres -qc "create database \"$name\"" >/dev/null
  fi
}
