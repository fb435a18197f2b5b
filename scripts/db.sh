#!/usr/bin/env bash
# Private PostgreSQL cluster for this checkout: 127.0.0.1 only, its own port, socket in its data dir.
#   scripts/db.sh start        install if missing, init once, start, create the app database
#   scripts/db.sh stop         stop the cluster
#   scripts/db.sh recreate DB  drop and create database DB (used for the test database)
#   scripts/db.sh url [DB]     print the connection URL
set -euo pipefail
source "$(dirname "$0")/lib/env.sh"

ensure_server_binaries() {
  if ! hw_pg_bindir >/dev/null; then hw_apt_install postgresql; fi
  PGBIN="$(hw_pg_bindir)" || hw_die "PostgreSQL server binaries not found under /usr/lib/postgresql"
}

port_is_free() { ! (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

pick_port() {
  [ -f "$HW_STATE/pg-port" ] && return 0
  local p="${HOSEWRIGHT_PG_PORT:-54329}"
  while ! port_is_free "$p"; do p=$((p + 1)); done
  echo "$p" > "$HW_STATE/pg-port"
}

init_cluster() {
  [ -f "$HW_PGDATA/PG_VERSION" ] && return 0
  hw_log "creating a private PostgreSQL cluster in $HW_PGDATA"
  mkdir -p "$HW_PGDATA"
  chmod 755 "$HW_STATE"
  if hw_is_root; then chown postgres:postgres "$HW_PGDATA"; fi
  chmod 700 "$HW_PGDATA"
  hw_as_pg "$PGBIN/initdb" -D "$HW_PGDATA" --username="$HW_DB_USER" --auth=trust --encoding=UTF8 \
    --locale=C.UTF-8 >/dev/null
  local port; port="$(hw_pg_port)"
  hw_as_pg tee -a "$HW_PGDATA/postgresql.conf" >/dev/null <<CONF
# --- Hosewright private cluster ---
listen_addresses = '127.0.0.1'
port = $port
unix_socket_directories = '$HW_PGDATA'
fsync = on
max_connections = 100
CONF
}

is_running() {
  "$PGBIN/pg_isready" -q -h 127.0.0.1 -p "$(hw_pg_port)" -U "$HW_DB_USER" 2>/dev/null || return 1
  # make sure the server on this port is ours, not another checkout's
  local dir
  dir="$("$PGBIN/psql" -h 127.0.0.1 -p "$(hw_pg_port)" -U "$HW_DB_USER" -d postgres -Atc 'show data_directory' 2>/dev/null)" || return 1
  [ "$dir" = "$HW_PGDATA" ] || hw_die "port $(hw_pg_port) is served by another cluster ($dir); set HOSEWRIGHT_PG_PORT or remove $HW_STATE/pg-port"
}

start() {
  ensure_server_binaries
  mkdir -p "$HW_STATE"
  pick_port
  init_cluster
  if ! is_running; then
    hw_log "starting PostgreSQL on 127.0.0.1:$(hw_pg_port)"
    local tries=0
    until hw_as_pg "$PGBIN/pg_ctl" -D "$HW_PGDATA" -l "$HW_PGDATA/server.log" -w -t 60 start >/dev/null 2>&1; do
      # a server that was killed can look alive to pg_ctl for a few seconds: wait and retry
      tries=$((tries + 1)); [ $tries -ge 5 ] && { tail -n 20 "$HW_PGDATA/server.log" >&2; hw_die "PostgreSQL did not start"; }
      is_running && break
      sleep 2
    done
  fi
  create_db "$HW_DB_NAME"
}

psql_admin() { "$PGBIN/psql" -h 127.0.0.1 -p "$(hw_pg_port)" -U "$HW_DB_USER" -d postgres -v ON_ERROR_STOP=1 -Atq "$@"; }

create_db() {
  if [ "$(psql_admin -c "select 1 from pg_database where datname = '$1'")" != "1" ]; then
    psql_admin -c "create database \"$1\"" >/dev/null
  fi
}

stop() {
  ensure_server_binaries
  if [ -f "$HW_PGDATA/PG_VERSION" ] && hw_as_pg "$PGBIN/pg_ctl" -D "$HW_PGDATA" status >/dev/null 2>&1; then
    hw_as_pg "$PGBIN/pg_ctl" -D "$HW_PGDATA" -m fast -w stop >/dev/null
    hw_log "PostgreSQL stopped"
  else
    hw_log "PostgreSQL was not running"
  fi
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  recreate)
    [ -n "${2:-}" ] || hw_die "usage: db.sh recreate DBNAME"
    start
    psql_admin -c "drop database if exists \"$2\" with (force)" >/dev/null
    psql_admin -c "create database \"$2\"" >/dev/null ;;
  url) echo "$(hw_db_url "${2:-}")" ;;
  *) hw_die "usage: db.sh start|stop|recreate DB|url [DB]" ;;
esac
