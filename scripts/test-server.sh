#!/usr/bin/env bash
# For working on the API and browser suites: build if needed and serve the test database on
# port 3100 in the foreground. In another shell:
#   HOSEWRIGHT_TEST_URL=http://127.0.0.1:3100 HOSEWRIGHT_TEST_DATABASE_URL=$(scripts/db.sh url hosewright_test) npx vitest run --project api
set -euo pipefail
source "$(dirname "$0")/lib/env.sh"
source "$HW_ROOT/scripts/lib/build.sh"
source "$HW_ROOT/scripts/lib/fakes.sh"
cd "$HW_ROOT"
bash scripts/db.sh start
TEST_DB="${HOSEWRIGHT_TEST_DB:-hosewright_test}"  # a database of one's own, as scripts/test.sh takes it
[ "${1:-}" = "--fresh" ] && bash scripts/db.sh recreate "$TEST_DB"
hw_build
TEST_PORT="${HOSEWRIGHT_TEST_PORT:-3100}"

# part photos: a fake S3 beside the server, stopped with it. The photo suite reads where it is from
# $HW_STATE/test-server-PORT.s3 (or HOSEWRIGHT_TEST_S3_URL / HOSEWRIGHT_TEST_S3_BUCKET).
hw_fake_s3_start hosewright-test || hw_die "the fake S3 did not start (log: $HW_STATE/fake-s3.log)"
s3_note="$HW_STATE/test-server-$TEST_PORT.s3"
printf 'HOSEWRIGHT_TEST_S3_URL=%s\nHOSEWRIGHT_TEST_S3_BUCKET=%s\n' "$S3_ENDPOINT" "$S3_BUCKET" > "$s3_note"
# e-mail: always the local catcher; the mail suites find its HTTP API in $HW_STATE/test-server-PORT.mail
unset SMTP_HOST SMTP_PORT SMTP_SECURE SMTP_USER SMTP_PASS
hw_fake_smtp_start --fresh || hw_die "the fake SMTP server did not start (log: $HW_STATE/fake-smtp.log)"
mail_note="$HW_STATE/test-server-$TEST_PORT.mail"
printf 'HOSEWRIGHT_TEST_MAIL_URL=%s\n' "$HOSEWRIGHT_MAIL_API_URL" > "$mail_note"
server=""
cleanup() {
  [ -n "$server" ] && kill -TERM "$server" 2>/dev/null && wait "$server" 2>/dev/null
  hw_fake_s3_stop
  hw_fake_smtp_stop
  rm -f "$s3_note" "$mail_note"
}
trap cleanup EXIT
trap 'exit 143' INT TERM

DATABASE_URL="$(hw_db_url "$TEST_DB")" NUXT_SESSION_PASSWORD="test-session-password-0123456789abcdef" \
  HOSEWRIGHT_SEED_DEMO=1 HOSEWRIGHT_TRUST_PROXY=1 NITRO_HOST=127.0.0.1 NITRO_PORT="$TEST_PORT" \
  HOSEWRIGHT_PHOTO_MAX_MB="${HOSEWRIGHT_PHOTO_MAX_MB:-2}" \
  HOSEWRIGHT_MAIL_OUTBOX_PAGE=1 HOSEWRIGHT_MAIL_POLL_MS=200 HOSEWRIGHT_MAIL_RETRY_MS=500,1000,2000 \
  node "$HW_OUTPUT/server/index.mjs" &  # the build hw_build made (HOSEWRIGHT_BUILD_TAG aware)
server=$!
wait "$server"
