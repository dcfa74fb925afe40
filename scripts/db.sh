#!/usr/bin/env bash
# Private MariaDB for Isopleth: data under .data/, bound to 127.0.0.1 only, never reading /etc/mysql.
#   db.sh start | stop | status | ensure-db NAME | reset-db NAME | sql [NAME]
set -euo pipefail
source "$(dirname "$0")/env.sh"

admin() { mariadb --no-defaults --socket="$DB_SOCKET" -u "$(id -un)" "$@"; }

is_running() {
  [ -f "$DB_PIDFILE" ] && kill -0 "$(cat "$DB_PIDFILE")" 2>/dev/null
}

ping_db() {
  mariadb-admin --no-defaults --socket="$DB_SOCKET" -u "$(id -un)" --connect-timeout=1 ping >/dev/null 2>&1
}

init_datadir() {
  command -v mariadbd >/dev/null || die "mariadbd not found: run scripts/system-deps.sh first"
  if [ ! -d "$DB_DATADIR/mysql" ]; then
    log "initialising a private data directory in ${DB_DATADIR#$ROOT_DIR/}"
    mkdir -p "$DB_DATADIR" "$DB_RUNDIR"
    mariadb-install-db --no-defaults --datadir="$DB_DATADIR" --skip-test-db --skip-name-resolve \
      --innodb-log-file-size=16M >"$DB_RUNDIR/install.log" 2>&1 \
      || { cat "$DB_RUNDIR/install.log" >&2; die "mariadb-install-db failed"; }
  fi
  mkdir -p "$DB_RUNDIR"
}

start() {
  if is_running && ping_db; then log "MariaDB already running on 127.0.0.1:$DB_PORT"; ensure_user; return 0; fi
  init_datadir
  rm -f "$DB_SOCKET"
  log "starting MariaDB on 127.0.0.1:$DB_PORT"
  setsid mariadbd --no-defaults --user="$(id -un)" \
    --datadir="$DB_DATADIR" --socket="$DB_SOCKET" --pid-file="$DB_PIDFILE" \
    --log-error="$DB_LOG" --bind-address=127.0.0.1 --port="$DB_PORT" --skip-name-resolve \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci --default-time-zone=+00:00 \
    --innodb-buffer-pool-size=64M --innodb-log-file-size=16M --max-connections=100 \
    </dev/null >/dev/null 2>&1 &
  local pid=$! waited=0
  until ping_db; do
    kill -0 "$pid" 2>/dev/null || { tail -n 20 "$DB_LOG" >&2 || true; die "mariadbd exited during start-up"; }
    sleep 0.1; waited=$((waited + 1))
    [ "$waited" -lt 300 ] || die "MariaDB did not accept connections within 30 s (log: $DB_LOG)"
  done
  ensure_user
}

ensure_user() {
  admin <<SQL
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
CREATE USER IF NOT EXISTS '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
-- tests create and drop their own throwaway databases named ${DB_NAME}_test...
GRANT ALL PRIVILEGES ON \`${DB_NAME}\\_test%\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`${DB_NAME}\\_test%\`.* TO '$DB_USER'@'localhost';
SQL
}

ensure_db() {
  local name="$1"
  [[ "$name" =~ ^[A-Za-z0-9_]+$ ]] || die "bad database name: $name"
  admin <<SQL
CREATE DATABASE IF NOT EXISTS \`$name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
GRANT ALL PRIVILEGES ON \`$name\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$name\`.* TO '$DB_USER'@'localhost';
SQL
}

reset_db() {
  local name="$1"
  [[ "$name" =~ ^[A-Za-z0-9_]+$ ]] || die "bad database name: $name"
  admin -e "DROP DATABASE IF EXISTS \`$name\`;"
  ensure_db "$name"
}

stop() {
  if ! is_running; then log "MariaDB is not running"; return 0; fi
  local pid; pid="$(cat "$DB_PIDFILE")"
  log "stopping MariaDB (pid $pid)"
  kill -TERM "$pid"
  for _ in $(seq 1 300); do kill -0 "$pid" 2>/dev/null || { log "MariaDB stopped"; return 0; }; sleep 0.1; done
  die "MariaDB did not stop within 30 s"
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if is_running && ping_db; then echo "running on 127.0.0.1:$DB_PORT"; else echo "stopped"; exit 1; fi ;;
  ensure-db) ensure_db "${2:?database name}" ;;
  reset-db) reset_db "${2:?database name}" ;;
  sql) shift; admin "$@" ;;
  *) echo "usage: $0 start|stop|status|ensure-db NAME|reset-db NAME|sql [args]" >&2; exit 2 ;;
esac
