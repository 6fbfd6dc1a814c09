#!/usr/bin/env bash
# Prepares a private, throw-away copy of Edgewise for load and fault runs (scripts/app-instance.ts
# drives it): its own PostgreSQL cluster in .data/pg-NAME on port BASE+1 holding a fresh, migrated
# and seeded database, and the environment of its app (port BASE+2) and stand-in services
# (ports BASE+25…31), written as NAME=value lines to .data/instance-NAME.env.
# With --servers N (N > 1) the app is N `next start` servers on ports BASE+3… behind a load
# balancer (Debian's haproxy, round robin) on BASE+2, whose configuration is written beside it.
# Usage: scripts/app-instance.sh NAME BASE [--build] [--servers N]   (--build: build the app first if it is stale)
set -euo pipefail
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/local-services.sh"
cd "$ROOT"

# write_balancer_config PORT SERVER_PORTS: haproxy on 127.0.0.1:PORT sending requests in turn to
# the servers on the comma-separated ports, each checked through /api/health.
write_balancer_config() {
  local port="$1" server_ports="$2" server_port number=0
  cat <<CONFIG
global
  maxconn 4096
  # Into the balancer's log file: state changes of the servers, and requests that went wrong.
  log stderr format raw local0 info

defaults
  mode http
  log global
  option httplog
  option dontlog-normal
  # Connecting over loopback takes well under a millisecond; haproxy waits this long (at most a
  # second) before it retries a refused connection.
  timeout connect 250ms
  timeout client 120s
  timeout server 120s
  # A request refused at connect (a server that has just gone) is sent to another server at once,
  # so only requests that were already inside the lost server fail.
  retries 3
  option redispatch 1
  option forwardfor

frontend app
  bind 127.0.0.1:$port
  default_backend servers

backend servers
  balance roundrobin
  # /api/health answers 200 while the server reaches the database. A busy server may take seconds
  # to answer, which is no reason to take it out; a refused connection takes it out at once, and
  # a server is back after one good check.
  option httpchk GET /api/health
  timeout check 10s
  default-server check inter 1s downinter 500ms fall 2 rise 1 observe layer4 error-limit 1 on-error mark-down
  # Names the server that answered, so a test can tell that traffic reached each of them.
  http-response set-header X-App-Server %s
CONFIG
  for server_port in ${server_ports//,/ }; do
    number=$((number + 1))
    echo "  server app-$number 127.0.0.1:$server_port"
  done
}

name="$1" base="$2" build=0 servers=1
shift 2
while [ $# -gt 0 ]; do
  case "$1" in
    --build) build=1 ;;
    --servers) servers="$2"; shift ;;
    *) fail "unknown option $1" ;;
  esac
  shift
done
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

[ "$build" = 1 ] && ensure_production_build
[ -f .next/BUILD_ID ] || fail "there is no production build in .next; run 'npx next build' first."

# One server listens on the app's own address; several listen on BASE+3… behind the balancer there.
APP_SERVER_PORTS=$APP_PORT BALANCER_CONFIG=""
if [ "$servers" -gt 1 ]; then
  apt_install haproxy /usr/sbin/haproxy
  APP_SERVER_PORTS=$(seq -s , $((base + 3)) $((base + 2 + servers)))
  BALANCER_CONFIG="$DATA_DIR/instance-$name-haproxy.cfg"
  write_balancer_config "$APP_PORT" "$APP_SERVER_PORTS" >"$BALANCER_CONFIG"
fi

# It holds the database password and the mail sink's token.
umask 077
rm -f "$DATA_DIR/instance-$name.env"
for variable in PGDATA PGPORT DATABASE_URL APP_PORT APP_URL SMTP_HOST SMTP_PORT SMTP_SECURE MAIL_SINK_API_PORT \
  MAIL_SINK_URL MAIL_SINK_TOKEN MAIL_SINK_FILE MAIL_FROM UPLOADTHING_TOKEN UPLOAD_FAKE_PORT UPLOAD_FAKE_API_PORT UPLOADTHING_INGEST_URL \
  UPLOADTHING_API_URL UPLOADTHING_IS_DEV UPLOADTHING_LOG_LEVEL UPLOAD_FAKE_DIR APP_SERVER_PORTS BALANCER_CONFIG; do
  printf '%s=%s\n' "$variable" "${!variable}"
done >"$DATA_DIR/instance-$name.env"
