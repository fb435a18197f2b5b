#!/usr/bin/env bash
# npm start: everything a fresh machine needs, then the production server on http://127.0.0.1:3000.
set -euo pipefail
source "$(dirname "$0")/lib/env.sh"
source "$HW_ROOT/scripts/lib/build.sh"
source "$HW_ROOT/scripts/lib/fakes.sh"
cd "$HW_ROOT"

command -v curl >/dev/null || hw_apt_install curl
hw_ensure_node_modules
bash scripts/db.sh start
hw_build
# part photos: a local fake S3 unless S3_ENDPOINT names a real service; stopped when this script ends
hw_fake_s3_start hosewright || hw_die "the fake S3 did not start (log: $HW_STATE/fake-s3.log)"
trap hw_fake_s3_stop EXIT
# e-mail: a local catcher unless SMTP_HOST names a real server (read sent mail on /outbox)
hw_fake_smtp_start || hw_die "the fake SMTP server did not start (log: $HW_STATE/fake-smtp.log)"
trap 'hw_fake_s3_stop; hw_fake_smtp_stop' EXIT

export DATABASE_URL="${DATABASE_URL:-$(hw_db_url)}"
export NUXT_SESSION_PASSWORD="$(hw_session_password)"
export HOSEWRIGHT_SEED_DEMO="${HOSEWRIGHT_SEED_DEMO:-1}"
export HOST="${HOST:-127.0.0.1}" PORT="${PORT:-3000}"
export NITRO_HOST="$HOST" NITRO_PORT="$PORT"

node .output/server/index.mjs &
server=$!
trap 'kill -TERM $server 2>/dev/null; wait $server 2>/dev/null; hw_fake_s3_stop; hw_fake_smtp_stop; exit 0' INT TERM
if ! hw_wait_for "http://$HOST:$PORT/api/health" $server; then
  hw_die "the server did not come up"
fi
echo
hw_log "Hosewright is running at http://$HOST:$PORT"
npx tsx scripts/print-demo.ts
echo
hw_log "Ctrl-C stops the app; npm run db:stop stops the database."
wait $server
