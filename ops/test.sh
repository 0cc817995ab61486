#!/usr/bin/env bash
# The one command that runs every test: installs what is missing (npm packages, Debian's mariadb-server
# and chromium), starts MariaDB, the fake SMTP server and the fake weather feed if they are not running, runs the
# formatter and linter checks, type checks, unit and reference checks, API tests against MariaDB, the hostile-upload
# suite and the fault tests (their own MariaDB and fake SMTP server on this worktree's test ports), Angular component
# tests, the production build with its bundle budget, and end-to-end tests in Chromium; then stops what it started.
set -uo pipefail
. "$(dirname "$0")/lib/env.sh"
cd "$RILLMARK_ROOT"

ensure_debian_packages curl mariadb-server mariadb-client chromium
ensure_node_modules

started=()
if ! mariadb-admin --no-defaults --protocol=tcp -h "$RILLMARK_DB_HOST" -P "$RILLMARK_DB_PORT" \
  -u"$RILLMARK_DB_USER" -p"$RILLMARK_DB_PASSWORD" ping >/dev/null 2>&1; then
  bash ops/db/start.sh || die "could not start MariaDB"
  started+=(db)
fi
if ! curl -fs "http://$RILLMARK_SMTP_HOST:$RILLMARK_FAKE_SMTP_HTTP_PORT/messages" >/dev/null 2>&1; then
  bash ops/mail/start.sh || die "could not start the fake SMTP server"
  started+=(mail)
fi
if ! curl -fs "http://127.0.0.1:$RILLMARK_FAKE_WEATHER_PORT/status" >/dev/null 2>&1; then
  bash ops/weather/start.sh || die "could not start the fake weather feed"
  started+=(weather)
fi
cleanup() {
  for s in "${started[@]}"; do bash "ops/$s/stop.sh" || true; done
}
trap cleanup EXIT

status=0
results=()
stage() {
  local name=$1; shift
  log "── $name"
  local t0=$SECONDS
  if "$@"; then
    results+=("ok      $name ($((SECONDS - t0)) s)")
  else
    results+=("FAILED  $name ($((SECONDS - t0)) s)")
    status=1
  fi
}

stage "formatting (Prettier)" npx prettier --check --log-level warn .
stage "lint (ESLint)" npm run --silent lint
stage "type check (backend, shared, tests)" npx tsc -p backend/tsconfig.json --noEmit
stage "type check (frontend)" npx tsc -p frontend/tsconfig.app.json --noEmit
stage "unit and reference checks" npx vitest run --project unit
stage "API tests (MariaDB)" npx vitest run --project api
stage "hostile uploads and faults (servers in their own processes)" npx vitest run --project resilience
stage "Angular component tests" npx ng test --watch=false
stage "production build and bundle budget" bash ops/build.sh
stage "no external font or CDN host in the build" bash ops/check-no-external-hosts.sh
stage "end-to-end tests (Chromium)" npx vitest run --project e2e

echo
log "summary"
printf '  %s\n' "${results[@]}"
exit $status
