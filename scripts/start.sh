#!/usr/bin/env bash
# npm start: everything a fresh machine needs, then the production server on http://127.0.0.1:3000.
set -euo pipefail
source "$(dirname "$0")/lib/env.sh"
source "$HW_ROOT/scripts/lib/build.sh"
cd "$HW_ROOT"

command -v curl >/dev/null || hw_apt_install curl
hw_ensure_node_modules
bash scripts/db.sh start
hw_build

export DATABASE_URL="${DATABASE_URL:-$(hw_db_url)}"
export NUXT_SESSION_PASSWORD="$(hw_session_password)"
export HOSEWRIGHT_SEED_DEMO="${HOSEWRIGHT_SEED_DEMO:-1}"
export HOST="${HOST:-127.0.0.1}" PORT="${PORT:-3000}"
export NITRO_HOST="$HOST" NITRO_PORT="$PORT"

node .output/server/index.mjs &
server=$!
trap 'kill -TERM $server 2>/dev/null; wait $server 2>/dev/null; exit 0' INT TERM
if ! hw_wait_for "http://$HOST:$PORT/api/health" $server; then
  hw_die "the server did not come up"
fi
echo
hw_log "Hosewright is running at http://$HOST:$PORT"
npx tsx scripts/print-demo.ts
echo
hw_log "Ctrl-C stops the app; npm run db:stop stops the database."
wait $server
