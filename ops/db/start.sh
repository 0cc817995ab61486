#!/usr/bin/env bash
# Starts Rillmark's own MariaDB on 127.0.0.1 with a private data directory (not the system service).
# Idempotent: installs mariadb-server if missing, initialises the data directory once, starts the
# server if its port is silent, and makes sure the database and the application user exist.
set -euo pipefail
. "$(dirname "$0")/../lib/env.sh"

ensure_debian_packages mariadb-server mariadb-client tzdata

DATA="$RILLMARK_DB_DIR/data"
SOCK="$RILLMARK_DB_DIR/mariadb.sock"
PIDF="$RILLMARK_DB_DIR/mariadb.pid"
LOGF="$RILLMARK_DB_DIR/mariadb.log"
mkdir -p "$RILLMARK_DB_DIR"

admin() { mariadb-admin --no-defaults --protocol=socket --socket="$SOCK" -uroot "$@"; }

if [ -f "$PIDF" ] && kill -0 "$(cat "$PIDF")" 2>/dev/null && admin ping >/dev/null 2>&1; then
  log "MariaDB already running on $RILLMARK_DB_HOST:$RILLMARK_DB_PORT (pid $(cat "$PIDF"))"
else
  if [ ! -d "$DATA/mysql" ]; then
    log "initialising MariaDB data directory in $DATA"
    mariadb-install-db --no-defaults --user=root --datadir="$DATA" --auth-root-authentication-method=socket \
      --skip-test-db >"$RILLMARK_DB_DIR/install.log" 2>&1 || { cat "$RILLMARK_DB_DIR/install.log"; die "mariadb-install-db failed"; }
  fi
  log "starting MariaDB on $RILLMARK_DB_HOST:$RILLMARK_DB_PORT"
  # --no-defaults: the Debian config points the socket at /run/mysqld and belongs to the system service.
  # Durability: the redo log is written and flushed at every commit (innodb_flush_log_at_trx_commit=1), so a committed
  # upload survives an operating-system crash or power loss (with 2, the last second of commits could vanish);
  # sync_binlog=1 does the same for the binary log wherever one is switched on (replication, point-in-time recovery).
  nohup mariadbd --no-defaults --user=root --datadir="$DATA" \
    --bind-address="$RILLMARK_DB_HOST" --port="$RILLMARK_DB_PORT" --socket="$SOCK" --pid-file="$PIDF" \
    --log-error="$LOGF" --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --default-time-zone=+00:00 --local-infile=1 --max-connections=300 \
    --innodb-buffer-pool-size="${RILLMARK_DB_BUFFER_POOL:-512M}" \
    --innodb-flush-log-at-trx-commit=1 --sync-binlog=1 \
    --transaction-isolation=READ-COMMITTED --skip-name-resolve >/dev/null 2>&1 &
  for _ in $(seq 1 120); do
    admin ping >/dev/null 2>&1 && break
    sleep 0.25
  done
  admin ping >/dev/null 2>&1 || { tail -20 "$LOGF" >&2; die "MariaDB did not start; log: $LOGF"; }
fi

# Database and application user (password auth over TCP on loopback only).
# READ COMMITTED: under REPEATABLE READ, range deletes and inserts into empty ranges take gap locks that
# reach into other sites' rows, and two sites' uploads (or meter edits) at the same moment deadlocked.
# Set here too, for a server that was already running (it applies to new connections).
mariadb --no-defaults --protocol=socket --socket="$SOCK" -uroot <<SQL
SET GLOBAL tx_isolation = 'READ-COMMITTED';
SET GLOBAL innodb_flush_log_at_trx_commit = 1;
SET GLOBAL sync_binlog = 1;
CREATE DATABASE IF NOT EXISTS \`$RILLMARK_DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE DATABASE IF NOT EXISTS \`${RILLMARK_DB_NAME}_test\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$RILLMARK_DB_USER'@'127.0.0.1' IDENTIFIED BY '$RILLMARK_DB_PASSWORD';
CREATE USER IF NOT EXISTS '$RILLMARK_DB_USER'@'localhost' IDENTIFIED BY '$RILLMARK_DB_PASSWORD';
ALTER USER '$RILLMARK_DB_USER'@'127.0.0.1' IDENTIFIED BY '$RILLMARK_DB_PASSWORD';
ALTER USER '$RILLMARK_DB_USER'@'localhost' IDENTIFIED BY '$RILLMARK_DB_PASSWORD';
-- The app user owns every database whose name starts with the configured one (tests, scratch tables, benchmarks).
GRANT ALL PRIVILEGES ON \`${RILLMARK_DB_NAME}%\`.* TO '$RILLMARK_DB_USER'@'127.0.0.1', '$RILLMARK_DB_USER'@'localhost';
FLUSH PRIVILEGES;
SQL
# Time-zone tables, so SQL can group readings by each site's local day (CONVERT_TZ with IANA names).
zones=$(mariadb --no-defaults --protocol=socket --socket="$SOCK" -uroot -N -e "SELECT COUNT(*) FROM mysql.time_zone_name")
if [ "$zones" = "0" ]; then
  log "loading time-zone tables from /usr/share/zoneinfo"
  mariadb-tzinfo-to-sql /usr/share/zoneinfo 2>/dev/null | mariadb --no-defaults --protocol=socket --socket="$SOCK" -uroot mysql \
    || die "could not load the time-zone tables"
fi
log "MariaDB ready: database $RILLMARK_DB_NAME (and ${RILLMARK_DB_NAME}_test), user $RILLMARK_DB_USER"
