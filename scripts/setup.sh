#!/usr/bin/env bash
# Shared set-up for `npm start`, `npm test` and `npm run bench`: dependencies, the signing secret,
# MariaDB (installed if missing, started on loopback) and migrations. Source it, then call
#   evenload_setup            (uses DB_* and EVENLOAD_DB_DIR from the environment)
set -euo pipefail

evenload_log() { printf '[evenload] %s\n' "$*" >&2; }

evenload_setup() {
  cd "$(dirname "${BASH_SOURCE[0]}")/.."
  export NEXT_TELEMETRY_DISABLED=1
  if [ ! -d node_modules/next ] || [ ! -d node_modules/.bin ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    evenload_log "installing dependencies (npm ci)"
    npm ci --no-audit --no-fund >&2
  fi
  mkdir -p .data
  if [ -z "${NEXTAUTH_SECRET:-}" ]; then
    [ -s .data/nextauth-secret ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" > .data/nextauth-secret
    NEXTAUTH_SECRET="$(cat .data/nextauth-secret)"
    export NEXTAUTH_SECRET
  fi
  bash scripts/db.sh start
  npx tsx scripts/migrate.ts up >&2
}
