#!/usr/bin/env bash
# Prints "running PID" or "stopped" for the project-local cluster.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
pid="$(running_pid)"
if [ -n "$pid" ]; then echo "running $pid"; else echo "stopped"; fi
