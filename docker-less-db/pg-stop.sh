#!/usr/bin/env bash
# Stops the project-local cluster by the pid in its own pid file. Stopping a stopped cluster
# is fine; a stale pid file (after a crash or kill -9) is removed.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

pid="$(running_pid)"
if [ -z "$pid" ]; then
  rm -f "$PGDATA_DIR/postmaster.pid"
  log "PostgreSQL is not running"
  exit 0
fi
log "stopping PostgreSQL (pid $pid)"
# SIGINT is PostgreSQL's "fast" shutdown: roll back open transactions, close connections.
kill -INT "$pid" 2>/dev/null || true
for _ in $(seq 1 100); do
  kill -0 "$pid" 2>/dev/null || exit 0
  sleep 0.2
done
log "PostgreSQL did not stop in 20 s; sending SIGQUIT"
kill -QUIT "$pid" 2>/dev/null || true
sleep 1
