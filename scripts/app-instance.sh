#!/usr/bin/env bash
# Prepares a private, throw-away copy of Edgewise for load and fault runs (scripts/app-instance.ts
# drives it): its own PostgreSQL cluster in .data/pg-NAME on port BASE+1 holding a fresh, migrated
# and seeded database, and the environment of its app (port BASE+2) and stand-in services
# (ports BASE+25…31), written as NAME=value lines to .data/instance-NAME.env.
# Usage: scripts/app-instance.sh NAME BASE [--build]   (--build: build the app first if it is stale)
set -euo pipefail
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/local-services.sh"
cd "$ROOT"

name="$1" base="$2"
export PGDATA="$DATA_DIR/pg-$name" PGPORT=$((base + 1))
export APP_PORT=$((base + 2)) APP_URL="http://127.0.0.1:$((base + 2))"

ensure_node_modules
bash scripts/postgres.sh recreate "edgewise_$name"
DATABASE_URL=$(local_database_url "edgewise_$name")
export DATABASE_URL
npx tsx scripts/migrate.ts >/dev/null
npx tsx scripts/seed.ts >/dev/null

unset SMTP_HOST UPLOADTHING_TOKEN
mail_sink_env "instance-$name" "$base"
upload_fake_env "instance-$name" "$base"
rm -rf "$UPLOAD_FAKE_DIR" "$MAIL_SINK_FILE"

[ "${3:-}" = --build ] && ensure_production_build
[ -f .next/BUILD_ID ] || fail "there is no production build in .next; run 'npx next build' first."

# It holds the database password and the mail sink's token.
umask 077
rm -f "$DATA_DIR/instance-$name.env"
for variable in PGDATA PGPORT DATABASE_URL APP_PORT APP_URL SMTP_HOST SMTP_PORT SMTP_SECURE MAIL_SINK_API_PORT \
  MAIL_SINK_URL MAIL_SINK_TOKEN MAIL_SINK_FILE MAIL_FROM UPLOADTHING_TOKEN UPLOAD_FAKE_PORT UPLOAD_FAKE_API_PORT UPLOADTHING_INGEST_URL \
  UPLOADTHING_API_URL UPLOADTHING_IS_DEV UPLOADTHING_LOG_LEVEL UPLOAD_FAKE_DIR; do
  printf '%s=%s\n' "$variable" "${!variable}"
done >"$DATA_DIR/instance-$name.env"
