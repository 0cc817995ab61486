#!/usr/bin/env bash
# Stops the project's MariaDB cleanly (by its PID file); fine to run when it is not running.
set -euo pipefail
. "$(dirname "$0")/../lib/env.sh"
PIDF="$RILLMARK_DB_DIR/mariadb.pid"
if [ -f "$PIDF" ] && kill -0 "$(cat "$PIDF")" 2>/dev/null; then
  pid=$(cat "$PIDF")
  kill -TERM "$pid"
  for _ in $(seq 1 120); do kill -0 "$pid" 2>/dev/null || break; sleep 0.25; done
  kill -0 "$pid" 2>/dev/null && die "MariaDB (pid $pid) did not stop within 30 s"
  log "MariaDB stopped"
else
  log "MariaDB was not running"
fi
