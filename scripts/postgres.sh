#!/usr/bin/env bash
# Provisions the private PostgreSQL cluster: installs Debian's server if absent, creates the
# cluster under .data/pg, starts it on 127.0.0.1:$PGPORT and creates the named databases.
# Usage: scripts/postgres.sh up [DB…] | recreate DB | stop
set -euo pipefail
source "$(dirname "$0")/lib.sh"

PGPORT="${PGPORT:-54329}"
PGDATA="${PGDATA:-$DATA_DIR/pg}"
PGLOG="$PGDATA.log"
mkdir -p "$DATA_DIR"

# The newest installed server's programs. The client package alone also fills
# /usr/lib/postgresql/*/bin, so the server is recognised by its own program.
pg_bin() {
  local server
  server=$(ls -d /usr/lib/postgresql/*/bin/postgres 2>/dev/null | sort -V | tail -n 1)
  [ -n "$server" ] && dirname "$server"
}

run_as_postgres() {
  if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

is_ready() { "$BIN/pg_isready" -q -U postgres -h 127.0.0.1 -p "$PGPORT"; }

up() {
  [ -n "$(pg_bin)" ] || apt_install_package postgresql
  BIN=$(pg_bin) || fail "PostgreSQL's server programs were not found under /usr/lib/postgresql."

  if [ ! -f "$PGDATA/PG_VERSION" ]; then
    step "Creating the private database cluster in ${PGDATA#$ROOT/}"
    mkdir -p "$PGDATA"
    if [ "$(id -u)" -eq 0 ]; then
      chown postgres:postgres "$PGDATA"
      # The server runs as postgres and must be able to reach its folder.
      local d="$PGDATA"; while [ "$d" != "/" ]; do d=$(dirname "$d"); chmod o+x "$d" 2>/dev/null || true; done
    fi
    chmod 700 "$PGDATA"
    run_as_postgres "$BIN/initdb" -D "$PGDATA" -U postgres -A trust -E UTF8 --locale=C.UTF-8 >"$DATA_DIR/initdb.log" 2>&1 ||
      fail "initdb failed (see ${DATA_DIR#$ROOT/}/initdb.log)."
    cat >>"$PGDATA/postgresql.conf" <<CONF
listen_addresses = '127.0.0.1'
port = $PGPORT
unix_socket_directories = ''
max_connections = 200
shared_buffers = 128MB
${PG_EXTRA_CONF:-}
CONF
  fi

  if ! is_ready; then
    require_free_port "$PGPORT" "the database needs it; set PGPORT to use another"
    step "Starting PostgreSQL on 127.0.0.1:$PGPORT"
    touch "$PGLOG"; [ "$(id -u)" -eq 0 ] && chown postgres:postgres "$PGLOG"
    run_as_postgres "$BIN/pg_ctl" -D "$PGDATA" -l "$PGLOG" -o "-p $PGPORT" -w -t 60 start >/dev/null ||
      fail "PostgreSQL did not start (see $PGLOG)."
  fi
  for _ in $(seq 1 100); do is_ready && break; sleep 0.1; done
  is_ready || fail "PostgreSQL is not accepting connections on port $PGPORT."
  # A server already answering on the port may be another checkout's, or the system's own: using it
  # would put this checkout's data in someone else's cluster.
  local serving
  serving=$("$BIN/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -tAc "show data_directory" 2>/dev/null) || serving=""
  [ "$(realpath -m "$serving")" = "$(realpath -m "$PGDATA")" ] ||
    fail "port $PGPORT on 127.0.0.1 is answered by another PostgreSQL (${serving:-one this script cannot sign in to}), not this checkout's cluster in ${PGDATA#$ROOT/}. Stop it or set PGPORT to use another port."

  for db in "$@"; do
    if ! "$BIN/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -tAc "select 1 from pg_database where datname = '$db'" | grep -q 1; then
      step "Creating database $db"
      "$BIN/createdb" -h 127.0.0.1 -p "$PGPORT" -U postgres "$db"
    fi
  done
}

recreate() {
  up
  step "Recreating database $1"
  PGOPTIONS="-c client_min_messages=warning" "$BIN/psql" -q -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres \
    -c "drop database if exists \"$1\" with (force)" -c "create database \"$1\"" || fail "could not recreate database $1."
}

stop() {
  BIN=$(pg_bin) || exit 0
  [ -f "$PGDATA/postmaster.pid" ] || exit 0
  step "Stopping PostgreSQL"
  run_as_postgres "$BIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null || true
}

case "${1:-}" in
  up) shift; up "$@" ;;
  recreate) recreate "$2" ;;
  stop) stop ;;
  *) echo "usage: $0 up [DB…] | recreate DB | stop" >&2; exit 2 ;;
esac
