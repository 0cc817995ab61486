#!/usr/bin/env bash
# Builds the Angular app (dist/web) and the server bundle (dist/server) when their sources changed.
set -euo pipefail
. "$(dirname "$0")/lib/env.sh"
cd "$RILLMARK_ROOT"
stamp=dist/web/browser/index.html
if [ ! -f "$stamp" ] || [ -n "$(find frontend shared angular.json package-lock.json -newer "$stamp" -type f -print -quit)" ]; then
  log "building the web app (ng build, production)"
  npx ng build --configuration production >/tmp/rillmark-ng-build.log 2>&1 || { cat /tmp/rillmark-ng-build.log; die "ng build failed"; }
  grep -E "Initial total|budget" /tmp/rillmark-ng-build.log || true
fi
server=dist/server/main.js
if [ ! -f "$server" ] || [ -n "$(find backend/src shared package-lock.json -newer "$server" -type f -print -quit)" ]; then
  log "bundling the server (esbuild)"
  npm run --silent build:server >/dev/null 2>&1 || { npm run build:server; die "server bundle failed"; }
fi
