#!/usr/bin/env bash
# Runs `npm ci` when node_modules is missing or older than package-lock.json.
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT_DIR"
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  log "installing npm packages (npm ci)"
  npm ci --no-audit --no-fund --loglevel=error
fi
