#!/usr/bin/env bash
# Runs Playwright specs alone (what npm test does for its last step): fresh e2e database, migrations, demo
# seed, production build, then `playwright test` with any arguments given, e.g. `bash scripts/e2e.sh api.spec.ts`.
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT_DIR"
bash scripts/db.sh start >/dev/null
export E2E_DATABASE_URL="$(database_url "${DB_NAME}_e2e")"
bash scripts/db.sh reset-db "${DB_NAME}_e2e"
DATABASE_URL="$E2E_DATABASE_URL" node_modules/.bin/tsx scripts/migrate.ts
DATABASE_URL="$E2E_DATABASE_URL" node_modules/.bin/tsx scripts/seed.ts
if [ "${SKIP_BUILD:-0}" != 1 ]; then npm run -s build >/dev/null; fi
node_modules/.bin/playwright test -c tests/playwright.config.ts "$@"
