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
  evenload_mail_fake
}

# The local SMTP fake (scripts/mail-fake.ts) on 127.0.0.1:SMTP_PORT, storing mail in the database
# named by DB_*. Started in the background with setsid, once: a pid file per port under .data
# makes a second call reuse it.
evenload_mail_fake() {
  export SMTP_PORT="${SMTP_PORT:-2525}"
  local pid_file=".data/mail-fake-${SMTP_PORT}.pid"
  if [ -s "$pid_file" ] && kill -0 "$(cat "$pid_file")" 2>/dev/null; then
    evenload_log "mail fake already running on 127.0.0.1:${SMTP_PORT} (pid $(cat "$pid_file"))"
    return
  fi
  if (exec 3<>"/dev/tcp/127.0.0.1/${SMTP_PORT}") 2>/dev/null; then
    evenload_log "port ${SMTP_PORT} is taken by another process: mail goes there (set SMTP_PORT to use another port)"
    return
  fi
  setsid node_modules/.bin/tsx scripts/mail-fake.ts </dev/null >".data/mail-fake-${SMTP_PORT}.log" 2>&1 &
  echo $! > "$pid_file"
  # Up to 60 s: tsx compiles the fake on start, which takes long on a loaded 2-core machine.
  for _ in $(seq 1 300); do
    if (exec 3<>"/dev/tcp/127.0.0.1/${SMTP_PORT}") 2>/dev/null; then
      evenload_log "mail fake listening on 127.0.0.1:${SMTP_PORT} (pid $(cat "$pid_file"), log .data/mail-fake-${SMTP_PORT}.log)"
      return
    fi
    sleep 0.2
  done
  evenload_log "the mail fake did not start; see .data/mail-fake-${SMTP_PORT}.log"
  return 1
}

# Stops the mail fake started for SMTP_PORT (by its pid).
evenload_mail_fake_stop() {
  local pid_file=".data/mail-fake-${SMTP_PORT:-2525}.pid"
  if [ -s "$pid_file" ] && kill -0 "$(cat "$pid_file")" 2>/dev/null; then kill "$(cat "$pid_file")"; fi
  rm -f "$pid_file"
}

# Stops this command's MariaDB (by its pid file) and mail fake when the calling script exits, unless
# the keep flag given as $1 is 1 (then they stay up for a quick rerun).
evenload_stop_services_on_exit() {
  if [ "${1:-0}" != "1" ]; then
    trap 'evenload_mail_fake_stop; bash scripts/db.sh stop >/dev/null 2>&1 || true' EXIT
  fi
}

# Records of training embed DejaVu Sans (Debian's fonts-dejavu-core); the tests also read PDFs back
# with poppler-utils (pdftotext, pdftoppm). Each is installed when missing.
evenload_ensure_debian_packages() {
  local missing=()
  for pair in "$@"; do
    [ -e "${pair%%=*}" ] || missing+=("${pair#*=}")
  done
  [ "${#missing[@]}" -eq 0 ] && return 0
  evenload_log "installing Debian's ${missing[*]}"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq "${missing[@]}" >/dev/null
}
