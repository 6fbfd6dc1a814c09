# Starts the local stand-ins for hosted services (mail sink) unless real ones are configured.
# Sourced by start.sh and test.sh; fills service_pids and exports the matching environment.
# Profiles: dev (ports 540xx) and test (ports 550xx) so a test run never touches a running demo.

start_local_services() {
  local profile="$1" base
  [ "$profile" = test ] && base=55000 || base=54000
  service_pids=()

  if [ -n "${SMTP_HOST:-}" ]; then
    step "Sending mail through $SMTP_HOST (SMTP_HOST is set; no local sink)"
  else
    export SMTP_HOST=127.0.0.1 SMTP_PORT=$((base + 25)) SMTP_SECURE=false
    export MAIL_SINK_URL="http://127.0.0.1:$((base + 26))"
    export MAIL_FROM="${MAIL_FROM:-Edgewise <no-reply@edgewise.example.test>}"
    require_free_port "$SMTP_PORT" "the local mail sink needs it"
    require_free_port "$((base + 26))" "the local mail sink's message list needs it"
    step "Starting the local mail sink (SMTP 127.0.0.1:$SMTP_PORT, messages at $MAIL_SINK_URL)"
    SMTP_PORT=$SMTP_PORT MAIL_SINK_API_PORT=$((base + 26)) node scripts/mail-sink.mjs >"$DATA_DIR/mail-sink-$profile.log" 2>&1 &
    service_pids+=($!)
    wait_for_port "$SMTP_PORT" 15 "The mail sink"
  fi
}
