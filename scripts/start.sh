#!/usr/bin/env bash
# npm start: the whole product with demo data on http://127.0.0.1:3000.
# Installs what is missing, starts a private PostgreSQL cluster, s3rver and the
# mail fake on loopback, migrates, builds, seeds the demo and serves the app.
# The web server and the workers are supervised: one that dies is started again (logged).
# Ctrl-C stops everything; the data under storage/demo survives for next time.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/provision.sh"
cd "$REPO_ROOT"

PROFILE=demo
APP_PORT="${PORT:-3000}"
PG_PORT="${SCHOLIUM_PG_PORT:-54329}"
export S3_PORT="${SCHOLIUM_S3_PORT:-4569}" SMTP_PORT="${SCHOLIUM_SMTP_PORT:-2525}" INBOX_PORT="${SCHOLIUM_INBOX_PORT:-2526}"
export ARXIV_PORT="${SCHOLIUM_ARXIV_PORT:-2527}"
export S3_DIR="$REPO_ROOT/storage/$PROFILE/s3" MAIL_DIR="$REPO_ROOT/storage/$PROFILE/mail"

PIDS=()
PG_DATA=""
cleanup() {
  trap - INT TERM EXIT
  log "stopping"
  for pid in "${PIDS[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  for pid in "${PIDS[@]}"; do wait "$pid" 2>/dev/null || true; done
  pg_stop "$PG_DATA"
  log "stopped; data kept under storage/$PROFILE"
}
# A signal ends the script after cleaning up; without the exit, bash would go on with the
# next line of the script once the trap returned (and start the app on a stopped database).
trap 'cleanup; exit 130' INT
trap 'cleanup; exit 143' TERM
trap cleanup EXIT

ensure_apt postgresql
ensure_node_modules
mkdir -p "storage/$PROFILE"

# Each service runs locally unless its configuration points elsewhere.
if [ -z "${NUXT_DATABASE_URL:-}" ]; then
  pg_start "$PROFILE" "$PG_PORT" scholium
  PG_DATA="$PG_STARTED_DATA"
  export NUXT_DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/scholium"
fi
if [ -z "${NUXT_S3_ENDPOINT:-}" ] || [ -z "${NUXT_SMTP_HOST:-}" ]; then
  export S3_BUCKET="${NUXT_S3_BUCKET:-scholium-sources}"
  node --import tsx scripts/fakes.ts &
  PIDS+=($!)
  wait_for_port "$INBOX_PORT" 30 || die "the local S3 and mail fakes did not start"
  export NUXT_S3_ENDPOINT="${NUXT_S3_ENDPOINT:-http://127.0.0.1:$S3_PORT}"
  export NUXT_SMTP_HOST="${NUXT_SMTP_HOST:-127.0.0.1}" NUXT_SMTP_PORT="${NUXT_SMTP_PORT:-$SMTP_PORT}"
  export NUXT_MAIL_INBOX_URL="${NUXT_MAIL_INBOX_URL:-http://127.0.0.1:$INBOX_PORT}"
  export NUXT_ARXIV_BASE_URL="${NUXT_ARXIV_BASE_URL:-http://127.0.0.1:$ARXIV_PORT}"
fi
if [ -z "${NUXT_SESSION_PASSWORD:-}" ]; then
  secret_file="storage/$PROFILE/session-password"
  [ -s "$secret_file" ] || head -c 48 /dev/urandom | base64 | tr -d '\n/+=' > "$secret_file"
  NUXT_SESSION_PASSWORD="$(cat "$secret_file")"
  export NUXT_SESSION_PASSWORD
fi
export NUXT_PUBLIC_BASE_URL="${NUXT_PUBLIC_BASE_URL:-http://127.0.0.1:$APP_PORT}"

npx tsx scripts/migrate.ts
ensure_build "$PROFILE" || die "the build failed"

# The web server and the check workers run under scripts/supervise.ts, which starts again
# any of them that dies, with a back-off, and logs it. SCHOLIUM_WORKERS sets how many workers.
log "serving on http://127.0.0.1:$APP_PORT"
HOST=127.0.0.1 PORT="$APP_PORT" SCHOLIUM_SEED_DEMO=1 node --import tsx scripts/supervise.ts \
  --web "$SCHOLIUM_OUTPUT_DIR" --workers "${SCHOLIUM_WORKERS:-1}" &
PIDS+=($!)
for _ in $(seq 1 300); do
  state="$(curl -fsS "http://127.0.0.1:$APP_PORT/api/health" 2>/dev/null | sed -n 's/.*"demo":"\([a-z]*\)".*/\1/p' || true)"
  [ "$state" = ready ] && break
  [ "$state" = failed ] && die "seeding the demo failed (see the server output above)"
  sleep 0.2
done
npx tsx scripts/print-demo-accounts.ts "http://127.0.0.1:$APP_PORT"
log "press Ctrl-C to stop"
wait "${PIDS[@]}"
