# Shared settings for the shell scripts. Sourced, not executed.
# Every value can be overridden from the environment.
ROOT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export PATH="$PATH:/usr/sbin:/usr/local/sbin"

DATA_DIR="${ISOPLETH_DATA_DIR:-$ROOT_DIR/.data}"
DB_PORT="${DB_PORT:-3316}"
DB_NAME="${DB_NAME:-isopleth}"
DB_USER="${DB_USER:-isopleth}"
DB_PASSWORD="${DB_PASSWORD:-isopleth-local-dev}"
DB_DATADIR="$DATA_DIR/mariadb"
DB_RUNDIR="$DATA_DIR/run"
DB_SOCKET="$DB_RUNDIR/mariadb.sock"
DB_PIDFILE="$DB_RUNDIR/mariadb.pid"
DB_LOG="$DB_RUNDIR/mariadb.err"

log() { printf '\033[1m[%s]\033[0m %s\n' "$(basename "$0")" "$*" >&2; }
die() { log "error: $*"; exit 1; }

database_url() { # database_url NAME
  printf 'mysql://%s:%s@127.0.0.1:%s/%s' "$DB_USER" "$DB_PASSWORD" "$DB_PORT" "$1"
}
