# Shared settings of the project-local PostgreSQL cluster. Sourced by the other scripts.
# The cluster lives under .data/ at the repository root (gitignored), listens on 127.0.0.1
# only, and keeps its socket inside .data so it never meets a system cluster.
set -euo pipefail

ROOT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_ROOT="${BIASPROOF_DATA_DIR:-$ROOT_DIR/.data}"
PGDATA_DIR="$DATA_ROOT/pg"
PGSOCK_DIR="$DATA_ROOT/sock"
PGLOG_FILE="$DATA_ROOT/pg.log"
PGPORT="${PGPORT:-54329}"
APP_DB="${BIASPROOF_DB_NAME:-biasproof}"
APP_ROLE="${BIASPROOF_DB_USER:-biasproof}"
APP_PASSWORD="${BIASPROOF_DB_PASSWORD:-biasproof-local}"

log() { printf '[db] %s\n' "$*" >&2; }

is_root() { [ "$(id -u)" -eq 0 ]; }

# Runs a command as the cluster's owner: the postgres system user when we are root
# (initdb and postgres refuse to run as root), otherwise ourselves.
as_owner() {
  if is_root; then
    runuser -u postgres -- "$@"
  else
    "$@"
  fi
}

find_bindir() {
  local dir
  if command -v pg_config >/dev/null 2>&1; then
    dir="$(pg_config --bindir 2>/dev/null || true)"
    if [ -n "$dir" ] && [ -x "$dir/postgres" ] && [ -x "$dir/initdb" ]; then
      printf '%s\n' "$dir"
      return 0
    fi
  fi
  # Debian keeps server binaries out of PATH, one folder per major version; take the newest.
  for dir in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -t/ -k4 -n -r); do
    if [ -x "$dir/postgres" ] && [ -x "$dir/initdb" ]; then
      printf '%s\n' "$dir"
      return 0
    fi
  done
  return 1
}

ensure_server_installed() {
  if find_bindir >/dev/null; then return 0; fi
  if is_root; then
    log "PostgreSQL server binaries not found; installing Debian's postgresql package"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -q >&2
    apt-get install -y -q postgresql >&2
    find_bindir >/dev/null || { log "postgresql installed but no server binaries found"; exit 1; }
  else
    log "PostgreSQL server binaries not found. Install them once, then run this again:"
    log "  sudo apt-get update && sudo apt-get install -y postgresql"
    exit 1
  fi
}

# Prints the postmaster's pid when the cluster is running, nothing otherwise. A pid file left
# by a crash or kill -9 (its process gone, or the pid reused by another program) counts as
# not running.
running_pid() {
  local pidfile="$PGDATA_DIR/postmaster.pid" pid
  [ -f "$pidfile" ] || return 0
  pid="$(head -n 1 "$pidfile" 2>/dev/null || true)"
  [ -n "$pid" ] || return 0
  if is_live_postgres "$pid"; then
    printf '%s\n' "$pid"
  fi
}

# True when pid is a live (not zombie) postgres process.
is_live_postgres() {
  local pid="$1" state
  [ -r "/proc/$pid/stat" ] || return 1
  grep -q postgres "/proc/$pid/comm" 2>/dev/null || return 1
  state="$(sed -E 's/^[0-9]+ \(.*\) ([A-Z]).*/\1/' "/proc/$pid/stat" 2>/dev/null || echo X)"
  [ "$state" != "Z" ] && [ "$state" != "X" ]
}

# After a kill -9 of the postmaster its backends can live on and hold the shared memory,
# which stops a new postmaster. They are recognised by working in this cluster's data folder.
kill_orphaned_backends() {
  local dir pid real
  real="$(readlink -f "$PGDATA_DIR")"
  for dir in /proc/[0-9]*; do
    pid="${dir#/proc/}"
    [ "$(readlink "$dir/cwd" 2>/dev/null)" = "$real" ] || continue
    grep -q postgres "$dir/comm" 2>/dev/null || continue
    log "ending orphaned PostgreSQL process $pid"
    kill -9 "$pid" 2>/dev/null || true
  done
}
