#!/usr/bin/env bash
# npm run dev: the database plus Nuxt's dev server with hot reload.
set -euo pipefail
source "$(dirname "$0")/lib/env.sh"
source "$HW_ROOT/scripts/lib/fakes.sh"
cd "$HW_ROOT"
hw_ensure_node_modules
bash scripts/db.sh start
export DATABASE_URL="${DATABASE_URL:-$(hw_db_url)}"
export NUXT_SESSION_PASSWORD="$(hw_session_password)"
export HOSEWRIGHT_SEED_DEMO="${HOSEWRIGHT_SEED_DEMO:-1}"
# part photos: a local fake S3 unless S3_ENDPOINT names a real service; stopped when nuxt dev ends.
# nuxt dev runs as a child (keeping the terminal's input) so a signal to this script reaches it too.
hw_fake_s3_start hosewright || hw_die "the fake S3 did not start (log: $HW_STATE/fake-s3.log)"
# e-mail: a local catcher unless SMTP_HOST names a real server; sent mail shows on /outbox
hw_fake_smtp_start || hw_die "the fake SMTP server did not start (log: $HW_STATE/fake-smtp.log)"
export HOSEWRIGHT_MAIL_OUTBOX_PAGE="${HOSEWRIGHT_MAIL_OUTBOX_PAGE:-1}" HOSEWRIGHT_MAIL_POLL_MS="${HOSEWRIGHT_MAIL_POLL_MS:-1000}"
dev=""
trap '[ -n "$dev" ] && kill -TERM "$dev" 2>/dev/null; hw_fake_s3_stop; hw_fake_smtp_stop' EXIT
trap 'exit 130' INT TERM
"$HW_ROOT/node_modules/.bin/nuxt" dev --host "${HOST:-127.0.0.1}" --port "${PORT:-3000}" <&0 &
dev=$!
wait "$dev"
