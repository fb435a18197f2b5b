# Build the production server when sources changed since the last build.
# HOSEWRIGHT_BUILD_TAG=x builds into .output-x (see nuxt.config.ts).
HW_OUTPUT="$HW_ROOT/.output${HOSEWRIGHT_BUILD_TAG:+-$HOSEWRIGHT_BUILD_TAG}"

hw_needs_build() {
  local stamp="$HW_OUTPUT/nitro.json"
  [ -f "$stamp" ] || return 0
  [ -n "$(cd "$HW_ROOT" && find app server shared public drizzle nuxt.config.ts tailwind.config.ts package-lock.json -newer "$stamp" -type f -print -quit 2>/dev/null)" ]
}

hw_build() {
  if hw_needs_build; then
    hw_log "building the app (nuxt build)"
    (cd "$HW_ROOT" && NODE_OPTIONS="--max-old-space-size=3072" npx nuxt build >"$HW_STATE/build.log" 2>&1) \
      || { tail -n 40 "$HW_STATE/build.log" >&2; hw_die "build failed (full log: $HW_STATE/build.log)"; }
  else
    hw_log "build is up to date"
  fi
}

# Wait until the server answers its health route.
hw_wait_for() {
  local url="$1" pid="$2" tries=0
  until curl -fsS "$url" >/dev/null 2>&1; do
    kill -0 "$pid" 2>/dev/null || return 1
    tries=$((tries + 1)); [ $tries -gt 600 ] && return 1
    sleep 0.1
  done
}
