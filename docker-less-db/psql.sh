#!/usr/bin/env bash
# Opens psql on the project-local cluster as its superuser (through the socket in .data).
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
BINDIR="$(find_bindir)"
exec_args=("$BINDIR/psql" -h "$PGSOCK_DIR" -p "$PGPORT" -U postgres "$@")
if is_root; then exec runuser -u postgres -- "${exec_args[@]}"; else exec "${exec_args[@]}"; fi
