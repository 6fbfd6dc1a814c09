#!/usr/bin/env bash
# Provisions the private PostgreSQL cluster: installs Debian's server if absent, creates the
# cluster under .data/pg, starts it on 127.0.0.1:$PGPORT and creates the named databases.
# Every connection signs in as postgres with the password kept in $PGDATA.password (.data/pg.password
# for the dev cluster), made at the cluster's creation; a cluster made before passwords were
# required gets one on its next start, its data untouched.
# Usage: scripts/postgres.sh up [DB…] | recreate DB | stop
set -euo pipefail
source "$(dirname "$0")/lib.sh"

PGPORT="${PGPORT:-54329}"
PGDATA="${PGDATA:-$DATA_DIR/pg}"
PGLOG="$PGDATA.log"
PASSWORD_FILE="$PGDATA.password"
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

# The first line of the pg_hba.conf this script writes; a cluster without it still trusts every
# loopback connection, as clusters made by earlier versions of this script did.
hba_marker="# Written by scripts/postgres.sh: every connection signs in with the password kept beside the cluster (its .password file)."

requires_password() { head -n 1 "$PGDATA/pg_hba.conf" 2>/dev/null | grep -qxF "$hba_marker"; }

# Gives the postgres role the password kept in $PASSWORD_FILE (made now if missing) and lets in
# only connections that prove it (SCRAM). The server must be stopped: the role's password is set in
# single-user mode, which needs no connection and so works whatever pg_hba.conf said before.
require_password() {
  local password
  password=$(local_secret "$PASSWORD_FILE")
  echo "alter role postgres password '$password';" |
    run_as_postgres "$BIN/postgres" --single -D "$PGDATA" -c exit_on_error=on -c password_encryption=scram-sha-256 postgres >/dev/null 2>>"$PGLOG" ||
    fail "could not set the database password (see ${PGLOG#$ROOT/})."
  local hba="$PGDATA/pg_hba.conf"
  printf '%s\n%s\n%s\n' "$hba_marker" \
    "host all all 127.0.0.1/32 scram-sha-256" \
    "host all all ::1/128 scram-sha-256" >"$hba.new"
  [ "$(id -u)" -eq 0 ] && chown postgres:postgres "$hba.new"
  mv "$hba.new" "$hba"
}

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

  touch "$PGLOG"; [ "$(id -u)" -eq 0 ] && chown postgres:postgres "$PGLOG"
  if ! requires_password; then
    # A cluster left running by an earlier version of this script is stopped to be given its password.
    if [ -f "$PGDATA/postmaster.pid" ]; then run_as_postgres "$BIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null 2>&1 || true; fi
    step "Giving the database cluster in ${PGDATA#$ROOT/} a password (kept in ${PASSWORD_FILE#$ROOT/})"
    require_password
  fi
  [ -s "$PASSWORD_FILE" ] ||
    fail "${PASSWORD_FILE#$ROOT/} is missing, so nothing can sign in to the cluster in ${PGDATA#$ROOT/}. Stop the cluster, delete the first line of its pg_hba.conf, and run this again to set a new password."
  export PGPASSWORD
  PGPASSWORD=$(cat "$PASSWORD_FILE")

  if ! is_ready; then
    require_free_port "$PGPORT" "the database needs it; set PGPORT to use another"
    step "Starting PostgreSQL on 127.0.0.1:$PGPORT"
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
