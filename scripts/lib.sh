# Shared helpers for the start and test scripts. Sourced, not run.
# Every step prints one line that says what it does, so a slow first start is never silent.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
# Everything a run keeps (clusters, caught mail, uploads, logs); EDGEWISE_DATA_DIR gives a run its own.
DATA_DIR="${EDGEWISE_DATA_DIR:-$ROOT/.data}"

step() { printf '\033[1m==> %s\033[0m\n' "$*"; }
fail() { printf '\033[31mError: %s\033[0m\n' "$*" >&2; exit 1; }

as_root() {
  if [ "$(id -u)" -eq 0 ]; then "$@"; elif command -v sudo >/dev/null; then sudo "$@"; else
    fail "'$*' needs root and sudo is not available. Run it as root once, then try again."
  fi
}

# apt_install PACKAGE COMMAND_THAT_PROVES_IT_IS_THERE
apt_install() {
  local package="$1" probe="$2"
  if [ -e "$probe" ] || command -v "$probe" >/dev/null 2>&1; then return 0; fi
  apt_install_package "$package"
}

apt_install_package() {
  local package="$1"
  command -v apt-get >/dev/null || fail "$package is missing and apt-get is not available: install $package with your package manager."
  step "Installing $package from Debian's packages (first run only)"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -q "$package" >"$DATA_DIR/apt-$package.log" 2>&1 || {
    as_root env DEBIAN_FRONTEND=noninteractive apt-get update -q >>"$DATA_DIR/apt-$package.log" 2>&1 &&
      as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -q "$package" >>"$DATA_DIR/apt-$package.log" 2>&1
  } || fail "apt-get could not install $package (see $DATA_DIR/apt-$package.log)."
}

# local_secret FILE: prints the secret kept in FILE, making a random one (readable by this user only)
# the first time. Local services' passwords and tokens live in the git-ignored data folder this way.
local_secret() {
  local file="$1"
  if [ ! -s "$file" ]; then
    mkdir -p "$(dirname "$file")"
    (umask 077 && od -An -tx1 -N24 /dev/urandom | tr -d ' \n' >"$file.partial" && mv "$file.partial" "$file")
  fi
  cat "$file"
}

# local_database_url DB: the URL of database DB on this checkout's cluster ($PGDATA on $PGPORT),
# signed in with the password scripts/postgres.sh keeps beside the cluster.
local_database_url() {
  [ -s "$PGDATA.password" ] || fail "${PGDATA#$ROOT/}.password is missing: 'bash scripts/postgres.sh up' makes it."
  echo "postgres://postgres:$(cat "$PGDATA.password")@127.0.0.1:$PGPORT/$1"
}

# A database URL as it may be printed: without its password.
redact_url() { sed -E 's#(://[^:/@]+):[^@/]*@#\1@#' <<<"$1"; }

port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

require_free_port() {
  if port_in_use "$1"; then fail "port $1 on 127.0.0.1 is already taken ($2). Stop what uses it, then try again."; fi
}

ensure_node_modules() {
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    step "Installing npm packages (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || fail "npm ci failed."
  fi
}

# Everything the production build is made from.
BUILD_SOURCES=(app components lessons lib db public proxy.ts instrumentation.ts next.config.ts tailwind.config.ts postcss.config.mjs tsconfig.json package-lock.json)

# The build in .next is current when it was made from the committed sources and none of them has
# changed since.
production_build_is_current() {
  [ -f "$ROOT/.next/BUILD_ID" ] && [ "$(cat "$ROOT/.next/edgewise-source-stamp" 2>/dev/null)" = "$(source_stamp)" ] &&
    [ -z "$(cd "$ROOT" && git status --porcelain -- "${BUILD_SOURCES[@]}" 2>/dev/null)" ]
}

source_stamp() {
  (cd "$ROOT" && git ls-files -s -- "${BUILD_SOURCES[@]}" 2>/dev/null | sha1sum | cut -c1-40)
}

# build_production LOG: next build. A build of committed sources is stamped, so that the next
# start or test run reuses it; one made with uncommitted changes is never reused.
build_production() {
  local stamp=""
  [ -z "$(cd "$ROOT" && git status --porcelain -- "${BUILD_SOURCES[@]}" 2>/dev/null)" ] && stamp=$(source_stamp)
  (cd "$ROOT" && EDGEWISE_LOCAL_PAGES=1 npx next build >"$1" 2>&1) || return 1
  if [ -n "$stamp" ]; then echo "$stamp" >"$ROOT/.next/edgewise-source-stamp"; fi
}

# Builds the production app unless .next already holds a current build.
ensure_production_build() {
  if production_build_is_current; then
    step "Build is up to date"
  else
    step "Building the app (next build, about a minute)"
    build_production "$DATA_DIR/build.log" || { tail -n 40 "$DATA_DIR/build.log"; fail "the build failed (full log: .data/build.log)."; }
  fi
}

# Wait for a TCP port to accept connections, up to N seconds.
wait_for_port() {
  local port="$1" seconds="$2" what="$3"
  for _ in $(seq 1 $((seconds * 10))); do port_in_use "$port" && return 0; sleep 0.1; done
  fail "$what did not start listening on 127.0.0.1:$port within ${seconds}s."
}

# Background processes run in their own process group (setsid), so stopping one also stops what
# it spawned: `npx next start` leaves its server behind when only npx is killed.
start_background() { setsid "$@" & }
stop_background() { for pid in "$@"; do kill -- "-$pid" 2>/dev/null || kill "$pid" 2>/dev/null || true; done; }
