#!/usr/bin/env bash
# For working on the API and browser suites: build if needed and serve the test database on
# port 3100 in the foreground. In another shell:
#   HOSEWRIGHT_TEST_URL=http://127.0.0.1:3100 HOSEWRIGHT_TEST_DATABASE_URL=$(scripts/db.sh url hosewright_test) npx vitest run --project api
set -euo pipefail
source "$(dirname "$0")/lib/env.sh"
source "$HW_ROOT/scripts/lib/build.sh"
cd "$HW_ROOT"
bash scripts/db.sh start
[ "${1:-}" = "--fresh" ] && bash scripts/db.sh recreate hosewright_test
hw_build
DATABASE_URL="$(hw_db_url hosewright_test)" NUXT_SESSION_PASSWORD="test-session-password-0123456789abcdef" \
  HOSEWRIGHT_SEED_DEMO=1 HOSEWRIGHT_TRUST_PROXY=1 NITRO_HOST=127.0.0.1 NITRO_PORT="${HOSEWRIGHT_TEST_PORT:-3100}" \
  exec node .output/server/index.mjs
