# Shared settings for Hosewright's shell scripts. Source it; it defines HW_* variables and helpers.
# Everything local lives in one state directory: inside the checkout (.data/) when the `postgres`
# user can reach it, else under /var/tmp keyed by the checkout path.

HW_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
export NUXT_TELEMETRY_DISABLED=1
export NEXT_TELEMETRY_DISABLED=1
export DO_NOT_TRACK=1

hw_log() { printf '\033[1m[hosewright]\033[0m %s\n' "$*"; }
hw_die() { printf '\033[1;31m[hosewright] %s\033[0m\n' "$*" >&2; exit 1; }

hw_is_root() { [ "$(id -u)" = "0" ]; }

# Run a command as the account that owns the cluster (postgres refuses to run as root).
hw_as_pg() {
  if hw_is_root; then runuser -u postgres -- "$@"; else "$@"; fi
}

hw_pg_bindir() {
  local d
  for d in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    if [ -x "$d/initdb" ] && [ -x "$d/postgres" ]; then echo "$d"; return 0; fi
  done
  return 1
}

hw_state_dir() {
  if [ -n "${HOSEWRIGHT_STATE_DIR:-}" ]; then echo "$HOSEWRIGHT_STATE_DIR"; return; fi
  if ! hw_is_root || ! id postgres >/dev/null 2>&1 || runuser -u postgres -- test -x "$HW_ROOT"; then
    echo "$HW_ROOT/.data"
  else
    echo "/var/tmp/hosewright-$(printf '%s' "$HW_ROOT" | sha1sum | cut -c1-12)"
  fi
}

HW_STATE="$(hw_state_dir)"
HW_PGDATA="$HW_STATE/pg"
HW_DB_NAME="${HOSEWRIGHT_DB_NAME:-hosewright}"
HW_DB_USER="hosewright"

hw_pg_port() {
  if [ -f "$HW_STATE/pg-port" ]; then cat "$HW_STATE/pg-port"; else echo "${HOSEWRIGHT_PG_PORT:-54329}"; fi
}

hw_db_url() { echo "postgres://$HW_DB_USER@127.0.0.1:$(hw_pg_port)/${1:-$HW_DB_NAME}"; }

# Session secret for nuxt-auth-utils: taken from the environment, else generated once and kept.
hw_session_password() {
  if [ -n "${NUXT_SESSION_PASSWORD:-}" ]; then echo "$NUXT_SESSION_PASSWORD"; return; fi
  mkdir -p "$HW_STATE"
  if [ ! -s "$HW_STATE/session-secret" ]; then
    (umask 077; node -e "process.stdout.write(require('crypto').randomBytes(36).toString('base64url'))" > "$HW_STATE/session-secret")
  fi
  cat "$HW_STATE/session-secret"
}

# Install Debian packages that are missing (only as root, only what is asked for).
hw_apt_install() {
  local missing=() p
  for p in "$@"; do dpkg -s "$p" >/dev/null 2>&1 || missing+=("$p"); done
  [ ${#missing[@]} -eq 0 ] && return 0
  hw_is_root || hw_die "missing Debian packages: ${missing[*]} (install them, or run as root)"
  hw_log "installing ${missing[*]} (apt-get)"
  export DEBIAN_FRONTEND=noninteractive
  apt-get install -y --no-install-recommends "${missing[@]}" >/dev/null 2>&1 \
    || { apt-get update >/dev/null 2>&1 && apt-get install -y --no-install-recommends "${missing[@]}" >/dev/null; } \
    || hw_die "apt-get could not install ${missing[*]}"
}

# npm dependencies: install when node_modules is missing or older than package-lock.json.
hw_ensure_node_modules() {
  local stamp="$HW_ROOT/node_modules/.hosewright-lock-hash" want
  want="$(sha1sum "$HW_ROOT/package-lock.json" | cut -c1-40)"
  if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$want" ]; then return 0; fi
  hw_log "installing npm dependencies (npm ci)"
  (cd "$HW_ROOT" && npm ci --no-audit --no-fund --loglevel=error) || hw_die "npm ci failed"
  echo "$want" > "$stamp"
}
