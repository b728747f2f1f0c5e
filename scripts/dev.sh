#!/usr/bin/env bash
# `npm run dev`: the same database and stand-ins as `npm start`, with the server restarting on change
# (tsx watch) and the client hot-reloading on http://127.0.0.1:5173 (vite proxies /api to the server).
source "$(dirname "$0")/lib/common.sh"
export PORT=${PORT:-4100} PGPORT=${PGPORT:-54329} SMTP_PORT=${SMTP_PORT:-4125} MAIL_WEB_PORT=${MAIL_WEB_PORT:-4126}
export PAYMENTS_PORT=${PAYMENTS_PORT:-4110}
export APP_URL=${APP_URL:-http://127.0.0.1:5173}
unset NODE_ENV # npm installs everything; the server below runs as development
ensure_node_modules
ensure_postgres_binaries
PGROOT=$(pg_root_for "start-$PGPORT")
children=()
started_pg=0
stopping=0
runuser -u postgres -- "$(pg_bin)/pg_ctl" -D "$PGROOT/data" status >/dev/null 2>&1 || started_pg=1
cleanup() {
  [ $stopping = 1 ] && return
  stopping=1
  trap '' INT TERM
  for p in "${children[@]}"; do kill -TERM "$p" 2>/dev/null || true; done
  wait "${children[@]}" 2>/dev/null || true
  if [ $started_pg = 1 ]; then pg_stop "$PGROOT"; fi
}
trap 'cleanup; exit 130' INT TERM
trap cleanup EXIT
pg_start "$PGROOT" "$PGPORT"
pg_createdb "$PGPORT" fluxwright
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/fluxwright}
cd "$ROOT"
node --import tsx server/cli/migrate.ts
node --import tsx server/cli/seed.ts
for program in "${STAND_INS[@]}"; do
  node --import tsx "$program" & children+=($!)
done
# one process, so a change restarts it at once
NODE_ENV=development WEB_CONCURRENCY=${WEB_CONCURRENCY:-1} tool tsx watch server/index.ts & children+=($!)
tool vite --host 127.0.0.1 & children+=($!)
wait -n "${children[@]}"
