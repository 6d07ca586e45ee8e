# Shared provisioning for scripts/start.sh and scripts/test.sh.
# Sourced, not run. Everything here is idempotent and listens on 127.0.0.1 only.

REPO_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
PG_BIN="${PG_BIN:-/usr/lib/postgresql/15/bin}"
APT_UPDATED=0

log() { printf '\033[1m[scholium]\033[0m %s\n' "$*"; }
die() { printf '[scholium] error: %s\n' "$*" >&2; exit 2; }

# Install Debian packages that are missing (we run as root on a fresh machine).
ensure_apt() {
  local missing=()
  for pkg in "$@"; do
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q 'install ok installed' || missing+=("$pkg")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  [ "$(id -u)" -eq 0 ] || die "missing Debian packages (${missing[*]}); run as root or install them first"
  log "installing Debian packages: ${missing[*]}"
  if [ "$APT_UPDATED" -eq 0 ]; then apt-get update -qq; APT_UPDATED=1; fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
}

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  cd "$REPO_ROOT"
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

# A folder the postgres system user can reach. The repo's storage/ is used when
# every parent is traversable; a clone under a private home falls back to a
# folder under /var/lib/postgresql named after the repo path.
pg_data_dir() {
  local profile="$1" wanted="$REPO_ROOT/storage/$1/pg"
  mkdir -p "$REPO_ROOT/storage/$profile"
  if runuser -u postgres -- test -x "$REPO_ROOT/storage/$profile" 2>/dev/null; then
    echo "$wanted"
  else
    echo "/var/lib/postgresql/scholium-$(printf '%s' "$REPO_ROOT" | sha1sum | cut -c1-10)-$profile"
  fi
}

# pg_start PROFILE PORT DBNAME [fresh] — a private cluster on 127.0.0.1:PORT.
pg_start() {
  local profile="$1" port="$2" db="$3" fresh="${4:-}"
  local data; data="$(pg_data_dir "$profile")"
  if [ "$fresh" = fresh ] && [ -d "$data" ]; then
    runuser -u postgres -- "$PG_BIN/pg_ctl" -D "$data" -m immediate -w stop >/dev/null 2>&1 || true
    rm -rf "$data"
  fi
  if [ ! -f "$data/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in $data"
    mkdir -p "$data" && chown postgres:postgres "$data" && chmod 700 "$data"
    runuser -u postgres -- "$PG_BIN/initdb" -D "$data" -U postgres -A trust -E UTF8 --no-locale >/dev/null
  fi
  if ! runuser -u postgres -- "$PG_BIN/pg_ctl" -D "$data" status >/dev/null 2>&1; then
    runuser -u postgres -- "$PG_BIN/pg_ctl" -D "$data" -l "$data/server.log" -w -t 30 \
      -o "-c listen_addresses=127.0.0.1 -p $port -k $data" start >/dev/null \
      || { tail -20 "$data/server.log" >&2; die "PostgreSQL did not start on port $port"; }
  fi
  if ! psql -h 127.0.0.1 -p "$port" -U postgres -tAc "select 1 from pg_database where datname='$db'" | grep -q 1; then
    psql -h 127.0.0.1 -p "$port" -U postgres -qc "create database \"$db\"" >/dev/null
  fi
  PG_STARTED_DATA="$data"
}

pg_stop() {
  local data="$1"
  [ -n "$data" ] && [ -f "$data/postmaster.pid" ] || return 0
  runuser -u postgres -- "$PG_BIN/pg_ctl" -D "$data" -m fast -w stop >/dev/null 2>&1 || true
}

# wait_for_port PORT SECONDS — true once something accepts on 127.0.0.1:PORT.
wait_for_port() {
  local port="$1" limit="${2:-30}" i=0
  while ! (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; do
    i=$((i + 1)); [ "$i" -ge $((limit * 10)) ] && return 1; sleep 0.1
  done
}

# ensure_build PROFILE — builds the app for one profile unless its output is newer than every
# source file, and exports SCHOLIUM_BUILD_DIR / SCHOLIUM_OUTPUT_DIR (read by nuxt.config.ts).
# Each profile builds in its own folders under .cache/, never in .nuxt: `nuxt prepare` (npm's
# postinstall, the typecheck step, an editor) empties .nuxt, and doing that while a build sits
# between its client and server halves is what made a fresh clone's first build fail with
# "ENOENT .nuxt/dist/client/manifest.json". Builds of the same profile take a lock, so a second
# one (npm start beside npm test, two terminals) waits and then finds the output fresh.
ensure_build() {
  cd "$REPO_ROOT"
  local profile="${1:?ensure_build needs a profile}"
  export SCHOLIUM_BUILD_DIR="${SCHOLIUM_BUILD_DIR:-$REPO_ROOT/.cache/$profile-nuxt}"
  export SCHOLIUM_OUTPUT_DIR="${SCHOLIUM_OUTPUT_DIR:-$REPO_ROOT/.cache/$profile-output}"
  mkdir -p "$REPO_ROOT/.cache" "$REPO_ROOT/storage"
  local log_file="$REPO_ROOT/storage/build-$profile.log"
  (
    flock 9
    out="$SCHOLIUM_OUTPUT_DIR"
    if [ -f "$out/server/index.mjs" ] && [ -z "$(find app.vue error.vue nuxt.config.ts tailwind.config.ts package-lock.json \
        assets components composables layouts middleware pages plugins public server shared stores utils \
        -newer "$out/server/index.mjs" -print -quit 2>/dev/null)" ]; then
      exit 0
    fi
    log "building the app (nuxt build into ${SCHOLIUM_BUILD_DIR#"$REPO_ROOT"/})"
    npx nuxt build >"$log_file" 2>&1 || { tail -40 "$log_file" >&2; log "nuxt build failed (${log_file#"$REPO_ROOT"/})"; exit 1; }
  ) 9>"$REPO_ROOT/.cache/$profile-build.lock"
}
