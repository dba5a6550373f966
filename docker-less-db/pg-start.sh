#!/usr/bin/env bash
# Starts the project-local PostgreSQL cluster (installing and initializing it the first time),
# waits until it accepts connections, and makes sure the app role and database exist.
# Idempotent: when the cluster already runs it only checks the role and database.
# Prints "started" or "already-running" on stdout so callers know whether to stop it later.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

ensure_server_installed
BINDIR="$(find_bindir)"

mkdir -p "$DATA_ROOT" "$PGSOCK_DIR"
chmod 755 "$DATA_ROOT"
if is_root; then chown postgres:postgres "$PGSOCK_DIR"; fi

if [ ! -f "$PGDATA_DIR/PG_VERSION" ]; then
  log "initializing a new cluster in $PGDATA_DIR"
  rm -rf "$PGDATA_DIR"
  mkdir -p "$PGDATA_DIR"
  if is_root; then chown postgres:postgres "$PGDATA_DIR"; fi
  chmod 700 "$PGDATA_DIR"
  # Unix-socket connections (inside .data, reachable by the owner only) are trusted so that
  # the scripts can administer the cluster; TCP connections need the role's password.
  as_owner "$BINDIR/initdb" -D "$PGDATA_DIR" -U postgres -E UTF8 --locale=C.UTF-8 \
    --auth-local=trust --auth-host=scram-sha-256 >/dev/null
fi

state="already-running"
if [ -z "$(running_pid)" ]; then
  # A pid file whose process is gone is left by a crash or kill -9: remove it and the
  # socket lock so the postmaster starts cleanly.
  kill_orphaned_backends
  rm -f "$PGDATA_DIR/postmaster.pid" "$PGSOCK_DIR/.s.PGSQL.$PGPORT" "$PGSOCK_DIR/.s.PGSQL.$PGPORT.lock"
  log "starting PostgreSQL on 127.0.0.1:$PGPORT"
  : >"$PGLOG_FILE"
  if is_root; then chown postgres:postgres "$PGLOG_FILE"; fi
  as_owner "$BINDIR/pg_ctl" -D "$PGDATA_DIR" -l "$PGLOG_FILE" -w -t 60 \
    -o "-c listen_addresses=127.0.0.1 -p $PGPORT -k $PGSOCK_DIR" start >/dev/null || {
    log "PostgreSQL did not start; last lines of $PGLOG_FILE:"
    tail -n 20 "$PGLOG_FILE" >&2
    exit 1
  }
  state="started"
fi

for _ in $(seq 1 60); do
  if as_owner "$BINDIR/pg_isready" -h "$PGSOCK_DIR" -p "$PGPORT" -q; then break; fi
  sleep 0.5
done
as_owner "$BINDIR/pg_isready" -h "$PGSOCK_DIR" -p "$PGPORT" -q || { log "PostgreSQL does not accept connections"; exit 1; }

psql_admin() { as_owner "$BINDIR/psql" -h "$PGSOCK_DIR" -p "$PGPORT" -U postgres -d postgres -v ON_ERROR_STOP=1 -qtA "$@"; }

if [ "$(psql_admin -c "SELECT 1 FROM pg_roles WHERE rolname = '$APP_ROLE'")" != "1" ]; then
  log "creating role $APP_ROLE"
  # CREATEDB lets the test runner make and drop a fresh database for every run.
  psql_admin -c "CREATE ROLE \"$APP_ROLE\" LOGIN CREATEDB PASSWORD '$APP_PASSWORD'"
fi
if [ "$(psql_admin -c "SELECT 1 FROM pg_database WHERE datname = '$APP_DB'")" != "1" ]; then
  log "creating database $APP_DB"
  psql_admin -c "CREATE DATABASE \"$APP_DB\" OWNER \"$APP_ROLE\""
fi

echo "$state"
