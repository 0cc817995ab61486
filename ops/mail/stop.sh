#!/usr/bin/env bash
set -euo pipefail
. "$(dirname "$0")/../lib/env.sh"
PIDF="$RILLMARK_ROOT/.data/mail/fake-smtp.pid"
if [ -f "$PIDF" ] && kill -0 "$(cat "$PIDF")" 2>/dev/null; then
  kill -TERM "$(cat "$PIDF")"; rm -f "$PIDF"; log "fake SMTP stopped"
else
  log "fake SMTP was not running"
fi
