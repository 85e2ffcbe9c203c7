#!/usr/bin/env bash
# npm run bench: the benchmarks, measured side by side in one run on this machine, against a
# database of their own (own data directory and port). Prints a table and writes JSON under
# bench-results/ (git-ignored). The database and mail fake it starts stop when it ends.
set -euo pipefail
source "$(dirname "$0")/setup.sh"
export EVENLOAD_DB_DIR="${EVENLOAD_BENCH_DB_DIR:-$PWD/.data/mariadb-bench}"
export DB_PORT="${EVENLOAD_BENCH_DB_PORT:-3309}"
export DB_NAME="${EVENLOAD_BENCH_DB_NAME:-evenload_bench}"
export SMTP_PORT="${EVENLOAD_BENCH_SMTP_PORT:-2527}"
export EVENLOAD_BENCH_PORT="${EVENLOAD_BENCH_PORT:-3200}"
export NEXTAUTH_URL="http://127.0.0.1:${EVENLOAD_BENCH_PORT}"
evenload_setup
# Stop the bench database and mail fake when the run ends (EVENLOAD_KEEP_BENCH_SERVICES=1 keeps them).
evenload_stop_services_on_exit "${EVENLOAD_KEEP_BENCH_SERVICES:-0}"
npx tsx scripts/migrate.ts seed >&2
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib models proxy.ts next.config.mjs -newer .next/BUILD_ID -print -quit 2>/dev/null)" ]; then
  evenload_log "building the app"
  npx next build >&2
fi
node scripts/build-workers.mjs >&2
mkdir -p bench-results
npx tsx scripts/bench/run-all.ts "$@"
