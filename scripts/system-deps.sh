#!/usr/bin/env bash
# Installs the Debian packages Isopleth needs when they are missing: mariadb-server always,
# chromium with --test (end-to-end tests drive Debian's browser; Playwright never downloads one).
set -euo pipefail
source "$(dirname "$0")/env.sh"

node_ok=$(node -e 'const [a,b]=process.versions.node.split(".").map(Number);console.log((a===20&&b>=19)||(a===22&&b>=12)||a>22?"yes":"no")')
[ "$node_ok" = yes ] || die "Node.js >=20.19 <21 or >=22.12 is required (found $(node -v))"

missing=()
command -v mariadbd >/dev/null || missing+=(mariadb-server)
if [ "${1:-}" = "--test" ]; then
  [ -x /usr/bin/chromium ] || missing+=(chromium)
fi
[ ${#missing[@]} -eq 0 ] && exit 0

SUDO=""
[ "$(id -u)" -eq 0 ] || SUDO="sudo"
log "installing Debian packages: ${missing[*]}"
$SUDO apt-get update -qq
DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
