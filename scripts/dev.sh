#!/usr/bin/env bash
# npm run dev: the database plus Nuxt's dev server with hot reload.
set -euo pipefail
source "$(dirname "$0")/lib/env.sh"
cd "$HW_ROOT"
hw_ensure_node_modules
bash scripts/db.sh start
export DATABASE_URL="${DATABASE_URL:-$(hw_db_url)}"
export NUXT_SESSION_PASSWORD="$(hw_session_password)"
export HOSEWRIGHT_SEED_DEMO="${HOSEWRIGHT_SEED_DEMO:-1}"
exec npx nuxt dev --host "${HOST:-127.0.0.1}" --port "${PORT:-3000}"
