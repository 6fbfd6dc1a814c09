# Starts the local stand-ins for hosted services (mail sink, upload fake) unless real ones are configured.
# Sourced by start.sh, test.sh and app-instance.sh; fills service_pids and exports the matching environment.
# Profiles: dev (ports 540xx) and test (ports 550xx) so a test run never touches a running demo.

# The environment the app and the mail sink share, for a sink on ports BASE+25 (SMTP) and BASE+26
# (messages, read with the token in .data/mail-PROFILE.token) keeping what it catches in
# .data/mail-PROFILE.jsonl.
mail_sink_env() {
  local profile="$1" base="$2"
  export SMTP_HOST=127.0.0.1 SMTP_PORT=$((base + 25)) SMTP_SECURE=false
  export MAIL_SINK_API_PORT=$((base + 26)) MAIL_SINK_URL="http://127.0.0.1:$((base + 26))" MAIL_SINK_FILE="$DATA_DIR/mail-$profile.jsonl"
  MAIL_SINK_TOKEN=$(local_secret "$DATA_DIR/mail-$profile.token")
  export MAIL_SINK_TOKEN
  export MAIL_FROM="${MAIL_FROM:-Edgewise <no-reply@edgewise.example.test>}"
}

# The environment the app and the upload fake share, for a fake on ports BASE+30 (ingest) and
# BASE+31 (file API) keeping its files in .data/uploads-PROFILE.
upload_fake_env() {
  local profile="$1" base="$2" api_key
  api_key="sk_local_$(od -An -tx1 -N16 /dev/urandom | tr -d ' \n')"
  export UPLOADTHING_TOKEN="$(printf '{"apiKey":"%s","appId":"edgewise-local","regions":["local"]}' "$api_key" | base64 | tr -d '\n')"
  export UPLOAD_FAKE_PORT=$((base + 30)) UPLOAD_FAKE_API_PORT=$((base + 31))
  export UPLOADTHING_INGEST_URL="http://127.0.0.1:$UPLOAD_FAKE_PORT" UPLOADTHING_API_URL="http://127.0.0.1:$UPLOAD_FAKE_API_PORT"
  # false: the fake calls the app's upload callback itself, as the hosted service does, even under `next dev`.
  export UPLOADTHING_IS_DEV=false UPLOADTHING_LOG_LEVEL=Warning UPLOAD_FAKE_DIR="$DATA_DIR/uploads-$profile"
}

start_local_services() {
  local profile="$1" base
  [ "$profile" = test ] && base=$((55000 + ${TEST_PORT_OFFSET:-0})) || base=${LOCAL_SERVICES_PORT_BASE:-54000}
  service_pids=()

  if [ -n "${SMTP_HOST:-}" ]; then
    step "Sending mail through $SMTP_HOST (SMTP_HOST is set; no local sink)"
  else
    mail_sink_env "$profile" "$base"
    # Like the uploads below: the test database starts empty, so does its mail.
    [ "$profile" = test ] && rm -f "$MAIL_SINK_FILE"
    require_free_port "$SMTP_PORT" "the local mail sink needs it"
    require_free_port "$MAIL_SINK_API_PORT" "the local mail sink's message list needs it"
    step "Starting the local mail sink (SMTP 127.0.0.1:$SMTP_PORT, messages at $MAIL_SINK_URL, kept in ${DATA_DIR#$ROOT/}/mail-$profile.jsonl)"
    start_background node scripts/mail-sink.mjs >"$DATA_DIR/mail-sink-$profile.log" 2>&1
    service_pids+=($!)
    wait_for_port "$SMTP_PORT" 60 "The mail sink"
  fi

  if [ -n "${UPLOADTHING_TOKEN:-}" ]; then
    step "Storing uploads with the hosted upload service (UPLOADTHING_TOKEN is set; no local fake)"
  else
    upload_fake_env "$profile" "$base"
    # The test database is recreated on every run, so files from an earlier run would be orphans.
    [ "$profile" = test ] && rm -rf "$UPLOAD_FAKE_DIR"
    require_free_port "$UPLOAD_FAKE_PORT" "the local upload fake needs it"
    require_free_port "$UPLOAD_FAKE_API_PORT" "the local upload fake's file API needs it"
    step "Starting the local upload fake (ingest $UPLOADTHING_INGEST_URL, API $UPLOADTHING_API_URL, files in ${DATA_DIR#$ROOT/}/uploads-$profile)"
    start_background node scripts/upload-fake.mjs >"$DATA_DIR/upload-fake-$profile.log" 2>&1
    service_pids+=($!)
    wait_for_port "$UPLOAD_FAKE_PORT" 60 "The upload fake"
    wait_for_port "$UPLOAD_FAKE_API_PORT" 60 "The upload fake's file API"
  fi
}
