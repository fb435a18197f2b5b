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
