# Sourced by the ops scripts: project root, .env, and defaults (the same defaults as backend/src/config.ts).
RILLMARK_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
export RILLMARK_ROOT
# Variables already set in the environment win over .env (as in vitest.config.ts): a test can start a second
# MariaDB on another port and directory with the same scripts.
if [ -f "$RILLMARK_ROOT/.env" ]; then
  while IFS= read -r line || [ -n "$line" ]; do
    case "$line" in '' | '#'*) continue ;; esac
    name="${line%%=*}"
    case "$name" in *[!A-Za-z0-9_]*) continue ;; esac
    [ -n "${!name+x}" ] && continue
    eval "export $line"
  done <"$RILLMARK_ROOT/.env"
fi
export RILLMARK_DB_HOST="${RILLMARK_DB_HOST:-127.0.0.1}"
export RILLMARK_DB_PORT="${RILLMARK_DB_PORT:-3317}"
export RILLMARK_DB_NAME="${RILLMARK_DB_NAME:-rillmark}"
export RILLMARK_DB_USER="${RILLMARK_DB_USER:-rillmark}"
export RILLMARK_DB_PASSWORD="${RILLMARK_DB_PASSWORD:-rillmark-dev-password}"
RILLMARK_DB_DIR="${RILLMARK_DB_DIR:-.data/mariadb}"
case "$RILLMARK_DB_DIR" in /*) ;; *) RILLMARK_DB_DIR="$RILLMARK_ROOT/$RILLMARK_DB_DIR" ;; esac
export RILLMARK_DB_DIR
export RILLMARK_PORT="${RILLMARK_PORT:-4280}"
export RILLMARK_SMTP_HOST="${RILLMARK_SMTP_HOST:-127.0.0.1}"
export RILLMARK_SMTP_PORT="${RILLMARK_SMTP_PORT:-2526}"
export RILLMARK_FAKE_SMTP_HTTP_PORT="${RILLMARK_FAKE_SMTP_HTTP_PORT:-2580}"

log() { printf '\033[36m[rillmark]\033[0m %s\n' "$*"; }
die() { printf '\033[31m[rillmark] %s\033[0m\n' "$*" >&2; exit 1; }

# Installs Debian packages that are missing (root, or sudo when available).
ensure_debian_packages() {
  local missing=()
  for pkg in "$@"; do
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q "install ok installed" || missing+=("$pkg")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  local sudo=""
  [ "$(id -u)" -eq 0 ] || sudo="sudo"
  log "installing Debian packages: ${missing[*]} (policy-rc.d may refuse to start the system service; that is expected)"
  $sudo apt-get update -qq || die "apt-get update failed"
  DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq "${missing[@]}" >/dev/null \
    || die "apt-get install ${missing[*]} failed"
}

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  cd "$RILLMARK_ROOT" || exit 1
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund >/dev/null || die "npm ci failed"
  fi
}

# tsx reads one tsconfig (not the nearest one per file); the back end's has the decorator settings.
export TSX_TSCONFIG_PATH="$RILLMARK_ROOT/backend/tsconfig.json"

# The local fake weather feed (ops/weather) and where the server looks for a feed.
export RILLMARK_FAKE_WEATHER_PORT="${RILLMARK_FAKE_WEATHER_PORT:-2590}"
export RILLMARK_WEATHER_FEED_URL="${RILLMARK_WEATHER_FEED_URL:-http://127.0.0.1:$RILLMARK_FAKE_WEATHER_PORT}"
