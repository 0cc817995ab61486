#!/usr/bin/env bash
# The one command to run Rillmark locally: installs what is missing, starts MariaDB, the fake SMTP server
# and the fake weather feed on loopback, migrates, seeds the demo scenario, builds, and serves app + API on one port.
# Ctrl-C stops the server, the fake SMTP server and MariaDB.
set -euo pipefail
. "$(dirname "$0")/lib/env.sh"
cd "$RILLMARK_ROOT"

ensure_debian_packages curl
ensure_node_modules
bash ops/db/start.sh
bash ops/mail/start.sh
bash ops/weather/start.sh
npm run --silent migrate
npm run --silent seed
bash ops/build.sh

cleanup() {
  trap - INT TERM EXIT
  [ -n "${server_pid:-}" ] && kill -TERM "$server_pid" 2>/dev/null && wait "$server_pid" 2>/dev/null || true
  bash ops/mail/stop.sh || true
  bash ops/weather/stop.sh || true
  bash ops/db/stop.sh || true
}
trap cleanup INT TERM EXIT

NODE_ENV=production node --enable-source-maps dist/server/main.js &
server_pid=$!
url="http://127.0.0.1:$RILLMARK_PORT"
for _ in $(seq 1 120); do
  curl -fs "$url/api/health" >/dev/null 2>&1 && break
  kill -0 "$server_pid" 2>/dev/null || die "the server exited; see the messages above"
  sleep 0.25
done
curl -fs "$url/api/health" >/dev/null || die "the server did not answer on $url"

node --import tsx ops/seed/print-sign-ins.ts "$url"
wait "$server_pid"
