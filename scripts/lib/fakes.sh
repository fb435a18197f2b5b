# Local stand-ins for outside services, for development and tests. Source after env.sh.
# Each start exports what the app reads; call the matching stop from the caller's trap.

HW_FAKE_S3_PID=""

# hw_fake_s3_start BUCKET — when S3_ENDPOINT is set, that service is used and nothing starts.
# Otherwise s3rver serves $HW_STATE/s3 on 127.0.0.1 (HOSEWRIGHT_S3_PORT, default 4569, or the next
# free port) and the S3_* variables point the app at it.
hw_fake_s3_start() {
  local bucket="${S3_BUCKET:-$1}"
  if [ -n "${S3_ENDPOINT:-}" ]; then
    export S3_BUCKET="$bucket"
    hw_log "object storage: $S3_ENDPOINT (bucket $bucket)"
    return 0
  fi
  mkdir -p "$HW_STATE/s3"
  local port_file tries=0
  port_file="$(mktemp "$HW_STATE/fake-s3-port.XXXXXX")"
  rm -f "$port_file"
  node "$HW_ROOT/scripts/fake-s3.mjs" --dir "$HW_STATE/s3" --bucket "$bucket" \
    --port "${HOSEWRIGHT_S3_PORT:-4569}" --port-file "$port_file" --parent $$ \
    >>"$HW_STATE/fake-s3.log" 2>&1 &
  HW_FAKE_S3_PID=$!
  until [ -s "$port_file" ]; do
    kill -0 "$HW_FAKE_S3_PID" 2>/dev/null || { tail -n 20 "$HW_STATE/fake-s3.log" >&2; HW_FAKE_S3_PID=""; return 1; }
    tries=$((tries + 1)); [ $tries -gt 300 ] && { hw_fake_s3_stop; return 1; }
    sleep 0.1
  done
  local port; port="$(cat "$port_file")"; rm -f "$port_file"
  export S3_ENDPOINT="http://127.0.0.1:$port" S3_REGION="us-east-1" S3_BUCKET="$bucket" S3_FORCE_PATH_STYLE=1
  # s3rver's fixed development credentials
  export S3_ACCESS_KEY_ID="S3RVER" S3_SECRET_ACCESS_KEY="S3RVER"
  hw_log "fake S3 on $S3_ENDPOINT (bucket $bucket, data in $HW_STATE/s3)"
}

hw_fake_s3_stop() {
  if [ -n "$HW_FAKE_S3_PID" ]; then
    kill -TERM "$HW_FAKE_S3_PID" 2>/dev/null && wait "$HW_FAKE_S3_PID" 2>/dev/null
    HW_FAKE_S3_PID=""
  fi
  return 0
}

HW_FAKE_SMTP_PID=""
HW_FAKE_SMTP_WATCH_PID=""

# hw_fake_smtp_start [--fresh] — when SMTP_HOST is set, that server is used and nothing starts.
# Otherwise scripts/fake-smtp.mjs catches all mail on 127.0.0.1 (HOSEWRIGHT_SMTP_PORT, default 2525,
# or the next free pair; its HTTP API on the port after it) and keeps the messages as JSON in
# $HW_STATE/mail/<port> (--fresh empties that first). Exports SMTP_* for the app,
# HOSEWRIGHT_MAIL_API_URL for people and tests, and turns the outbox page on unless told otherwise.
hw_fake_smtp_start() {
  local fresh="" port http dir tries
  [ "${1:-}" = "--fresh" ] && fresh=1
  if [ -n "${SMTP_HOST:-}" ]; then
    hw_log "mail: SMTP server $SMTP_HOST:${SMTP_PORT:-587}"
    return 0
  fi
  port="${HOSEWRIGHT_SMTP_PORT:-2525}"
  for _ in $(seq 1 50); do
    http=$((port + 1))
    if hw_port_in_use "$port" || hw_port_in_use "$http"; then port=$((port + 2)); continue; fi
    dir="$HW_STATE/mail/$port"
    mkdir -p "$dir"
    [ -n "$fresh" ] && find "$dir" -maxdepth 1 -name '*.json' -delete
    node "$HW_ROOT/scripts/fake-smtp.mjs" "$port" "$http" "$dir" >>"$HW_STATE/fake-smtp.log" 2>&1 &
    HW_FAKE_SMTP_PID=$!
    tries=0
    until curl -fsS "http://127.0.0.1:$http/messages?to=-" >/dev/null 2>&1; do
      # lost the port to another process between the check and the listen: try the next pair
      kill -0 "$HW_FAKE_SMTP_PID" 2>/dev/null || { HW_FAKE_SMTP_PID=""; break; }
      tries=$((tries + 1)); [ $tries -gt 100 ] && { hw_fake_smtp_stop; return 1; }
      sleep 0.1
    done
    if [ -n "$HW_FAKE_SMTP_PID" ]; then
      # the catcher must not outlive this script, even when the script is killed without its trap
      ( parent=$$; while kill -0 "$parent" 2>/dev/null && kill -0 "$HW_FAKE_SMTP_PID" 2>/dev/null; do sleep 2; done
        kill -TERM "$HW_FAKE_SMTP_PID" 2>/dev/null ) >/dev/null 2>&1 &
      HW_FAKE_SMTP_WATCH_PID=$!
      export SMTP_HOST=127.0.0.1 SMTP_PORT="$port" SMTP_SECURE=0 SMTP_IGNORE_TLS=1
      unset SMTP_USER SMTP_PASS
      export HOSEWRIGHT_MAIL_API_URL="http://127.0.0.1:$http"
      export HOSEWRIGHT_MAIL_OUTBOX_PAGE="${HOSEWRIGHT_MAIL_OUTBOX_PAGE:-1}"
      hw_log "fake SMTP on 127.0.0.1:$port; sent mail at $HOSEWRIGHT_MAIL_API_URL/messages (files in $dir)"
      return 0
    fi
    port=$((port + 2))
  done
  tail -n 20 "$HW_STATE/fake-smtp.log" >&2
  return 1
}

hw_fake_smtp_stop() {
  if [ -n "$HW_FAKE_SMTP_PID" ]; then
    kill -TERM "$HW_FAKE_SMTP_PID" 2>/dev/null && wait "$HW_FAKE_SMTP_PID" 2>/dev/null || true
    HW_FAKE_SMTP_PID=""
  fi
  if [ -n "$HW_FAKE_SMTP_WATCH_PID" ]; then
    kill -TERM "$HW_FAKE_SMTP_WATCH_PID" 2>/dev/null || true
    wait "$HW_FAKE_SMTP_WATCH_PID" 2>/dev/null || true
    HW_FAKE_SMTP_WATCH_PID=""
  fi
  return 0
}

# True when something listens on 127.0.0.1:PORT.
hw_port_in_use() {
  (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}
