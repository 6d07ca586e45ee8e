#!/usr/bin/env bash
# npm test: lint, typecheck, unit and reference tests, server tests against a real
# PostgreSQL / s3rver / mail fake, and browser tests in Debian's chromium.
# Everything runs in a separate, freshly made "test" profile (its own cluster,
# bucket folder, mail spool and ports), so the demo's data is never touched.
# Every step runs even when an earlier one fails; the last line is "N passed, N failed".
set -uo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/provision.sh"
cd "$REPO_ROOT"
started_at=$(date +%s)

# SCHOLIUM_TEST_PROFILE runs a second, independent test stack beside the first (own folder,
# ports and build folder); SCHOLIUM_TEST_PROJECTS picks vitest projects; SCHOLIUM_TEST_SKIP_CHECKS=1
# skips lint and typecheck; SCHOLIUM_TEST_FILTER narrows to some test files. CI runs the defaults: everything.
PROFILE="${SCHOLIUM_TEST_PROFILE:-test}"
PROJECTS="${SCHOLIUM_TEST_PROJECTS:-unit server e2e}"
APP_PORT="${SCHOLIUM_TEST_APP_PORT:-3101}"
PG_PORT="${SCHOLIUM_TEST_PG_PORT:-54339}"
export S3_PORT="${SCHOLIUM_TEST_S3_PORT:-4579}" SMTP_PORT="${SCHOLIUM_TEST_SMTP_PORT:-2535}" INBOX_PORT="${SCHOLIUM_TEST_INBOX_PORT:-2536}"
export ARXIV_PORT="${SCHOLIUM_TEST_ARXIV_PORT:-2537}"
export S3_DIR="$REPO_ROOT/storage/$PROFILE/s3" MAIL_DIR="$REPO_ROOT/storage/$PROFILE/mail" S3_BUCKET=scholium-test
RESULTS="$REPO_ROOT/storage/$PROFILE/results"

PIDS=()
PG_DATA=""
cleanup() {
  trap - INT TERM EXIT
  for pid in "${PIDS[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  for pid in "${PIDS[@]}"; do wait "$pid" 2>/dev/null || true; done
  pg_stop "$PG_DATA"
}
# A signal ends the script after cleaning up (without the exit, bash would carry on with the next step).
trap 'cleanup; exit 130' INT
trap 'cleanup; exit 143' TERM
trap cleanup EXIT

ensure_apt postgresql chromium lrcalc python3-sympy
ensure_node_modules || die "npm ci failed"
rm -rf "$S3_DIR" "$MAIL_DIR" "$RESULTS"
[ "$PROFILE" = test ] && rm -rf test-results
mkdir -p "$RESULTS" test-results

pg_start "$PROFILE" "$PG_PORT" scholium_test fresh
PG_DATA="$PG_STARTED_DATA"
export NUXT_DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/scholium_test"
export NUXT_S3_ENDPOINT="http://127.0.0.1:$S3_PORT" NUXT_S3_BUCKET="$S3_BUCKET"
export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT="$SMTP_PORT" NUXT_MAIL_INBOX_URL="http://127.0.0.1:$INBOX_PORT"
export NUXT_ARXIV_BASE_URL="http://127.0.0.1:$ARXIV_PORT"
export NUXT_SESSION_PASSWORD="test-only-session-password-$(head -c 24 /dev/urandom | base64 | tr -d '\n/+=')"
export NUXT_PUBLIC_BASE_URL="http://127.0.0.1:$APP_PORT"
export SCHOLIUM_TEST_BASE_URL="http://127.0.0.1:$APP_PORT" SCHOLIUM_TEST_RESULTS="$RESULTS"

node --import tsx scripts/fakes.ts > "$RESULTS/fakes.log" 2>&1 &
PIDS+=($!)
wait_for_port "$INBOX_PORT" 30 || die "the S3 and mail fakes did not start (storage/test/results/fakes.log)"
npx tsx scripts/migrate.ts > "$RESULTS/migrate.log" 2>&1 || { cat "$RESULTS/migrate.log"; die "migrations failed"; }

# step NAME COMMAND... — a check that counts as one test.
step() {
  local name="$1"; shift
  log "$name"
  if "$@"; then echo "pass" > "$RESULTS/step-$name"; else echo "fail" > "$RESULTS/step-$name"; log "$name FAILED"; fi
}
# suite PROJECT [FILES…] — a vitest project whose tests are counted one by one.
suite() {
  case " $PROJECTS " in *" $1 "*) ;; *) return 0 ;; esac
  log "tests: $1"
  # SCHOLIUM_TEST_FILTER: vitest file filters, e.g. "tests/server/invitations" (development only).
  # shellcheck disable=SC2086
  npx vitest run --project "$1" ${SCHOLIUM_TEST_FILTER:-} --reporter=default --reporter=json --outputFile="$RESULTS/vitest-$1.json" || true
}

# The formatting check (ESLint Stylistic, eslint.format.config.mjs) is on; SCHOLIUM_TEST_FORMAT_CHECK=0
# skips it for a quick local run.
SCHOLIUM_TEST_FORMAT_CHECK="${SCHOLIUM_TEST_FORMAT_CHECK:-1}"
if [ "${SCHOLIUM_TEST_SKIP_CHECKS:-}" != 1 ]; then
  step lint npx eslint .
  [ "$SCHOLIUM_TEST_FORMAT_CHECK" = 1 ] && step format npm run --silent format:check
  # Types come from .nuxt (tsconfig.json's references), which no build uses (see ensure_build).
  step typecheck env -u SCHOLIUM_BUILD_DIR -u SCHOLIUM_OUTPUT_DIR bash -c 'npx nuxt prepare >/dev/null 2>&1 && npm run --silent typecheck'
fi
suite unit

step build ensure_build "$PROFILE"
OUTPUT_DIR="$SCHOLIUM_OUTPUT_DIR"
if [ "$(cat "$RESULTS/step-build")" = pass ]; then
  HOST=127.0.0.1 PORT="$APP_PORT" SCHOLIUM_SEED_DEMO=1 node "$OUTPUT_DIR/server/index.mjs" > "$RESULTS/app.log" 2>&1 &
  PIDS+=($!)
  # A short lease, so the test that kills a worker sees the run picked up again within seconds.
  # The worker runs under npm start's supervisor (tests/server/supervision.test.ts kills it);
  # the web server does not, so a crash in it fails the tests instead of being restarted away.
  SCHOLIUM_LEASE_SECONDS=3 node --import tsx scripts/supervise.ts --workers 1 > "$RESULTS/worker.log" 2>&1 &
  PIDS+=($!)
  ready=0
  for _ in $(seq 1 300); do
    curl -fsS "http://127.0.0.1:$APP_PORT/api/health" 2>/dev/null | grep -q '"demo":"ready"' && { ready=1; break; }
    sleep 0.2
  done
  if [ "$ready" = 1 ]; then
    suite server
    suite e2e
  else
    tail -30 "$RESULTS/app.log"
    echo "fail" > "$RESULTS/step-app-start"
  fi
fi

node scripts/test-summary.mjs "$RESULTS" "$(( $(date +%s) - started_at ))" "$PROJECTS"
