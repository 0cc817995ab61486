#!/usr/bin/env bash
# Fails when the built app references a font host or CDN: everything must be served by Rillmark itself.
set -euo pipefail
. "$(dirname "$0")/lib/env.sh"
cd "$RILLMARK_ROOT"
[ -f dist/web/browser/index.html ] || die "no build in dist/web; run bash ops/build.sh"
pattern='fonts\.googleapis|fonts\.gstatic|googleapis\.com|cdn\.jsdelivr|unpkg\.com|cdnjs|use\.typekit|fontawesome\.com|bootstrapcdn'
if grep -rEl "$pattern" dist/web/browser; then
  die "the files above reference an external font or CDN host"
fi
fonts=$(find dist/web/browser -name '*.woff2' | wc -l)
[ "$fonts" -gt 0 ] || die "no .woff2 fonts were shipped in dist/web/browser"
log "no external hosts referenced; $fonts font files shipped with the app"
