#!/usr/bin/env bash
# Drops and recreates the development database, then migrates and seeds the demo scenario again.
set -euo pipefail
. "$(dirname "$0")/../lib/env.sh"
bash "$RILLMARK_ROOT/ops/db/start.sh"
mariadb --no-defaults --protocol=socket --socket="$RILLMARK_DB_DIR/mariadb.sock" -uroot \
  -e "DROP DATABASE IF EXISTS \`$RILLMARK_DB_NAME\`; CREATE DATABASE \`$RILLMARK_DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
cd "$RILLMARK_ROOT"
npm run --silent migrate
npm run --silent seed
log "database $RILLMARK_DB_NAME reset, migrated and seeded"
