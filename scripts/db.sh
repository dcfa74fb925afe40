#!/usr/bin/env bash
# Private MariaDB for Isopleth: data under .data/, bound to 127.0.0.1 only, never reading /etc/mysql.
#   db.sh start | stop | status | ensure-db NAME | reset-db NAME | sql [NAME]
set -euo pipefail
source "$(dirname "$0")/env.sh"

admin() { mariadb --no-defaults --socket="$DB_SOCKET" -u "$(id -un)" "$@"; }

# The pid file names a live mariadbd (not a stale file whose pid now belongs to something else).
is_running() {
  local pid
  pid="$(cat "$DB_PIDFILE" 2>/dev/null)" || return 1
  [[ "$pid" =~ ^[0-9]+$ ]] && kill -0 "$pid" 2>/dev/null && [ "$(cat "/proc/$pid/comm" 2>/dev/null)" = mariadbd ]
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

# What mariadbd wrote during this start only: its log from where it stood before, and its own stdout/stderr
# (where it writes when it cannot open the log, e.g. in a read-only data folder).
show_start_output() { # show_start_output LOG_OFFSET CONSOLE_FILE
  local offset="$1" size=0
  [ -f "$DB_LOG" ] && size="$(stat -c %s "$DB_LOG")"
  [ "$size" -ge "$offset" ] || offset=0
  {
    echo "---- MariaDB output of this start ----"
    if [ "$size" -gt "$offset" ]; then tail -c +"$((offset + 1))" "$DB_LOG" | tail -n 40; fi
    [ -s "$2" ] && tail -n 40 "$2"
    echo "---- (full log: $DB_LOG) ----"
  } >&2
}

start() {
  mkdir -p "$DB_RUNDIR"
  # Two starts at once (npm start beside npm run dev) must not both launch a mariadbd on one data folder.
  { exec 8>>"$DB_RUNDIR/db.lock"; } 2>/dev/null || exec 8<"$DB_RUNDIR/db.lock"   # read-only folder: lock all the same
  flock -w 60 8 || die "another db.sh start on $DATA_DIR did not finish within 60 s"
  if is_running && ping_db; then log "MariaDB already running on 127.0.0.1:$DB_PORT"; ensure_user; return 0; fi
  if is_running; then die "a mariadbd (pid $(cat "$DB_PIDFILE")) runs on $DB_DATADIR but does not answer on $DB_SOCKET; stop it first (npm run db:stop)"; fi
  init_datadir
  rm -f "$DB_SOCKET"
  local offset=0 console
  [ -f "$DB_LOG" ] && offset="$(stat -c %s "$DB_LOG")"
  console="$(mktemp "${TMPDIR:-/tmp}/isopleth-mariadbd.XXXXXX")"
  log "starting MariaDB on 127.0.0.1:$DB_PORT"
  setsid mariadbd --no-defaults --user="$(id -un)" \
    --datadir="$DB_DATADIR" --socket="$DB_SOCKET" --pid-file="$DB_PIDFILE" \
    --log-error="$DB_LOG" --bind-address=127.0.0.1 --port="$DB_PORT" --skip-name-resolve \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci --default-time-zone=+00:00 \
    --innodb-buffer-pool-size=64M --innodb-log-file-size=16M --max-connections=100 \
    </dev/null >"$console" 2>&1 8>&- &
  local pid=$! waited=0
  # Known at once (mariadbd writes the same pid later), so a stop during start-up finds the server.
  { echo "$pid" >"$DB_PIDFILE"; } 2>/dev/null || true
  until ping_db; do
    if ! kill -0 "$pid" 2>/dev/null; then
      show_start_output "$offset" "$console"
      rm -f "$console"
      die "mariadbd exited during start-up (its output is above)"
    fi
    sleep 0.1; waited=$((waited + 1))
    [ "$waited" -lt 300 ] || { show_start_output "$offset" "$console"; rm -f "$console"; die "MariaDB did not accept connections within 30 s"; }
  done
  rm -f "$console"
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
