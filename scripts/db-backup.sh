#!/usr/bin/env bash
# `npm run db:backup`: a pg_dump custom-format archive of the private cluster's database, written to
# .data/backups/edgewise-<UTC timestamp>.dump. Restore it with `npm run db:restore -- <file>`.
# DATABASE_URL chooses the database (default: the dev database on 127.0.0.1:54329, signed in with
# .data/pg.password); BACKUP_DIR overrides the folder.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

DATABASE_URL="${DATABASE_URL:-$(PGDATA="$DATA_DIR/pg" PGPORT=54329 local_database_url edgewise)}"
BACKUP_DIR="${BACKUP_DIR:-$DATA_DIR/backups}"

# Debian's client must be at least as new as the server, so take the newest one installed.
BIN=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
[ -x "${BIN:-}/pg_dump" ] || fail "pg_dump was not found under /usr/lib/postgresql/*/bin: install Debian's postgresql package (or run 'npm run dev' once)."

mkdir -p "$BACKUP_DIR"
chmod 700 "$BACKUP_DIR"
file="$BACKUP_DIR/edgewise-$(date -u +%Y%m%dT%H%M%SZ).dump"
[ -e "$file" ] && fail "$file already exists: wait a second and try again."

# Written beside the final name and renamed on success, so a failed dump never looks like a backup.
partial="$file.partial"
trap 'rm -f "$partial"' EXIT
step "Backing up ${DATABASE_URL##*/} to ${file#$ROOT/}"
"$BIN/pg_dump" --format=custom --no-owner --no-privileges --file="$partial" --dbname="$DATABASE_URL" ||
  fail "pg_dump could not back up the database at $(redact_url "${DATABASE_URL%%\?*}") (is it running? 'npm run dev' or 'bash scripts/postgres.sh up' starts it)."
mv "$partial" "$file"
trap - EXIT

size=$(du -h "$file" | cut -f1)
echo "$file ($size)"
