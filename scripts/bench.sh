#!/usr/bin/env bash
# `npm run bench`: speed figures against their targets, on a cluster of its own.
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"
ensure_node_modules
ensure_postgres_binaries
ensure_wrk
port=${BENCH_PGPORT:-54359}
while (echo >"/dev/tcp/127.0.0.1/$port") 2>/dev/null; do port=$((port + 1)); done
PGROOT=$(pg_root_for "bench-$port")
trap 'pg_stop "$PGROOT"' EXIT
pg_start "$PGROOT" "$port" fast
pg_createdb "$port" fluxwright_bench
export DATABASE_URL="postgres://postgres@127.0.0.1:$port/fluxwright_bench" NODE_ENV=production RATE_LIMIT_PUBLIC=0 LOG_LEVEL=silent
node --import tsx server/cli/migrate.ts >/dev/null
node --import tsx server/cli/seed.ts >/dev/null
tool vite build --logLevel warn
node --import tsx scripts/bench/run.ts "$@"
