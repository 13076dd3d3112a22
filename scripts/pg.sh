#!/usr/bin/env bash
# Project-local PostgreSQL on loopback, used by the start command and by the tests.
#   scripts/pg.sh start    install (apt-get) if missing, create the cluster once, start it, create databases
#   scripts/pg.sh stop     stop the cluster cleanly
#   scripts/pg.sh status   print whether it runs
#   scripts/pg.sh url [db] print the connection URL
# When DATABASE_URL is set, nothing here runs: that server is used as it is.
set -euo pipefail

# shellcheck source=lib-data-dir.sh
. "$(dirname "${BASH_SOURCE[0]}")/lib-data-dir.sh"
PGDATA_DIR="$DATA_ROOT/pg"
RUN_DIR="$DATA_ROOT/pg-run"
PORT="${CW_PG_PORT:-54329}"
DB_NAME="${CW_DB_NAME:-choicewright}"
LOCK="$DATA_ROOT/pg.lock"

# As root the server runs as the postgres OS user, who must be able to reach the cluster
# folder. When the project sits below a folder closed to other users (e.g. /root), the
# cluster goes to a per-project folder under the postgres user's home instead.
resolve_cluster_dirs() {
  if [ "$(id -u)" -eq 0 ] && id postgres >/dev/null 2>&1 \
    && ! runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
    PG_HOME_DIR="$(getent passwd postgres | cut -d: -f6)"
    PROJECT_KEY="$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)"
    PGDATA_DIR="${PG_HOME_DIR:-/var/lib/postgresql}/choicewright-$PROJECT_KEY/pg"
    RUN_DIR="${PG_HOME_DIR:-/var/lib/postgresql}/choicewright-$PROJECT_KEY/run"
  fi
}
resolve_cluster_dirs

log() { echo "[postgres] $*" >&2; }

find_bin() {
  local d
  for d in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    if [ -x "$d/pg_ctl" ]; then echo "$d"; return 0; fi
  done
  return 1
}

ensure_installed() {
  if find_bin >/dev/null; then return 0; fi
  log "PostgreSQL not found; installing the Debian package (apt-get)…"
  if [ "$(id -u)" -ne 0 ]; then
    log "need root to apt-get install postgresql; install it or set DATABASE_URL"; exit 1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get update -qq >&2
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >&2
  find_bin >/dev/null || { log "postgresql install failed"; exit 1; }
}

# PostgreSQL refuses to run as root: as root, every server command runs as the postgres OS user.
as_owner() {
  if [ "$(id -u)" -eq 0 ]; then
    # From /, so the server tools never depend on reaching the caller's working folder.
    (cd / && runuser -u postgres -- "$@")
  else
    "$@"
  fi
}

owner_name() { if [ "$(id -u)" -eq 0 ]; then echo postgres; else id -un; fi; }

psql_admin() {
  "$BIN/psql" -h 127.0.0.1 -p "$PORT" -U "$(owner_name)" -d postgres -v ON_ERROR_STOP=1 -qtA "$@"
}

is_running() { [ -f "$PGDATA_DIR/PG_VERSION" ] && as_owner "$BIN/pg_ctl" -D "$PGDATA_DIR" status >/dev/null 2>&1; }

# Durability: on, except for a cluster thrown away after one CI run (CW_PG_THROWAWAY=yes, set
# only by scripts/test.sh under CI=true for a cluster it starts and stops itself), where a crash
# loses nothing of value: no flush to disk at each commit, file copy or checkpoint. The test
# suites create a database per test file and commit thousands of small transactions.
# synchronous_commit stays at its default (on): the answer path sets it off for one statement
# and a test checks that a caller's transaction keeps the server's setting.
durability_options() {
  if [ "${CW_PG_THROWAWAY:-}" = yes ]; then
    log "throwaway CI cluster: fsync and full_page_writes off"
    echo "-c fsync=off -c full_page_writes=off"
  else
    echo "-c fsync=on"
  fi
}

cmd_start() {
  ensure_installed
  resolve_cluster_dirs # the postgres user may only exist now
  BIN="$(find_bin)"
  mkdir -p "$DATA_ROOT"
  exec 9>"$LOCK"
  flock 9
  if [ ! -f "$PGDATA_DIR/PG_VERSION" ]; then
    log "creating the project cluster in $PGDATA_DIR"
    mkdir -p "$PGDATA_DIR" "$RUN_DIR"
    if [ "$(id -u)" -eq 0 ]; then
      chown postgres:postgres "$PGDATA_DIR" "$RUN_DIR"
      if [ -n "${PG_HOME_DIR+x}" ]; then chown postgres:postgres "$(dirname "$PGDATA_DIR")"; fi
      # The postgres user must be able to reach the folder.
      chmod o+x "$DATA_ROOT"
    fi
    chmod 700 "$PGDATA_DIR"
    as_owner "$BIN/initdb" -D "$PGDATA_DIR" --auth-local=trust --auth-host=trust -E UTF8 --locale=C.UTF-8 >/dev/null \
      || as_owner "$BIN/initdb" -D "$PGDATA_DIR" --auth-local=trust --auth-host=trust -E UTF8 --locale=C >/dev/null
    # Loopback only; trust is safe because nothing but this machine can connect.
    cat > /tmp/cw-pg-hba.$$ <<HBA
local all all trust
host all all 127.0.0.1/32 trust
HBA
    as_owner cp /tmp/cw-pg-hba.$$ "$PGDATA_DIR/pg_hba.conf" 2>/dev/null || cp /tmp/cw-pg-hba.$$ "$PGDATA_DIR/pg_hba.conf"
    rm -f /tmp/cw-pg-hba.$$
    if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$PGDATA_DIR/pg_hba.conf"; fi
  fi
  mkdir -p "$RUN_DIR"; if [ "$(id -u)" -eq 0 ]; then chown postgres:postgres "$RUN_DIR"; fi
  if is_running; then
    log "already running on 127.0.0.1:$PORT"
  else
    log "starting on 127.0.0.1:$PORT"
    as_owner "$BIN/pg_ctl" -D "$PGDATA_DIR" -l "$PGDATA_DIR/server.log" -w -t 60 start \
      -o "-c listen_addresses=127.0.0.1 -p $PORT -k $RUN_DIR -c max_connections=300 -c shared_buffers=128MB $(durability_options)" >/dev/null
  fi
  for db in "$DB_NAME" "$@"; do
    if [ -z "$(psql_admin -c "select 1 from pg_database where datname='$db'")" ]; then
      log "creating database $db"
      psql_admin -c "create database \"$db\""
    fi
  done
  flock -u 9
}

cmd_stop() {
  BIN="$(find_bin)" || exit 0
  if is_running; then
    log "stopping"
    as_owner "$BIN/pg_ctl" -D "$PGDATA_DIR" -m fast -w stop >/dev/null
  else
    log "not running"
  fi
}

cmd_url() {
  echo "postgres://$(owner_name)@127.0.0.1:$PORT/${1:-$DB_NAME}"
}

if [ -n "${DATABASE_URL:-}" ] && [ "${1:-}" != "url" ]; then
  log "DATABASE_URL is set; using that server"
  exit 0
fi

case "${1:-}" in
  start) shift; cmd_start "$@" ;;
  stop) cmd_stop ;;
  status) BIN="$(find_bin)"; if is_running; then echo running; else echo stopped; fi ;;
  url) shift; cmd_url "$@" ;;
  *) echo "usage: $0 start [extra-db…] | stop | status | url [db]" >&2; exit 2 ;;
esac
