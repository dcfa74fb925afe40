#!/usr/bin/env bash
# npm start: everything from a fresh clone to a served app on http://127.0.0.1:3000 (PORT to change).
# Installs missing Debian packages and npm packages, starts the private MariaDB, migrates, seeds the
# invented demo data, builds when sources changed, then serves. Ctrl-C (or SIGTERM to npm) stops the app,
# the fake mail server and (if this script started it) the database.
# One npm start per data folder (ISOPLETH_DATA_DIR); the ports it needs (PORT, DB_PORT, SMTP_PORT,
# SMTP_HTTP_PORT) are checked before anything starts, and "ready" is printed once the app answers.
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT_DIR"
started=$SECONDS

# One npm start per data folder: a second one would start a second MariaDB on the same files.
# The lock is held on fd 9 for the life of this script; children that outlive a step do not get it.
mkdir -p "$DB_RUNDIR"
lockfile="$DB_RUNDIR/start.lock"
{ exec 9>>"$lockfile"; } 2>/dev/null || exec 9<"$lockfile"   # read-only folder: lock all the same
if ! flock -n 9; then
  die "another npm start (pid $(cat "$lockfile" 2>/dev/null || echo '?')) is already serving the data folder $DATA_DIR; stop it first (Ctrl-C there), or give this one its own ISOPLETH_DATA_DIR"
fi
{ echo $$ >"$lockfile"; } 2>/dev/null || true

source scripts/app-env.sh

db_running=0
bash scripts/db.sh status >/dev/null 2>&1 9>&- && db_running=1
ports=("PORT=$PORT@$HOST" "SMTP_PORT=$SMTP_PORT" "SMTP_HTTP_PORT=$SMTP_HTTP_PORT")
[ "$db_running" = 1 ] || ports+=("DB_PORT=$DB_PORT")
node scripts/check-ports.mjs 127.0.0.1 "${ports[@]}" 9>&- \
  || die "the ports above are taken; free them or choose others (PORT, DB_PORT, SMTP_PORT, SMTP_HTTP_PORT)"

pids=()
fg_pid=""
db_started_here=0
cleanup() {
  local status=$?
  trap - EXIT INT TERM
  [ "$status" -ge 128 ] && log "stopping"
  [ -n "$fg_pid" ] && pids+=("$fg_pid")
  for pid in "${pids[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  # The app server finishes requests in flight first (up to SHUTDOWN_TIMEOUT_MS, 15 s by default).
  for _ in $(seq 1 $(( ${SHUTDOWN_TIMEOUT_MS:-15000} / 100 + 20 ))); do
    alive=0
    for pid in "${pids[@]}"; do kill -0 "$pid" 2>/dev/null && alive=1; done
    [ "$alive" = 0 ] && break
    sleep 0.1
  done
  for pid in "${pids[@]}"; do kill -KILL "$pid" 2>/dev/null || true; done
  if [ "$db_started_here" = 1 ]; then bash scripts/db.sh stop 9>&- || true; fi
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

# `npm start` runs this script through `sh -c`; a SIGTERM to npm is passed to that sh, which dies without
# passing it on. So this script watches its parent and stops everything when the parent is gone.
parent=$PPID
( while kill -0 "$parent" 2>/dev/null; do sleep 0.3; done; kill -TERM $$ 2>/dev/null ) 9>&- &
pids+=($!)

# Each set-up step runs in the background and is waited for, so that a signal stops it at once
# (bash runs a trap only after a foreground command ends) and cleanup can stop it.
step() {
  "$@" 9>&- &
  fg_pid=$!
  local status=0
  wait "$fg_pid" || status=$?
  fg_pid=""
  return "$status"
}

step bash scripts/system-deps.sh
step bash scripts/node-deps.sh

if [ "$db_running" = 0 ]; then
  db_started_here=1
  step bash scripts/db.sh start
fi
step bash scripts/db.sh ensure-db "$DB_NAME"

export NODE_ENV=production
export DATABASE_URL="${DATABASE_URL:-$(database_url "$DB_NAME")}"

step node_modules/.bin/tsx scripts/migrate.ts
step node_modules/.bin/tsx scripts/seed.ts

stamp=build/.source-stamp
if [ ! -f "$stamp" ] || [ -n "$(find app public package-lock.json vite.config.ts react-router.config.ts -newer "$stamp" -print -quit)" ]; then
  log "building the production bundle"
  step npm run -s build >/dev/null
  touch "$stamp"
fi

node_modules/.bin/tsx scripts/fake-smtp.ts "$SMTP_PORT" "$SMTP_HTTP_PORT" 9>&- &
pids+=($!)
node scripts/server.mjs build/server/index.js 9>&- &
pids+=($!)
step node scripts/wait-ready.mjs "http://$HOST:$PORT/api/health" 60 "${pids[@]}" \
  || die "Isopleth did not start (see the messages above)"
log "ready in $((SECONDS - started)) s: serving Isopleth on http://$HOST:$PORT"
wait -n "${pids[@]}"
