#!/usr/bin/env bash
# `npm run db:restore -- <file> [target-db] [--force]`: pg_restore a backup made by `npm run db:backup`
# into a database on the same cluster as DATABASE_URL (default: the dev database on 127.0.0.1:54329,
# signed in with .data/pg.password).
# The target defaults to edgewise_restore_<UTC timestamp>, a fresh database. Restoring over an
# existing database — the live one included — needs --force, which drops and recreates it.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

usage() { echo "usage: npm run db:restore -- <backup file> [target database] [--force]" >&2; exit 2; }

force=0 args=()
for arg in "$@"; do
  case "$arg" in
    --force) force=1 ;;
    -h|--help) usage ;;
    -*) echo "Unknown option: $arg" >&2; usage ;;
    *) args+=("$arg") ;;
  esac
done
[ "${#args[@]}" -ge 1 ] && [ "${#args[@]}" -le 2 ] || usage
file="${args[0]}"
target="${args[1]:-edgewise_restore_$(date -u +%Y%m%dT%H%M%SZ)}"

[ -f "$file" ] || fail "no backup file at $file."
[[ "$target" =~ ^[A-Za-z_][A-Za-z0-9_]{0,62}$ ]] ||
  fail "'$target' is not a plain database name (letters, digits and _, not starting with a digit)."

DATABASE_URL="${DATABASE_URL:-$(PGDATA="$DATA_DIR/pg" PGPORT=54329 local_database_url edgewise)}"
live="${DATABASE_URL##*/}"; live="${live%%\?*}"
server="${DATABASE_URL%/*}"
admin_url="$server/postgres"

BIN=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
[ -x "${BIN:-}/pg_restore" ] || fail "pg_restore was not found under /usr/lib/postgresql/*/bin: install Debian's postgresql package."

"$BIN/pg_restore" --list "$file" >/dev/null 2>&1 || fail "$file is not a backup that pg_restore can read (make one with 'npm run db:backup')."

psql_admin() { PGOPTIONS="-c client_min_messages=warning" "$BIN/psql" -X -q -v ON_ERROR_STOP=1 --dbname="$admin_url" "$@"; }

exists=$(psql_admin -tAc "select 1 from pg_database where datname = '$target'") ||
  fail "cannot reach the database server at $(redact_url "$server") (is it running? 'npm run dev' or 'bash scripts/postgres.sh up' starts it)."
if [ "$exists" = 1 ]; then
  if [ "$force" != 1 ]; then
    what="database $target already exists"
    [ "$target" = "$live" ] && what="$target is the live database (DATABASE_URL)"
    fail "$what; restoring would replace everything in it. Name a new database, or add --force to drop and replace it."
  fi
  step "Dropping $target (--force)"
  psql_admin -c "drop database \"$target\" with (force)"
fi

step "Creating database $target"
psql_admin -c "create database \"$target\""
step "Restoring ${file#$ROOT/} into $target"
"$BIN/pg_restore" --no-owner --no-privileges --exit-on-error --single-transaction --dbname="$server/$target" "$file" ||
  fail "pg_restore failed; $target was left empty or partly restored — drop it before trying again."
echo "Restored into $target ($(redact_url "$server/$target"))"
