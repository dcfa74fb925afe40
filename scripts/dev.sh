#!/usr/bin/env bash
# npm run dev: development server with hot reload. The database keeps running afterwards
# (stop it with `npm run db:stop`).
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT_DIR"
bash scripts/system-deps.sh
bash scripts/node-deps.sh
bash scripts/db.sh start
bash scripts/db.sh ensure-db "$DB_NAME"
source scripts/app-env.sh
export NODE_ENV=development
export DATABASE_URL="${DATABASE_URL:-$(database_url "$DB_NAME")}"
node_modules/.bin/tsx scripts/migrate.ts
node_modules/.bin/tsx scripts/seed.ts
node_modules/.bin/tsx scripts/fake-smtp.ts "$SMTP_PORT" "$SMTP_HTTP_PORT" &
smtp_pid=$!
trap 'kill -TERM $smtp_pid 2>/dev/null || true' EXIT
node_modules/.bin/react-router dev --host "$HOST" --port "$PORT"
