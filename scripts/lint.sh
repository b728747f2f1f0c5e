#!/usr/bin/env bash
# `npm run lint` (and the first step of `npm test`): eslint with scripts/lint/eslint.config.js over
# the whole project, then two probes proving the one-way import rule still refuses what it must.
source "$(dirname "$0")/lib/common.sh"
cd "$ROOT"
ensure_lint_modules
eslint() { "$ROOT/scripts/lint/node_modules/.bin/eslint" --config scripts/lint/eslint.config.js "$@"; }

rc=0
eslint . || rc=1
probe() { # probe FILE SOURCE: the rule must reject this import
  if printf '%s\n' "$2" | eslint --stdin --stdin-filename "$1" >/dev/null 2>&1; then
    log "lint: the one-way import rule let \"$2\" through in $1"
    rc=1
  fi
}
probe shared/physics/boundary-probe.ts 'import { createApp } from "../../server/app"; export const x = createApp;'
probe src/features/admin/boundary-probe.ts 'import { AuthCard } from "../auth/auth-card"; export const x = AuthCard;'
[ $rc = 0 ] && log "lint: no problems"
exit $rc
