#!/usr/bin/env bash
# Starts the local fake SMTP server in the background (idempotent); its pid and log go to .data/mail/.
set -euo pipefail
. "$(dirname "$0")/../lib/env.sh"
DIR="$RILLMARK_ROOT/.data/mail"
mkdir -p "$DIR"
if [ -f "$DIR/fake-smtp.pid" ] && kill -0 "$(cat "$DIR/fake-smtp.pid")" 2>/dev/null; then
  log "fake SMTP already running (pid $(cat "$DIR/fake-smtp.pid"))"
  exit 0
fi
cd "$RILLMARK_ROOT"
RILLMARK_FAKE_SMTP_FILE="$DIR/messages.jsonl" nohup node --import tsx ops/mail/fake-smtp-server.ts >"$DIR/fake-smtp.log" 2>&1 &
echo $! >"$DIR/fake-smtp.pid"
for _ in $(seq 1 80); do
  curl -fs "http://$RILLMARK_SMTP_HOST:$RILLMARK_FAKE_SMTP_HTTP_PORT/messages" >/dev/null 2>&1 && break
  sleep 0.25
done
curl -fs "http://$RILLMARK_SMTP_HOST:$RILLMARK_FAKE_SMTP_HTTP_PORT/messages" >/dev/null || { cat "$DIR/fake-smtp.log" >&2; die "fake SMTP did not start"; }
log "fake SMTP on $RILLMARK_SMTP_HOST:$RILLMARK_SMTP_PORT (outbox http://$RILLMARK_SMTP_HOST:$RILLMARK_FAKE_SMTP_HTTP_PORT/messages)"
