#!/usr/bin/env bash
# npm run restore -- FILE [--database NAME] [--force] [--with-secrets]
# Restores an archive written by `npm run backup` into the configured database, or into the database NAME
# (created when missing). Refuses a database that has tables unless --force (which drops them first).
# The archive's secrets.env is installed when the data folder has none; --with-secrets replaces a different one.
set -euo pipefail
source "$(dirname "$0")/env.sh"
source "$(dirname "$0")/db-conn.sh"

usage() { echo "usage: npm run restore -- FILE [--database NAME] [--force] [--with-secrets]" >&2; exit 2; }
archive="" target="$CONN_DB" force=0 with_secrets=0
while [ $# -gt 0 ]; do
  case "$1" in
    --database|-d) [ $# -ge 2 ] || usage; target="$2"; shift 2 ;;
    --force) force=1; shift ;;
    --with-secrets) with_secrets=1; shift ;;
    -h|--help) usage ;;
    -*) log "error: unknown option: $1"; usage ;;
    *) [ -z "$archive" ] || usage; archive="$1"; shift ;;
  esac
done
[ -n "$archive" ] || usage
[ -f "$archive" ] || die "no such backup archive: $archive"
[[ "$target" =~ ^[A-Za-z0-9_]+$ ]] || die "bad database name: $target (letters, digits and _ only)"

umask 077
work="$(mktemp -d "${TMPDIR:-/tmp}/isopleth-restore.XXXXXX")"
trap 'rm -rf "$work"' EXIT
tar -C "$work" -xzf "$archive" database.sql manifest.txt 2>/dev/null \
  || die "$archive is not an Isopleth backup (no database.sql and manifest.txt inside)"
tar -C "$work" -xzf "$archive" secrets.env 2>/dev/null || true
tail -n 1 "$work/database.sql" | grep -q '^-- Dump completed' || die "the dump in $archive is incomplete; nothing restored"
write_client_config "$work/client.cnf"
sql() { mariadb --defaults-file="$work/client.cnf" -N -B "$@"; }

exists="$(sql -e "SELECT COUNT(*) FROM information_schema.SCHEMATA WHERE SCHEMA_NAME = '$target'")"
if [ "$exists" = 0 ]; then
  if [ -S "$DB_SOCKET" ] && [ "$CONN_PORT" = "$DB_PORT" ] && [[ "$CONN_HOST" =~ ^(127\.0\.0\.1|localhost)$ ]]; then
    bash "$(dirname "$0")/db.sh" ensure-db "$target"   # our private MariaDB: created and granted as its admin
  else
    sql -e "CREATE DATABASE \`$target\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci" \
      || die "cannot create database $target as $CONN_USER; create it (empty) and run the restore again"
  fi
  log "created database $target"
else
  tables="$(sql -e "SELECT COUNT(*) FROM information_schema.TABLES WHERE TABLE_SCHEMA = '$target'")"
  if [ "$tables" != 0 ]; then
    [ "$force" = 1 ] || die "database $target is not empty ($tables tables); nothing restored. Restore into a fresh database with --database NEW_NAME, or pass --force to replace its contents"
    log "--force: dropping the $tables tables and views of $target"
    drops="$(sql -e "SELECT CONCAT('DROP ', IF(TABLE_TYPE = 'VIEW', 'VIEW', 'TABLE'), ' IF EXISTS \`', TABLE_NAME, '\`;') FROM information_schema.TABLES WHERE TABLE_SCHEMA = '$target'")"
    sql "$target" -e "SET FOREIGN_KEY_CHECKS = 0; $drops"
  fi
fi

log "restoring $(grep '^created_at=' "$work/manifest.txt" | cut -d= -f2) backup of $(grep '^database=' "$work/manifest.txt" | cut -d= -f2) into $target"
sql "$target" <"$work/database.sql" \
  || die "loading the dump into $target failed part-way; the database is incomplete: fix the cause and restore again with --force"
log "restored $(sql -e "SELECT COUNT(*) FROM information_schema.TABLES WHERE TABLE_SCHEMA = '$target'") tables into $target"

secrets="$DATA_DIR/secrets.env"
if [ -f "$work/secrets.env" ]; then
  if [ ! -f "$secrets" ]; then
    mkdir -p "$DATA_DIR"
    install -m 600 "$work/secrets.env" "$secrets"
    log "installed the backup's secrets into $secrets"
  elif ! cmp -s "$work/secrets.env" "$secrets"; then
    if [ "$with_secrets" = 1 ]; then
      cp -p "$secrets" "$secrets.before-restore-$(date -u +%Y%m%dT%H%M%SZ)"
      install -m 600 "$work/secrets.env" "$secrets"
      log "replaced $secrets with the backup's secrets (the old file is kept beside it)"
    else
      log "warning: $secrets differs from the backup's; kept the current one. Sessions and API tokens issued before the backup will not be accepted; pass --with-secrets to install the backup's secrets"
    fi
  fi
fi
log "done. If this build is newer than the backup, apply its migrations: npm run db:migrate"
