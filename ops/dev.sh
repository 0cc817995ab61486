#!/usr/bin/env bash
# Development: MariaDB + fake SMTP + fake weather feed, the API with reload (tsx watch) on :4280, and `ng serve` on :4200
# proxying /api to it. Ctrl-C stops both servers (MariaDB and the fake SMTP server keep running;
# stop them with npm run db:stop and bash ops/mail/stop.sh).
set -euo pipefail
. "$(dirname "$0")/lib/env.sh"
cd "$RILLMARK_ROOT"
# Development: the outbox (admins see their organisation's mail from the fake SMTP server) is on unless .env says otherwise.
export RILLMARK_DEV_OUTBOX="${RILLMARK_DEV_OUTBOX:-true}"
ensure_node_modules
bash ops/db/start.sh
bash ops/mail/start.sh
bash ops/weather/start.sh
npm run --silent migrate
npm run --silent seed
node --import tsx --watch backend/src/main.ts &
api=$!
trap 'kill $api 2>/dev/null || true' EXIT INT TERM
npx ng serve --host 127.0.0.1 --port 4200
