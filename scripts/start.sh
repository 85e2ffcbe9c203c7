#!/usr/bin/env bash
# npm start: everything needed on a fresh machine, then the app on http://127.0.0.1:3000 with the
# invented demo data (seeded when the database is empty).
set -euo pipefail
source "$(dirname "$0")/setup.sh"
evenload_setup
npx tsx scripts/migrate.ts seed >&2
evenload_ensure_debian_packages /usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf=fonts-dejavu-core
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib models proxy.ts instrumentation-client.ts next.config.mjs tailwind.config.ts -newer .next/BUILD_ID -print -quit 2>/dev/null)" ]; then
  evenload_log "building the app"
  npx next build
fi
node scripts/build-workers.mjs
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://127.0.0.1:${PORT:-3000}}"
# The demo shows captured mail at /dev/outbox (the local SMTP fake started by setup.sh).
export EVENLOAD_OUTBOX="${EVENLOAD_OUTBOX:-1}"
evenload_log "serving on http://127.0.0.1:${PORT:-3000} (demo accounts in README.md; Ctrl-C to stop the app; 'npm run db:stop' stops MariaDB)"
# The background worker (refresher reminders and other jobs in the database) runs beside the app and
# stops with it: SIGTERM lets it finish the job in hand. More instances may each run one.
node_modules/.bin/tsx --conditions=react-server scripts/worker.ts &
worker_pid=$!
trap 'kill -TERM "$worker_pid" 2>/dev/null; wait "$worker_pid" 2>/dev/null || true' EXIT
npx tsx scripts/serve.ts -H 127.0.0.1 -p "${PORT:-3000}"
