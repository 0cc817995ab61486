#!/usr/bin/env bash
set -euo pipefail
. "$(dirname "$0")/../lib/env.sh"
PIDF="$RILLMARK_ROOT/.data/weather/fake-weather.pid"
if [ -f "$PIDF" ] && kill -0 "$(cat "$PIDF")" 2>/dev/null; then
  kill -TERM "$(cat "$PIDF")"; rm -f "$PIDF"; log "fake weather feed stopped"
else
  log "fake weather feed was not running"
fi
