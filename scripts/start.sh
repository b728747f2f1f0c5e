#!/usr/bin/env bash
# `npm start`: everything a fresh clone needs, then the app on http://127.0.0.1:$PORT, in the shape
# of a deployment: the client bundle in dist/, the server compiled to build/ and run by plain node
# with NODE_ENV=production (set for that process only). Ctrl-C stops every process this script
# started, the database server included; data stays in the cluster. Run again, it reuses what exists.
# The stand-ins it runs beside the app: STAND_INS in scripts/lib/common.sh.
source "$(dirname "$0")/lib/common.sh"

export PORT=${PORT:-4100} PGPORT=${PGPORT:-54329} SMTP_PORT=${SMTP_PORT:-4125} MAIL_WEB_PORT=${MAIL_WEB_PORT:-4126}
export PAYMENTS_PORT=${PAYMENTS_PORT:-4110}
export APP_URL=${APP_URL:-http://127.0.0.1:$PORT}
# Whatever the caller's NODE_ENV says, npm installs every dependency and the tools run with their
# defaults; only the server process gets NODE_ENV=production, below.
unset NODE_ENV

ensure_node_modules
ensure_postgres_binaries

PGROOT=$(pg_root_for "start-$PGPORT")
started_pg=0
children=()
stopping=0
cleanup() {
  [ $stopping = 1 ] && return
  stopping=1
  # A second Ctrl-C (or npm passing the first one on) must not cut the clean-up short.
  trap '' INT TERM
  log "stopping"
  for pid in "${children[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  wait "${children[@]}" 2>/dev/null || true
  if [ $started_pg = 1 ]; then pg_stop "$PGROOT"; log "PostgreSQL stopped (data kept in $PGROOT/data)"; fi
}
trap 'cleanup; exit 130' INT TERM
trap cleanup EXIT

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
if build_is_current; then
  log "client and server builds are up to date (build skipped)"
else
  log "building the client (dist/) and the server (build/)"
  build_all
fi
log "migrating the database"
node build/server/cli/migrate.js
node build/server/cli/seed.js

for program in "${STAND_INS[@]}"; do
  node --import tsx "$program" & children+=($!)
done
NODE_ENV=production node build/server/index.js & children+=($!)

healthy=0
for _ in $(seq 1 60); do
  if curl -fsS "http://127.0.0.1:$PORT/api/health" 2>/dev/null | grep -q '"database":"up"'; then healthy=1; break; fi
  sleep 0.5
done
if [ $healthy = 0 ]; then
  log "the app did not answer on http://127.0.0.1:$PORT/api/health within 30 s; see the messages above"
  exit 1
fi
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
# Ends when any of them stops; the trap then stops the rest.
wait -n "${children[@]}"
