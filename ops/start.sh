#!/usr/bin/env bash
# The one command to run Rillmark locally: installs what is missing, starts MariaDB, the fake SMTP server
# and the fake weather feed on loopback, migrates, seeds the demo scenario, builds, and serves app + API on one port.
# The server runs under a supervisor that restarts it if it dies; Ctrl-C stops the server, the fake SMTP server,
# the weather feed and MariaDB.
set -euo pipefail
. "$(dirname "$0")/lib/env.sh"
cd "$RILLMARK_ROOT"

# A local demo: development mode (the development session secret and the fake SMTP server are fine here; with
# NODE_ENV=production the server refuses both), with the development outbox switched on explicitly (the seed's
# demo mail is tagged for it too).
export NODE_ENV=development
export RILLMARK_DEV_OUTBOX="${RILLMARK_DEV_OUTBOX:-true}"
if [ "$RILLMARK_DEV_OUTBOX" = "true" ]; then
  log "development outbox on: administrators see the mail the local fake SMTP server received for their own organisation (a development feature; refused with NODE_ENV=production)"
fi

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
  [ -n "${supervisor_pid:-}" ] && kill -TERM "$supervisor_pid" 2>/dev/null && wait "$supervisor_pid" 2>/dev/null || true
  bash ops/mail/stop.sh || true
  bash ops/weather/stop.sh || true
  bash ops/db/stop.sh || true
}
trap cleanup INT TERM EXIT

# The supervisor restarts the server if it dies (back-off, one line saying why); MariaDB, the fake SMTP server and
# the weather feed keep running meanwhile. Only Ctrl-C (or a configuration the server refuses) ends this script.
node --import tsx ops/supervise/supervise.ts -- node --enable-source-maps dist/server/main.js &
supervisor_pid=$!
url="http://127.0.0.1:$RILLMARK_PORT"
for _ in $(seq 1 120); do
  curl -fs "$url/api/health/ready" >/dev/null 2>&1 && break
  kill -0 "$supervisor_pid" 2>/dev/null || die "the server did not start; see the messages above"
  sleep 0.25
done
curl -fs "$url/api/health/ready" >/dev/null || die "the server did not answer on $url"

node --import tsx ops/seed/print-sign-ins.ts "$url"
wait "$supervisor_pid"
