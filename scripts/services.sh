#!/usr/bin/env bash
# Starts (or reuses) the project's own PostgreSQL cluster and the local S3 and SMTP fakes,
# all on 127.0.0.1. Sourced by start.sh, stop.sh and test.sh (defining functions only);
# `bash scripts/services.sh up|down` also works.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PG_PORT="${TURNSTONE_PG_PORT:-54329}"
PG_USER="app"
PG_PASSWORD="turnstone-local"
PG_BIN="${TURNSTONE_PG_BIN:-}"
# Pid files, logs, the local cluster and backups; another folder gives another instance.
DATA_DIR="$(realpath -m "${TURNSTONE_DATA_DIR:-$ROOT/.data}")"

log() { printf '[turnstone] %s\n' "$*"; }
die() { printf '[turnstone] ERROR: %s\n' "$*" >&2; exit 1; }

is_production() { [ "${TURNSTONE_ENV:-development}" = "production" ]; }

# shellcheck source=scripts/instance.sh
source "$ROOT/scripts/instance.sh"

find_pg_bin() {
  if [ -n "$PG_BIN" ] && [ -x "$PG_BIN/pg_ctl" ]; then return 0; fi
  local d
  for d in /usr/lib/postgresql/*/bin; do
    if [ -x "$d/pg_ctl" ]; then PG_BIN="$d"; fi
  done
  [ -n "$PG_BIN" ] && [ -x "$PG_BIN/pg_ctl" ]
}

ensure_postgres_installed() {
  find_pg_bin && return 0
  if [ "$(id -u)" = "0" ]; then
    log "PostgreSQL server not found: installing Debian's postgresql package"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
    # Debian starts a system cluster on 5432; we do not use it, and our port differs.
    find_pg_bin || die "postgresql installed but no pg_ctl found under /usr/lib/postgresql"
  else
    die "PostgreSQL server binaries are missing. Install them with: sudo apt-get install postgresql (or set DATABASE_URL to an external server)"
  fi
}

# The data folder must be reachable by the `postgres` user when we run as root.
pg_data_dir() {
  local dir="$DATA_DIR/pg"
  if [ "$(id -u)" = "0" ] && ! runuser -u postgres -- test -x "$DATA_DIR" 2>/dev/null; then
    mkdir -p "$DATA_DIR" && chmod o+x "$DATA_DIR" 2>/dev/null || true
    if ! runuser -u postgres -- test -x "$DATA_DIR" 2>/dev/null; then
      # A parent folder is closed to other users: keep the cluster under /var/tmp instead, one
      # per checkout (per data folder when TURNSTONE_DATA_DIR names another).
      local owner="$ROOT"
      [ "$DATA_DIR" = "$ROOT/.data" ] || owner="$DATA_DIR"
      dir="/var/tmp/turnstone-pg-$(printf '%s' "$owner" | md5sum | cut -c1-8)"
    fi
  fi
  printf '%s' "$dir"
}

as_pg() {
  if [ "$(id -u)" = "0" ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

pg_ready() { "$PG_BIN/pg_isready" -q -h 127.0.0.1 -p "$PG_PORT" >/dev/null 2>&1; }

start_postgres() {
  ensure_postgres_installed
  if pg_ready; then log "PostgreSQL already running on 127.0.0.1:$PG_PORT (reusing it)"; return 0; fi
  local pgdata; pgdata="$(pg_data_dir)"
  mkdir -p "$DATA_DIR"
  if [ ! -f "$pgdata/PG_VERSION" ]; then
    log "Creating PostgreSQL cluster in $pgdata"
    mkdir -p "$pgdata"
    local pwfile; pwfile="$(mktemp)"; printf '%s\n' "$PG_PASSWORD" > "$pwfile"
    if [ "$(id -u)" = "0" ]; then chown postgres "$pgdata" "$pwfile"; fi
    chmod 700 "$pgdata"
    (cd "$(dirname "$pgdata")" && as_pg "$PG_BIN/initdb" -D "$pgdata" -U "$PG_USER" --pwfile="$pwfile" -E UTF8 \
      --locale=C.UTF-8 --auth-local=trust --auth-host=scram-sha-256 >/dev/null)
    rm -f "$pwfile"
  fi
  log "Starting PostgreSQL on 127.0.0.1:$PG_PORT"
  (cd "$(dirname "$pgdata")" && as_pg "$PG_BIN/pg_ctl" -D "$pgdata" -l "$pgdata/server.log" -w -t 60 \
    -o "-c listen_addresses=127.0.0.1 -c port=$PG_PORT -c unix_socket_directories='' -c max_connections=200" start >/dev/null) \
    || die "PostgreSQL did not start; see $pgdata/server.log"
  printf '%s' "$pgdata" > "$DATA_DIR/pg.location"
}

stop_postgres() {
  find_pg_bin || return 0
  local pgdata
  pgdata="$(cat "$DATA_DIR/pg.location" 2>/dev/null || pg_data_dir)"
  if [ -f "$pgdata/postmaster.pid" ]; then
    log "Stopping PostgreSQL"
    (cd "$(dirname "$pgdata")" && as_pg "$PG_BIN/pg_ctl" -D "$pgdata" -m fast -w stop >/dev/null) || true
  fi
}

# Creates a database owned by the app user when it does not exist yet.
ensure_database() {
  local name="$1"
  local exists
  exists="$(PGPASSWORD="$PG_PASSWORD" "$PG_BIN/psql" -h 127.0.0.1 -p "$PG_PORT" -U "$PG_USER" -d postgres -tAc \
    "select 1 from pg_database where datname = '$name'")"
  if [ "$exists" != "1" ]; then
    log "Creating database $name"
    PGPASSWORD="$PG_PASSWORD" "$PG_BIN/psql" -q -h 127.0.0.1 -p "$PG_PORT" -U "$PG_USER" -d postgres -c "create database \"$name\""
  fi
}

recreate_database() {
  local name="$1"
  PGPASSWORD="$PG_PASSWORD" "$PG_BIN/psql" -q -h 127.0.0.1 -p "$PG_PORT" -U "$PG_USER" -d postgres \
    -c "drop database if exists \"$name\" with (force)" -c "create database \"$name\""
}

port_open() { (exec 3<>"/dev/tcp/127.0.0.1/$1") >/dev/null 2>&1; }

start_fakes() {
  local s3_port="${TURNSTONE_S3_PORT:-54330}" smtp_port="${TURNSTONE_SMTP_PORT:-54331}" mail_api_port="${TURNSTONE_MAIL_API_PORT:-54332}"
  if port_open "$s3_port" && port_open "$smtp_port" && port_open "$mail_api_port"; then log "Local S3 and SMTP fakes already running (reusing them)"; return 0; fi
  mkdir -p "$DATA_DIR"
  log "Starting local S3 fake on 127.0.0.1:$s3_port and SMTP fake on 127.0.0.1:$smtp_port"
  start_marked fakes nohup "$ROOT/node_modules/.bin/tsx" "$ROOT/scripts/fakes.ts" >"$DATA_DIR/fakes.log" 2>&1
  echo $! > "$DATA_DIR/fakes.pid"
  local i
  for i in $(seq 1 60); do
    if port_open "$s3_port" && port_open "$smtp_port" && port_open "$mail_api_port"; then return 0; fi
    sleep 0.5
  done
  die "local fakes did not start; see $DATA_DIR/fakes.log"
}

services_up() {
  if is_production; then
    # Production names its own database, object store and mail server (lib/env.ts insists).
    log "TURNSTONE_ENV=production: using the configured database, object store and mail server"
    return 0
  fi
  if [ -z "${DATABASE_URL:-}" ]; then start_postgres; else log "DATABASE_URL is set: using that server"; fi
  start_fakes
}

services_down() {
  stop_instance
  stop_postgres
}

if [ "${BASH_SOURCE[0]}" = "$0" ]; then
  case "${1:-}" in
    up) services_up ;;
    down) services_down ;;
    *) echo "usage: scripts/services.sh up|down" >&2; exit 2 ;;
  esac
fi
