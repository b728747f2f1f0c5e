#!/usr/bin/env bash
# `npm start`: everything a fresh clone needs, then the app on http://127.0.0.1:$PORT.
# Ctrl-C stops what this script started (the database server included); data stays in the cluster.
source "$(dirname "$0")/lib/common.sh"

export PORT=${PORT:-4100} PGPORT=${PGPORT:-54329} SMTP_PORT=${SMTP_PORT:-4125} MAIL_WEB_PORT=${MAIL_WEB_PORT:-4126}
export PAYMENTS_PORT=${PAYMENTS_PORT:-4110}
export NODE_ENV=${NODE_ENV:-production}
export APP_URL=${APP_URL:-http://127.0.0.1:$PORT}

ensure_node_modules
ensure_postgres_binaries

PGROOT=$(pg_root_for "start-$PGPORT")
started_pg=0
children=()
cleanup() {
  trap - INT TERM EXIT
  log "stopping"
  for pid in "${children[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  if [ $started_pg = 1 ]; then pg_stop "$PGROOT"; log "PostgreSQL stopped (data kept in $PGROOT/data)"; fi
}
trap cleanup INT TERM EXIT

if ! runuser -u postgres -- "$(pg_bin)/pg_ctl" -D "$PGROOT/data" status >/dev/null 2>&1; then started_pg=1; fi
pg_start "$PGROOT" "$PGPORT"
pg_createdb "$PGPORT" fluxwright
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/fluxwright}
# A stable session secret per checkout, so that sign-ins survive a restart.
if [ -z "${SESSION_SECRET:-}" ]; then
  [ -s "$ROOT/.data/session-secret" ] || head -c 32 /dev/urandom | od -An -tx1 | tr -d ' \n' >"$ROOT/.data/session-secret"
  export SESSION_SECRET=$(cat "$ROOT/.data/session-secret")
fi

cd "$ROOT"
log "building the client"
npx vite build --logLevel warn
log "migrating the database"
node --import tsx server/cli/migrate.ts
node --import tsx server/cli/seed.ts

node --import tsx fake-services/mail/index.ts & children+=($!)
node --import tsx fake-services/payments/index.ts & children+=($!)
node --import tsx server/index.ts & children+=($!)

for _ in $(seq 1 60); do curl -fsS "http://127.0.0.1:$PORT/api/health" >/dev/null 2>&1 && break; sleep 0.5; done
cat <<TEXT

  Fluxwright is running.
    app              $APP_URL
    design check     $APP_URL/design-check
    flat blank       $APP_URL/flat-blank
    mail inbox       http://127.0.0.1:$MAIL_WEB_PORT   (every mail the app sends lands here)
    payments         http://127.0.0.1:$PAYMENTS_PORT   (local stand-in: no money moves)
    database         postgres://postgres@127.0.0.1:$PGPORT/fluxwright

  Demo sign-ins (password: ${DEMO_PASSWORD:-fluxwright-demo})
    customer@demo.test    customer engineer, Fernhollow Instruments (invented)
    customer2@demo.test   customer engineer, Quillbrook Beam Lab (invented)
    operator@demo.test    shop-floor operator, Wrenfield Shield Works (invented)
    qa@demo.test          quality inspector
    admin@demo.test       planner / shop manager

  Ctrl-C stops everything this command started.
TEXT
wait -n "${children[@]}"
