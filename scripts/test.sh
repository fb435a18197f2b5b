#!/usr/bin/env bash
# npm test: every check — typecheck, lint, unit, API integration on a real PostgreSQL, browser
# end-to-end in headless Chromium, then reliability (crash, shutdown, start-up). Each stage runs even
# when an earlier one failed; the exit code is non-zero when any failed, and a summary line of
# counts ends the output.
set -uo pipefail
source "$(dirname "$0")/lib/env.sh"
source "$HW_ROOT/scripts/lib/build.sh"
source "$HW_ROOT/scripts/lib/fakes.sh"
cd "$HW_ROOT"

RESULTS="$HW_ROOT/test-results"
rm -rf "$RESULTS"; mkdir -p "$RESULTS"
: > "$RESULTS/stages.txt"

stage() {  # stage NAME COMMAND...
  local name="$1"; shift
  hw_log "── $name"
  local start=$SECONDS
  if "$@"; then echo "$name pass $((SECONDS - start))" >> "$RESULTS/stages.txt"
  else echo "$name FAIL $((SECONDS - start))" >> "$RESULTS/stages.txt"; fi
}

# Machine set-up: Debian packages the suite needs (reference libraries, browser, PDF text tools).
packages=(chromium python3-fluids python3-iapws poppler-utils curl)
hw_pg_bindir >/dev/null || packages+=(postgresql)
hw_apt_install "${packages[@]}"
hw_ensure_node_modules
bash scripts/db.sh start || hw_die "database did not start"
TEST_DB="${HOSEWRIGHT_TEST_DB:-hosewright_test}"
bash scripts/db.sh recreate "$TEST_DB" || hw_die "could not recreate the test database"

export HOSEWRIGHT_TEST_DATABASE_URL="$(hw_db_url "$TEST_DB")"
# part photos: the fake S3 (own bucket) for the test server; the photo suite checks objects in it
hw_fake_s3_start hosewright-test || hw_die "the fake S3 did not start (log: $HW_STATE/fake-s3.log)"
export HOSEWRIGHT_TEST_S3_URL="$S3_ENDPOINT" HOSEWRIGHT_TEST_S3_BUCKET="$S3_BUCKET"
trap hw_fake_s3_stop EXIT
# e-mail: always the local catcher (tests must never reach a real mail server); the mail suites
# read what arrived through its HTTP API
unset SMTP_HOST SMTP_PORT SMTP_SECURE SMTP_USER SMTP_PASS
hw_fake_smtp_start --fresh || hw_die "the fake SMTP server did not start (log: $HW_STATE/fake-smtp.log)"
export HOSEWRIGHT_TEST_MAIL_URL="$HOSEWRIGHT_MAIL_API_URL"
trap 'hw_fake_s3_stop; hw_fake_smtp_stop' EXIT
vitest() { npx vitest run --project "$1" --reporter=default --reporter=json --outputFile="$RESULTS/$1.json"; }

stage typecheck npx nuxt typecheck
stage lint npx eslint . --max-warnings=0
stage unit vitest unit

# One production build and one server for the API and browser suites.
TEST_PORT="${HOSEWRIGHT_TEST_PORT:-3100}"
server=""
start_server() {
  hw_build || return 1
  DATABASE_URL="$HOSEWRIGHT_TEST_DATABASE_URL" NUXT_SESSION_PASSWORD="test-session-password-0123456789abcdef" \
    HOSEWRIGHT_SEED_DEMO=1 HOSEWRIGHT_TRUST_PROXY=1 NITRO_HOST=127.0.0.1 NITRO_PORT="$TEST_PORT" \
    HOSEWRIGHT_PHOTO_MAX_MB="${HOSEWRIGHT_PHOTO_MAX_MB:-2}" \
    HOSEWRIGHT_MAIL_OUTBOX_PAGE=1 HOSEWRIGHT_MAIL_POLL_MS=200 HOSEWRIGHT_MAIL_RETRY_MS=500,1000,2000 \
    node "$HW_OUTPUT/server/index.mjs" > "$RESULTS/server.log" 2>&1 &
  server=$!
  hw_wait_for "http://127.0.0.1:$TEST_PORT/api/health" "$server" || { tail -n 30 "$RESULTS/server.log"; return 1; }
}
stop_server() { [ -n "$server" ] && kill -TERM "$server" 2>/dev/null && wait "$server" 2>/dev/null; server=""; }
trap 'stop_server; hw_fake_s3_stop; hw_fake_smtp_stop' EXIT

stage build start_server
built=""
if [ -n "$server" ]; then
  built=1
  export HOSEWRIGHT_TEST_URL="http://127.0.0.1:$TEST_PORT"
  stage api vitest api
  stage e2e vitest e2e
fi
stop_server

# ── reliability: crash (kill -9), graceful shutdown, start-up checks and logs. The suite starts and
# kills servers of the same build itself, each on a fresh database <TEST_DB>_reliability_<suite>,
# with its own fake S3 and SMTP (docs/reliability.md).
if [ -n "$built" ]; then
  export HOSEWRIGHT_RELIABILITY_DATABASE_URL="$(hw_db_url "${TEST_DB}_reliability")"
  stage reliability vitest reliability
fi

node scripts/test-summary.mjs "$RESULTS"
