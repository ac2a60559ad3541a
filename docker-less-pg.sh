#!/usr/bin/env bash
# A private PostgreSQL cluster for Fringe Docket, without containers.
#
#   ./docker-less-pg.sh start    install Debian's postgresql if missing, init and start the cluster,
#                                create the app role and database (idempotent)
#   ./docker-less-pg.sh stop     stop the cluster
#   ./docker-less-pg.sh status   exit 0 when running, 3 when stopped
#   ./docker-less-pg.sh url      print the DATABASE_URL of the app database
#   ./docker-less-pg.sh reset    drop and recreate the app database (cluster keeps running)
#
# Settings (environment): PGPORT (54329), PG_DATA_DIR (.data/pg inside the checkout, or a folder under
# /var/tmp when the postgres user cannot reach the checkout), PG_APP_USER (fringe), PG_APP_PASSWORD
# (fringe), PG_APP_DB (fringe_docket). The cluster listens on 127.0.0.1 only.
set -euo pipefail

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
PGPORT="${PGPORT:-54329}"
APP_USER="${PG_APP_USER:-fringe}"
APP_PASSWORD="${PG_APP_PASSWORD:-fringe}"
APP_DB="${PG_APP_DB:-fringe_docket}"

log() { printf '[pg] %s\n' "$*" >&2; }

as_postgres() {
  if [ "$(id -u)" = "0" ]; then
    runuser -u postgres -- "$@"
  elif [ "$(id -un)" = "postgres" ]; then
    "$@"
  else
    log "run as root (or as the postgres user): the cluster belongs to the postgres user"
    exit 1
  fi
}

ensure_installed() {
  if ! dpkg -s postgresql >/dev/null 2>&1 || ! ls /usr/lib/postgresql/*/bin/pg_ctl >/dev/null 2>&1; then
    log "installing Debian's postgresql (apt-get)"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >/dev/null
    apt-get install -y -qq postgresql >/dev/null
    # Debian starts its own cluster on 5432; we do not need it.
    if command -v pg_ctlcluster >/dev/null 2>&1; then
      for v in /usr/lib/postgresql/*; do
        pg_ctlcluster "$(basename "$v")" main stop >/dev/null 2>&1 || true
      done
    fi
  fi
}

pg_bin() {
  local newest
  newest="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)"
  if [ -z "$newest" ]; then
    log "no PostgreSQL server binaries under /usr/lib/postgresql"
    exit 1
  fi
  printf '%s' "$newest"
}

# The postgres user must be able to enter every parent folder of the data dir. A checkout under a
# 0700 parent (or under /root) is not reachable: fall back to /var/tmp, named after the checkout path.
reachable_by_postgres() {
  local dir="$1"
  while [ "$dir" != "/" ] && [ -n "$dir" ]; do
    if [ -d "$dir" ]; then
      runuser -u postgres -- test -x "$dir" 2>/dev/null || return 1
    fi
    dir="$(dirname "$dir")"
  done
  return 0
}

data_dir() {
  if [ -n "${PG_DATA_DIR:-}" ]; then
    printf '%s' "$PG_DATA_DIR"
    return
  fi
  local local_dir="$here/.data/pg"
  if [ "$(id -u)" != "0" ] || reachable_by_postgres "$here"; then
    printf '%s' "$local_dir"
  else
    local tag
    tag="$(printf '%s' "$here" | sha256sum | cut -c1-12)"
    printf '%s' "/var/tmp/fringe-docket-pg-$tag"
  fi
}

DATA="$(data_dir)"

is_running() {
  [ -f "$DATA/PG_VERSION" ] && as_postgres "$(pg_bin)/pg_ctl" -D "$DATA" status >/dev/null 2>&1
}

psql_admin() {
  as_postgres "$(pg_bin)/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres -v ON_ERROR_STOP=1 -qtA "$@"
}

init_cluster() {
  local bin
  bin="$(pg_bin)"
  mkdir -p "$DATA"
  chown -R postgres:postgres "$DATA"
  chmod 700 "$DATA"
  log "initialising a cluster in $DATA"
  as_postgres "$bin/initdb" -D "$DATA" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
  cat >>"$DATA/postgresql.conf" <<CONF

# Fringe Docket private cluster
listen_addresses = '127.0.0.1'
port = $PGPORT
unix_socket_directories = '$DATA'
max_connections = 200
shared_buffers = 128MB
fsync = off
synchronous_commit = off
full_page_writes = off
CONF
}

ensure_app_database() {
  local exists
  exists="$(psql_admin -c "select 1 from pg_roles where rolname = '$APP_USER'")"
  if [ "$exists" != "1" ]; then
    psql_admin -c "create role \"$APP_USER\" login createdb password '$APP_PASSWORD'"
  fi
  exists="$(psql_admin -c "select 1 from pg_database where datname = '$APP_DB'")"
  if [ "$exists" != "1" ]; then
    psql_admin -c "create database \"$APP_DB\" owner \"$APP_USER\""
    log "created database $APP_DB"
  fi
}

cmd_start() {
  ensure_installed
  if [ ! -f "$DATA/PG_VERSION" ]; then
    init_cluster
  fi
  # The port in postgresql.conf wins over the environment; keep them in step.
  sed -i "s/^port = .*/port = $PGPORT/" "$DATA/postgresql.conf"
  if ! is_running; then
    chown -R postgres:postgres "$DATA"
    as_postgres "$(pg_bin)/pg_ctl" -D "$DATA" -l "$DATA/server.log" -w -t 60 start >/dev/null
    log "PostgreSQL running on 127.0.0.1:$PGPORT (data in $DATA)"
  fi
  ensure_app_database
}

cmd_stop() {
  if is_running; then
    as_postgres "$(pg_bin)/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null
    log "stopped"
  fi
}

cmd_status() {
  if is_running; then
    echo "running on 127.0.0.1:$PGPORT (data in $DATA)"
    exit 0
  fi
  echo "stopped"
  exit 3
}

cmd_url() {
  printf 'postgres://%s:%s@127.0.0.1:%s/%s\n' "$APP_USER" "$APP_PASSWORD" "$PGPORT" "$APP_DB"
}

cmd_reset() {
  cmd_start
  psql_admin -c "drop database if exists \"$APP_DB\" with (force)"
  psql_admin -c "create database \"$APP_DB\" owner \"$APP_USER\""
  log "database $APP_DB recreated"
}

case "${1:-}" in
  start) cmd_start ;;
  stop) cmd_stop ;;
  status) cmd_status ;;
  url) cmd_url ;;
  reset) cmd_reset ;;
  *)
    echo "usage: $0 start|stop|status|url|reset" >&2
    exit 2
    ;;
esac
