#!/usr/bin/env bash
# `npm test`: provisions everything the tests need on a fresh machine (Debian packages, npm
# packages, a private test database cluster, the local mail sink, a production build) and runs
# every suite: unit, integration, reference, browser, faults. Ends with "N passed, N failed".
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
mkdir -p "$DATA_DIR" test-results

# TEST_PORT_OFFSET moves every port of this run, so two checkouts can test side by side.
offset="${TEST_PORT_OFFSET:-0}"
export PGPORT=$((54339 + offset)) PGDATA="$DATA_DIR/pg-test" PG_EXTRA_CONF="fsync = off
synchronous_commit = off"
export APP_PORT=$((3100 + offset))
export APP_URL="http://127.0.0.1:$APP_PORT" E2E_BASE_URL="http://127.0.0.1:$APP_PORT"
unset SMTP_HOST UPLOADTHING_TOKEN

pids=()
service_pids=()  # filled by start_local_services as each stand-in starts
cleanup() {
  stop_background "${pids[@]}" "${service_pids[@]}"
  wait 2>/dev/null
  bash scripts/postgres.sh stop >/dev/null 2>&1
}
trap cleanup EXIT
trap 'exit 130' INT TERM

set -e
apt_install chromium /usr/bin/chromium
apt_install ngspice /usr/bin/ngspice
ensure_node_modules
bash scripts/postgres.sh recreate edgewise_test
DATABASE_URL=$(local_database_url edgewise_test)
export DATABASE_URL
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts >/dev/null

source scripts/local-services.sh
start_local_services test
set +e

reports=()
# `npm test -- <file filters>` runs only the matching test files; the browser and fault suites
# (and the build they need) then run only when a filter names an e2e or a faults file.
filters=("$@")
run_vitest() {
  local name="$1"
  step "Running the $name tests"
  npx vitest run --project "$name" --reporter=default --reporter=json --outputFile.json="test-results/$name.json" --passWithNoTests "${filters[@]}"
  reports+=("test-results/$name.json")
}
wants_suite() {
  [ ${#filters[@]} -eq 0 ] && return 0
  local filter
  for filter in "${filters[@]}"; do [[ "$filter" == *"$1"* ]] && return 0; done
  return 1
}

run_vitest unit
run_vitest integration
run_vitest reference

if ! wants_suite e2e && ! wants_suite faults; then
  node scripts/test-summary.mjs "${reports[@]}"
  exit $?
fi

# The build does not depend on the environment it will serve, so one made by `npm start` from
# the same sources serves the tests too, and the other way round.
if production_build_is_current; then
  step "The app's build is up to date for the browser and fault tests"
  built=0
else
  step "Building the app for the browser and fault tests"
  build_production "$DATA_DIR/build-test.log"
  built=$?
fi
if [ "$built" = 0 ]; then
  if wants_suite e2e; then
    require_free_port "$APP_PORT" "the browser tests serve the app there"
    NODE_ENV=production start_background npx next start -H 127.0.0.1 -p "$APP_PORT" >"$DATA_DIR/app-test.log" 2>&1
    pids+=($!)
    wait_for_port "$APP_PORT" 60 "The app"
    run_vitest e2e
  fi
  # The fault tests start private copies of the app (own cluster, mail sink, upload fake) on
  # ports FAULTS_PORT_BASE+1…+31 and stop parts of them; the shared test cluster is not touched.
  if wants_suite faults; then
    export FAULTS_PORT_BASE="${FAULTS_PORT_BASE:-$((59000 + offset))}"
    run_vitest faults
  fi
else
  tail -n 40 "$DATA_DIR/build-test.log"
  echo "The build failed (full log: .data/build-test.log); the browser and fault tests count as failed."
  echo '{"numPassedTests":0,"numFailedTests":1}' >test-results/build.json
  reports+=("test-results/build.json")
fi

node scripts/test-summary.mjs "${reports[@]}"
