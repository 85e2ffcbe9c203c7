#!/usr/bin/env bash
# MariaDB lifecycle for Evenload: install (Debian's package) if missing, initialise a private data
# directory, start mariadbd on loopback, wait until it answers, create the database and the app
# user, and stop it by its pid. Idempotent: a second start reuses the data and the running server.
#
#   scripts/db.sh start | stop | status
#
# Settings (environment, with local defaults):
#   EVENLOAD_DB_DIR   data directory root   (.data/mariadb)
#   DB_PORT           TCP port on 127.0.0.1 (3307)
#   DB_NAME           database               (evenload)
#   DB_USER/DB_PASSWORD application user     (evenload / evenload-local)
set -euo pipefail
cd "$(dirname "$0")/.."

ROOT_DIR="${EVENLOAD_DB_DIR:-$PWD/.data/mariadb}"
PORT="${DB_PORT:-3307}"
NAME="${DB_NAME:-evenload}"
USER_NAME="${DB_USER:-evenload}"
PASSWORD="${DB_PASSWORD:-evenload-local}"
DATA="$ROOT_DIR/data"
SOCK="$ROOT_DIR/mariadb.sock"
PID="$ROOT_DIR/mariadb.pid"
LOG="$ROOT_DIR/mariadb.log"

log() { printf '[db] %s\n' "$*" >&2; }

ensure_installed() {
  if command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ]; then return; fi
  log "mariadbd not found: installing mariadb-server from Debian's packages"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq mariadb-server >/dev/null
}

mariadbd_bin() { command -v mariadbd 2>/dev/null || echo /usr/sbin/mariadbd; }

is_running() {
  [ -f "$PID" ] && kill -0 "$(cat "$PID")" 2>/dev/null && \
    mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1
}

start() {
  ensure_installed
  mkdir -p "$ROOT_DIR"
  if is_running; then
    log "already running on 127.0.0.1:$PORT (pid $(cat "$PID"))"
  else
    if [ ! -d "$DATA/mysql" ]; then
      log "initialising a private data directory in $DATA"
      mkdir -p "$DATA"
      mariadb-install-db --no-defaults --datadir="$DATA" --user=root \
        --auth-root-authentication-method=normal --skip-test-db >"$ROOT_DIR/install.log" 2>&1
    fi
    rm -f "$SOCK"
    setsid "$(mariadbd_bin)" --no-defaults --user=root --datadir="$DATA" \
      --bind-address=127.0.0.1 --port="$PORT" --socket="$SOCK" --pid-file="$PID" \
      --log-error="$LOG" --skip-name-resolve --max-connections=300 \
      --innodb-buffer-pool-size=256M --local-infile=1 </dev/null >/dev/null 2>&1 &
    for _ in $(seq 1 150); do
      if mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1; then break; fi
      sleep 0.2
    done
    if ! mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1; then
      log "MariaDB did not answer within 30 s; see $LOG"; tail -20 "$LOG" >&2 || true; exit 1
    fi
    log "started on 127.0.0.1:$PORT (pid $(cat "$PID"))"
  fi
  mariadb --no-defaults --socket="$SOCK" -uroot <<SQL
CREATE DATABASE IF NOT EXISTS \`$NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$USER_NAME'@'127.0.0.1' IDENTIFIED BY '$PASSWORD';
CREATE USER IF NOT EXISTS '$USER_NAME'@'localhost' IDENTIFIED BY '$PASSWORD';
GRANT ALL PRIVILEGES ON \`$NAME\`.* TO '$USER_NAME'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$NAME\`.* TO '$USER_NAME'@'localhost';
GRANT ALL PRIVILEGES ON \`${NAME}_scratch\`.* TO '$USER_NAME'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

stop() {
  if [ ! -f "$PID" ]; then log "not running"; return; fi
  local pid; pid="$(cat "$PID")"
  if kill -0 "$pid" 2>/dev/null; then
    kill -TERM "$pid"
    for _ in $(seq 1 100); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    if kill -0 "$pid" 2>/dev/null; then log "still alive after 10 s: KILL"; kill -KILL "$pid"; fi
  fi
  rm -f "$PID"
  log "stopped"
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if is_running; then echo "running (pid $(cat "$PID"), port $PORT)"; else echo "stopped"; exit 1; fi ;;
  *) echo "usage: scripts/db.sh start|stop|status" >&2; exit 2 ;;
esac
