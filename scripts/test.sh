#!/usr/bin/env bash
# npm test: from a fresh clone, every layer of tests against real parts —
# lint and format check, type-check, unit tests, integration tests on a private MariaDB (its own databases,
# emptied first), and Playwright end-to-end tests of the production build in Debian's chromium.
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT_DIR"
started=$SECONDS

bash scripts/system-deps.sh --test
bash scripts/node-deps.sh

# Route types first (generated, not committed): knip and tsc resolve each route's ./+types import through them.
node_modules/.bin/react-router typegen >/dev/null

# Cheapest first: a lint finding or an unformatted file fails in seconds, before the database starts.
log "lint (eslint)"
npm run -s lint

log "format check (prettier)"
node_modules/.bin/prettier --check --log-level warn .

log "unused files, exports and dependencies (knip)"
node_modules/.bin/knip --no-progress

db_started_here=0
if ! bash scripts/db.sh status >/dev/null 2>&1; then
  bash scripts/db.sh start
  db_started_here=1
fi
cleanup() { if [ "$db_started_here" = 1 ]; then bash scripts/db.sh stop || true; fi; }
trap cleanup EXIT

export TEST_DB_NAME="${DB_NAME}_test"
export E2E_DB_NAME="${DB_NAME}_e2e"
bash scripts/db.sh reset-db "$TEST_DB_NAME"
bash scripts/db.sh reset-db "$E2E_DB_NAME"
export TEST_DATABASE_URL="$(database_url "$TEST_DB_NAME")"
export E2E_DATABASE_URL="$(database_url "$E2E_DB_NAME")"
export DB_PORT DB_USER DB_PASSWORD

log "type-check"
node_modules/.bin/tsc

# Built before the integration tests: tests/integration/start-script.db.test.ts runs `npm start`, which then
# finds the bundle current instead of building it again.
log "production build"
npm run -s build >/dev/null
touch build/.source-stamp

log "unit and integration tests"
node_modules/.bin/vitest run

log "end-to-end tests (Debian chromium)"
DATABASE_URL="$E2E_DATABASE_URL" node_modules/.bin/tsx scripts/migrate.ts
DATABASE_URL="$E2E_DATABASE_URL" node_modules/.bin/tsx scripts/seed.ts
node_modules/.bin/playwright test -c tests/playwright.config.ts

log "all suites passed in $((SECONDS - started)) s"
