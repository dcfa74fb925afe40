#!/usr/bin/env bash
# npm start: everything from a fresh clone to a served app on http://127.0.0.1:3000 (PORT to change).
# Installs missing Debian packages and npm packages, starts the private MariaDB, migrates, seeds the
# invented demo data, builds when sources changed, then serves. Ctrl-C stops the app, the fake mail
# server and (if this script started it) the database.
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT_DIR"
started=$SECONDS

bash scripts/system-deps.sh
bash scripts/node-deps.sh

db_started_here=0
if ! bash scripts/db.sh status >/dev/null 2>&1; then
  bash scripts/db.sh start
  db_started_here=1
fi
bash scripts/db.sh ensure-db "$DB_NAME"

source scripts/app-env.sh
export NODE_ENV=production
export DATABASE_URL="${DATABASE_URL:-$(database_url "$DB_NAME")}"

pids=()
cleanup() {
  trap - EXIT INT TERM
  for pid in "${pids[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  for _ in $(seq 1 50); do
    alive=0
    for pid in "${pids[@]}"; do kill -0 "$pid" 2>/dev/null && alive=1; done
    [ "$alive" = 0 ] && break
    sleep 0.1
  done
  for pid in "${pids[@]}"; do kill -KILL "$pid" 2>/dev/null || true; done
  if [ "$db_started_here" = 1 ]; then bash scripts/db.sh stop || true; fi
}
trap cleanup EXIT
trap 'exit 130' INT TERM

node_modules/.bin/tsx scripts/migrate.ts
node_modules/.bin/tsx scripts/seed.ts

stamp=build/.source-stamp
if [ ! -f "$stamp" ] || [ -n "$(find app public package-lock.json vite.config.ts react-router.config.ts -newer "$stamp" -print -quit)" ]; then
  log "building the production bundle"
  npm run -s build >/dev/null
  touch "$stamp"
fi

node_modules/.bin/tsx scripts/fake-smtp.ts "$SMTP_PORT" "$SMTP_HTTP_PORT" &
pids+=($!)
log "ready in $((SECONDS - started)) s: serving Isopleth on http://$HOST:$PORT"
node scripts/server.mjs build/server/index.js &
pids+=($!)
wait -n "${pids[@]}"
