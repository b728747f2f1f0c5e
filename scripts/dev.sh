#!/usr/bin/env bash
# `npm run dev`: the same database and fakes as `npm start`, with the server restarting on change
# (tsx watch) and the client hot-reloading on http://127.0.0.1:5173 (vite proxies /api to the server).
source "$(dirname "$0")/lib/common.sh"
export PORT=${PORT:-4100} PGPORT=${PGPORT:-54329} SMTP_PORT=${SMTP_PORT:-4125} MAIL_WEB_PORT=${MAIL_WEB_PORT:-4126}
export NODE_ENV=development APP_URL=${APP_URL:-http://127.0.0.1:5173}
ensure_node_modules
ensure_postgres_binaries
PGROOT=$(pg_root_for "start-$PGPORT")
children=()
started_pg=0
runuser -u postgres -- "$(pg_bin)/pg_ctl" -D "$PGROOT/data" status >/dev/null 2>&1 || started_pg=1
cleanup() { trap - INT TERM EXIT; for p in "${children[@]}"; do kill -TERM "$p" 2>/dev/null || true; done; wait 2>/dev/null; [ $started_pg = 1 ] && pg_stop "$PGROOT"; }
trap cleanup INT TERM EXIT
pg_start "$PGROOT" "$PGPORT"
pg_createdb "$PGPORT" fluxwright
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/fluxwright}
cd "$ROOT"
node --import tsx server/cli/migrate.ts
node --import tsx server/cli/seed.ts
node --import tsx fake-services/mail/index.ts & children+=($!)
npx tsx watch server/index.ts & children+=($!)
npx vite --host 127.0.0.1 & children+=($!)
wait -n "${children[@]}"
