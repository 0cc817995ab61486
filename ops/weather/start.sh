#!/usr/bin/env bash
# Starts the local fake weather feed in the background (idempotent); its pid and log go to .data/weather/.
set -euo pipefail
. "$(dirname "$0")/../lib/env.sh"
DIR="$RILLMARK_ROOT/.data/weather"
mkdir -p "$DIR"
HOST="${RILLMARK_FAKE_WEATHER_HOST:-127.0.0.1}"
PORT="${RILLMARK_FAKE_WEATHER_PORT:-2590}"
if [ -f "$DIR/fake-weather.pid" ] && kill -0 "$(cat "$DIR/fake-weather.pid")" 2>/dev/null; then
  log "fake weather feed already running (pid $(cat "$DIR/fake-weather.pid"))"
  exit 0
fi
cd "$RILLMARK_ROOT"
RILLMARK_FAKE_WEATHER_HOST="$HOST" RILLMARK_FAKE_WEATHER_PORT="$PORT" nohup node --import tsx ops/weather/fake-weather-server.ts >"$DIR/fake-weather.log" 2>&1 &
echo $! >"$DIR/fake-weather.pid"
for _ in $(seq 1 80); do
  curl -fs "http://$HOST:$PORT/status" >/dev/null 2>&1 && break
  sleep 0.25
done
curl -fs "http://$HOST:$PORT/status" >/dev/null || { cat "$DIR/fake-weather.log" >&2; die "fake weather feed did not start"; }
log "fake weather feed on http://$HOST:$PORT"
