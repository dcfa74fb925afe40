#!/usr/bin/env bash
# Runs `npm ci` when node_modules is missing or does not hold the packages package-lock.json locks.
# A lock file newer than node_modules is compared by content first: a git checkout, a worktree or a copy
# touches its date without changing a package, and `npm ci` would then reinstall everything for nothing.
set -euo pipefail
source "$(dirname "$0")/env.sh"
cd "$ROOT_DIR"

locked_packages_differ() {
  node -e '
    const fs = require("node:fs");
    const locked = JSON.parse(fs.readFileSync("package-lock.json", "utf8")).packages ?? {};
    const installed = JSON.parse(fs.readFileSync("node_modules/.package-lock.json", "utf8")).packages ?? {};
    for (const [key, pkg] of Object.entries(locked)) {
      if (key === "" || key.startsWith("node_modules/") === false) continue;
      const have = installed[key];
      if (have ? have.version !== pkg.version : !pkg.optional) process.exit(0);
    }
    for (const key of Object.keys(installed)) if (!(key in locked)) process.exit(0);
    process.exit(1);
  '
}

if [ ! -f node_modules/.package-lock.json ] \
  || { [ package-lock.json -nt node_modules/.package-lock.json ] && locked_packages_differ; }; then
  log "installing npm packages (npm ci)"
  npm ci --no-audit --no-fund --loglevel=error
fi
