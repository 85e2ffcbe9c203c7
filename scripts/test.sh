#!/usr/bin/env bash
# npm test: a test database of its own (own data directory and port, so the demo data is never
# touched), Chromium installed with apt if missing, a production build, then every vitest project.
# Ends with one line: "vitest: N passed, N failed, N skipped"; non-zero exit if anything failed or
# nothing ran.
set -euo pipefail
source "$(dirname "$0")/setup.sh"
export EVENLOAD_DB_DIR="${EVENLOAD_TEST_DB_DIR:-$PWD/.data/mariadb-test}"
export DB_PORT="${EVENLOAD_TEST_DB_PORT:-3308}"
export DB_NAME="${EVENLOAD_TEST_DB_NAME:-evenload_test}"
export EVENLOAD_TEST_PORT="${EVENLOAD_TEST_PORT:-3100}"
export NEXTAUTH_URL="http://127.0.0.1:${EVENLOAD_TEST_PORT}"
# The tests' own mail fake port (2526 unless set), so it never mixes with `npm start`'s on 2525.
export SMTP_PORT="${EVENLOAD_TEST_SMTP_PORT:-${SMTP_PORT:-2526}}"
evenload_setup
# Stop the test database and the mail fake when the tests end (set EVENLOAD_KEEP_TEST_SERVICES=1 to
# keep them for a quick rerun), so the test ports are free for the next run or another checkout.
evenload_stop_services_on_exit "${EVENLOAD_KEEP_TEST_SERVICES:-0}"
# The test database holds the same invented demo scenario; tests add and remove their own rows.
npx tsx scripts/migrate.ts seed >&2

if ! command -v chromium >/dev/null 2>&1; then
  evenload_log "chromium not found: installing Debian's chromium"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq chromium >/dev/null
fi

# The saved-comparison package test runs the package's Python script with Debian's python3 (the
# pyenv python3 earlier on PATH has no statsmodels), so its numpy, scipy and statsmodels are installed
# when missing.
if ! /usr/bin/python3 -c 'import numpy, scipy, statsmodels' >/dev/null 2>&1; then
  evenload_log "installing Debian's python3-numpy, python3-scipy and python3-statsmodels"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq python3 python3-numpy python3-scipy python3-statsmodels >/dev/null
fi

# Records of training embed DejaVu Sans; their tests read the PDF back with pdftotext and render it with pdftoppm.
evenload_ensure_debian_packages /usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf=fonts-dejavu-core /usr/bin/pdftotext=poppler-utils

if [ "${EVENLOAD_SKIP_BUILD:-0}" != "1" ]; then
  evenload_log "building the app for the end-to-end tests (next build also type-checks the whole project)"
  npx next build >&2
fi
# The upload parse worker is a plain JS file beside the build (lib/data/runs/parse-upload-worker.ts).
node scripts/build-workers.mjs >&2

mkdir -p test-results
set +e
npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json "$@"
status=$?
set -e
node -e '
const fs = require("fs");
let r = null;
try { r = JSON.parse(fs.readFileSync("test-results/vitest.json", "utf8")); } catch {}
if (!r) { console.log("vitest: 0 passed, 0 failed, 0 skipped"); process.exit(1); }
const skipped = (r.numPendingTests || 0) + (r.numTodoTests || 0);
console.log(`vitest: ${r.numPassedTests} passed, ${r.numFailedTests} failed, ${skipped} skipped`);
process.exit(r.numTotalTests > 0 && r.numFailedTests === 0 && r.success !== false ? 0 : 1);
' || status=1
exit $status
