#!/usr/bin/env bash
# npm run backup [-- --output DIR|FILE.tar.gz]: one timestamped archive of the configured database
# (mariadb-dump --single-transaction: a consistent snapshot while the app keeps running) and the secrets file,
# under $ISOPLETH_DATA_DIR/backups unless told otherwise. The archive is readable by its owner only (600).
set -euo pipefail
source "$(dirname "$0")/env.sh"
source "$(dirname "$0")/db-conn.sh"

usage() { echo "usage: npm run backup [-- --output DIR|FILE.tar.gz]" >&2; exit 2; }
output="$DATA_DIR/backups"
while [ $# -gt 0 ]; do
  case "$1" in
    --output|-o) [ $# -ge 2 ] || usage; output="$2"; shift 2 ;;
    -h|--help) usage ;;
    *) log "error: unknown argument: $1"; usage ;;
  esac
done

umask 077   # the backups folder, the staging folder and the archive: owner only
stamp="$(date -u +%Y%m%dT%H%M%SZ)"
if [[ "$output" == *.tar.gz ]]; then
  archive="$output"
else
  archive="$output/isopleth-$CONN_DB-$stamp.tar.gz"
fi
out_dir="$(dirname "$archive")"
mkdir -p "$out_dir"
[ -e "$archive" ] && die "$archive exists already; not overwriting it"

# Staged beside the archive (same disk, never a half-written archive under the final name).
stage="$(mktemp -d "$out_dir/.backup-$stamp.XXXXXX")"
trap 'rm -rf "$stage"' EXIT
write_client_config "$stage/client.cnf"

log "dumping database $CONN_DB on $CONN_HOST:$CONN_PORT"
mariadb-dump --defaults-file="$stage/client.cnf" --single-transaction --routines --triggers \
  --hex-blob --no-tablespaces --add-drop-table "$CONN_DB" >"$stage/database.sql" 2>"$stage/dump.err" \
  || { cat "$stage/dump.err" >&2; die "mariadb-dump failed; no archive written"; }
tail -n 1 "$stage/database.sql" | grep -q '^-- Dump completed' || die "the dump is incomplete; no archive written"

files=(database.sql manifest.txt)
if [ -f "$DATA_DIR/secrets.env" ]; then
  cp "$DATA_DIR/secrets.env" "$stage/secrets.env"
  files+=(secrets.env)
else
  log "warning: no $DATA_DIR/secrets.env; the archive holds the database only (keep the deployment's secrets elsewhere)"
fi
{
  echo "created_at=$(date -u +%Y-%m-%dT%H:%M:%SZ)"
  echo "database=$CONN_DB"
  echo "server=$(mariadb --defaults-file="$stage/client.cnf" -N -B -e 'SELECT VERSION()')"
  echo "tables=$(mariadb --defaults-file="$stage/client.cnf" -N -B -e "SELECT COUNT(*) FROM information_schema.TABLES WHERE TABLE_SCHEMA = '$CONN_DB'")"
  echo "migrations_applied=$(mariadb --defaults-file="$stage/client.cnf" -N -B "$CONN_DB" -e 'SELECT COUNT(*) FROM __drizzle_migrations' 2>/dev/null || echo 0)"
  echo "secrets_included=$([ -f "$stage/secrets.env" ] && echo yes || echo no)"
} >"$stage/manifest.txt"

tar -C "$stage" -czf "$stage/archive.tar.gz" "${files[@]}"
chmod 600 "$stage/archive.tar.gz"
mv "$stage/archive.tar.gz" "$archive"
log "backup written: $archive ($(du -h "$archive" | cut -f1))"
echo "$archive"
