#!/usr/bin/env bash
# `npm test`: its own set-up (dependencies, PostgreSQL, Chromium), its own cluster on another
# port than `npm start`'s, then every test; ends with one line "N passed, N failed".
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"
export NODE_ENV=test CI=${CI:-}

ensure_node_modules
ensure_lint_modules
ensure_postgres_binaries
ensure_chromium
ensure_poppler

# A free port from 54339 up, so a second run (or a running `npm start`) does not collide.
port=${TEST_PGPORT:-54339}
while (echo >"/dev/tcp/127.0.0.1/$port") 2>/dev/null; do port=$((port + 1)); done
PGROOT=$(pg_root_for "test-$port")
cleanup() { pg_stop "$PGROOT"; }
trap cleanup EXIT
pg_start "$PGROOT" "$port" fast
psql -h 127.0.0.1 -p "$port" -U postgres -qc "drop database if exists fluxwright_test" >/dev/null
psql -h 127.0.0.1 -p "$port" -U postgres -qc "create database fluxwright_test" >/dev/null
export DATABASE_URL="postgres://postgres@127.0.0.1:$port/fluxwright_test"

mkdir -p .test-results
rm -f .test-results/vitest.json
log "linting"
lint_rc=0
bash scripts/lint.sh || lint_rc=$?
log "type-checking"
tsc_rc=0
tool tsc -p tsconfig.json || tsc_rc=$?
log "building the client and the server"
build_rc=0
build_all || build_rc=$?

rc=0
tool vitest run --reporter=default --reporter=json --outputFile.json=.test-results/vitest.json "$@" || rc=$?
node scripts/test-summary.mjs .test-results/vitest.json "$lint_rc" "$tsc_rc" "$build_rc" || rc=1
[ $lint_rc = 0 ] && [ $tsc_rc = 0 ] && [ $build_rc = 0 ] || rc=1
exit $rc
