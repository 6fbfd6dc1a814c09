#!/usr/bin/env bash
# `npm start` (production build) and `npm run dev` (dev server): set up everything a fresh machine
# lacks, then serve Edgewise on http://127.0.0.1:$PORT. Ctrl-C stops what this script started.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

MODE=production
[ "${1:-}" = "--dev" ] && MODE=development
PORT="${PORT:-3000}"
export PGPORT="${PGPORT:-54329}" PGDATA="${PGDATA:-$DATA_DIR/pg}"
export APP_URL="${APP_URL:-http://127.0.0.1:$PORT}"
mkdir -p "$DATA_DIR"

children=()
service_pids=()  # filled by start_local_services as each stand-in starts
# Stops what this script started and keeps its outcome: 0 after Ctrl-C, the failing step's status otherwise.
cleanup() {
  local status=$1
  trap - INT TERM EXIT
  stop_background "${children[@]}" "${service_pids[@]}"
  wait 2>/dev/null || true
  [ "${started_postgres:-0}" = 1 ] && bash scripts/postgres.sh stop
  exit "$status"
}
trap 'cleanup $?' EXIT
trap 'cleanup 0' INT TERM

require_free_port "$PORT" "Edgewise serves there; set PORT to use another"
ensure_node_modules

pg_was_running=0
if command -v pg_isready >/dev/null && pg_isready -q -U postgres -h 127.0.0.1 -p "$PGPORT" 2>/dev/null; then pg_was_running=1; fi
bash scripts/postgres.sh up edgewise
[ "$pg_was_running" = 0 ] && started_postgres=1
DATABASE_URL="${DATABASE_URL:-$(local_database_url edgewise)}"
export DATABASE_URL

step "Applying database migrations"
npx tsx scripts/migrate.ts
step "Seeding the demo school (idempotent)"
npx tsx scripts/seed.ts

source scripts/local-services.sh
start_local_services dev

if [ "$MODE" = production ]; then
  ensure_production_build
  step "Serving Edgewise on http://127.0.0.1:$PORT (Ctrl-C stops it)"
  NODE_ENV=production start_background npx next start -H 127.0.0.1 -p "$PORT"
else
  step "Starting the dev server on http://127.0.0.1:$PORT (Ctrl-C stops it)"
  EDGEWISE_LOCAL_PAGES=1 start_background npx next dev -H 127.0.0.1 -p "$PORT"
fi
children+=($!)
wait "${children[-1]}"
