#!/usr/bin/env bash
# npm run scale-check: the app scaled out on loopback and checked through a real load balancer.
#
# Starts a MariaDB primary and a replica (Debian's mariadb-server; binlog replication with GTIDs, the
# replica delayed by EVENLOAD_SCALE_REPLICA_DELAY_S so a read that wrongly goes there is seen), two
# instances of the built app (scripts/serve.ts, as `npm start` serves it) with DB_READ_HOSTS naming
# the replica, and HAProxy (Debian's haproxy, installed when missing) in front with health checks on
# /api/health and retries for idempotent requests. Then scripts/scale-check/run.ts drives sessions
# through the balancer, prints a table and exits non-zero when a check fails. Everything started
# here is stopped when the script ends, also on failure or Ctrl-C. Data lives in .data/scale (new
# each run).
#
# Settings (environment): EVENLOAD_SCALE_LB_PORT (4900), EVENLOAD_SCALE_APP1_PORT (4901),
# EVENLOAD_SCALE_APP2_PORT (4902), EVENLOAD_SCALE_SMTP_PORT (4910), EVENLOAD_SCALE_PRIMARY_PORT (3400),
# EVENLOAD_SCALE_REPLICA_PORT (3401), EVENLOAD_SCALE_DIR (.data/scale), EVENLOAD_SCALE_REPLICA_DELAY_S (2).
set -euo pipefail
source "$(dirname "$0")/setup.sh"
cd "$(dirname "$0")/.."

export SCALE_DIR="${EVENLOAD_SCALE_DIR:-$PWD/.data/scale}"
export SCALE_LB_PORT="${EVENLOAD_SCALE_LB_PORT:-4900}"
export SCALE_APP1_PORT="${EVENLOAD_SCALE_APP1_PORT:-4901}"
export SCALE_APP2_PORT="${EVENLOAD_SCALE_APP2_PORT:-4902}"
export SCALE_PRIMARY_PORT="${EVENLOAD_SCALE_PRIMARY_PORT:-3400}"
export SCALE_REPLICA_PORT="${EVENLOAD_SCALE_REPLICA_PORT:-3401}"
export SCALE_REPLICA_DELAY_S="${EVENLOAD_SCALE_REPLICA_DELAY_S:-2}"
export NEXT_TELEMETRY_DISABLED=1
# The app's and the driver's settings: the primary takes writes, the replica reads.
export DB_HOST=127.0.0.1 DB_PORT="$SCALE_PRIMARY_PORT" DB_NAME="${EVENLOAD_SCALE_DB_NAME:-evenload_scale}"
export DB_USER="${DB_USER:-evenload}" DB_PASSWORD="${DB_PASSWORD:-evenload-local}"
export SMTP_PORT="${EVENLOAD_SCALE_SMTP_PORT:-4910}"
export NEXTAUTH_URL="http://127.0.0.1:${SCALE_LB_PORT}"
REPL_PASSWORD="evenload-replication-local"

log() { printf '[scale-check] %s\n' "$*" >&2; }

ensure_package() { # $1 binary, $2 Debian package
  if command -v "$1" >/dev/null 2>&1 || [ -x "/usr/sbin/$1" ]; then return; fi
  log "$1 not found: installing $2 from Debian's packages"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq "$2" >/dev/null
}

mariadbd_bin() { command -v mariadbd 2>/dev/null || echo /usr/sbin/mariadbd; }
haproxy_bin() { command -v haproxy 2>/dev/null || echo /usr/sbin/haproxy; }

# --- stopping: every process by the pid file it wrote --------------------------------------------
# setsid made each started process the leader of its own group (an app instance is tsx with its node
# child), so the group is signalled by the leader's id; a pid that leads no group is signalled alone.
stop_pid_file() { # $1 pid file
  [ -s "$1" ] || return 0
  local pid target; pid="$(cat "$1")"
  target="$pid"
  [ "$(ps -o pgid= -p "$pid" 2>/dev/null | tr -d ' ')" = "$pid" ] && target="-$pid"
  if kill -0 -- "$target" 2>/dev/null; then
    kill -TERM -- "$target" 2>/dev/null || true
    for _ in $(seq 1 100); do kill -0 -- "$target" 2>/dev/null || break; sleep 0.1; done
    kill -0 -- "$target" 2>/dev/null && kill -KILL -- "$target" 2>/dev/null || true
  fi
  rm -f "$1"
}

cleanup() {
  local status=$?
  trap - EXIT INT TERM
  log "stopping everything scale-check started"
  stop_pid_file "$SCALE_DIR/haproxy.pid"
  stop_pid_file "$SCALE_DIR/app1.pid"
  stop_pid_file "$SCALE_DIR/app2.pid"
  evenload_mail_fake_stop
  stop_pid_file "$SCALE_DIR/replica/mariadb.pid"
  stop_pid_file "$SCALE_DIR/primary/mariadb.pid"
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT TERM

# --- MariaDB primary and replica ------------------------------------------------------------------
start_mariadb() { # $1 name, $2 port, $3 server id, extra mariadbd options after
  local name="$1" port="$2" id="$3"; shift 3
  local root="$SCALE_DIR/$name"
  mkdir -p "$root/data"
  mariadb-install-db --no-defaults --datadir="$root/data" --user=root \
    --auth-root-authentication-method=normal --skip-test-db >"$root/install.log" 2>&1
  setsid "$(mariadbd_bin)" --no-defaults --user=root --datadir="$root/data" \
    --bind-address=127.0.0.1 --port="$port" --socket="$root/mariadb.sock" --pid-file="$root/mariadb.pid" \
    --log-error="$root/mariadb.log" --skip-name-resolve --max-connections=300 \
    --innodb-buffer-pool-size=128M --local-infile=1 \
    --server-id="$id" --log-bin="$root/binlog" --binlog-format=ROW --gtid-strict-mode=1 \
    --log-bin-trust-function-creators=1 "$@" \
    </dev/null >/dev/null 2>&1 &
  for _ in $(seq 1 150); do
    mariadb-admin --no-defaults --socket="$root/mariadb.sock" -uroot ping >/dev/null 2>&1 && { log "$name MariaDB on 127.0.0.1:$port"; return; }
    sleep 0.2
  done
  log "$name MariaDB did not answer within 30 s; see $root/mariadb.log"; tail -20 "$root/mariadb.log" >&2 || true
  return 1
}
sql() { mariadb --no-defaults --socket="$SCALE_DIR/$1/mariadb.sock" -uroot -N -B; }

ensure_package mariadbd mariadb-server
ensure_package haproxy haproxy
# A previous run stopped hard: stop what its pid files name, then start afresh.
for f in haproxy app1 app2 replica/mariadb primary/mariadb; do stop_pid_file "$SCALE_DIR/$f.pid"; done
rm -rf "$SCALE_DIR"
mkdir -p "$SCALE_DIR"

start_mariadb primary "$SCALE_PRIMARY_PORT" 1
start_mariadb replica "$SCALE_REPLICA_PORT" 2 --log-slave-updates --read-only=1
sql primary <<SQL
CREATE DATABASE \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
CREATE USER 'replication'@'127.0.0.1' IDENTIFIED BY '$REPL_PASSWORD';
GRANT REPLICATION SLAVE ON *.* TO 'replication'@'127.0.0.1';
SQL
sql replica <<SQL
CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=$SCALE_PRIMARY_PORT, MASTER_USER='replication',
  MASTER_PASSWORD='$REPL_PASSWORD', MASTER_USE_GTID=slave_pos, MASTER_DELAY=$SCALE_REPLICA_DELAY_S;
START SLAVE;
SQL

# --- schema, demo data and mail fake (on the primary; the replica follows) ------------------------
if [ -z "${NEXTAUTH_SECRET:-}" ]; then
  mkdir -p .data
  [ -s .data/nextauth-secret ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" > .data/nextauth-secret
  NEXTAUTH_SECRET="$(cat .data/nextauth-secret)"
  export NEXTAUTH_SECRET
fi
npx tsx scripts/migrate.ts up >"$SCALE_DIR/migrate.log" 2>&1 || { tail -20 "$SCALE_DIR/migrate.log" >&2; exit 1; }
npx tsx scripts/migrate.ts seed >>"$SCALE_DIR/migrate.log" 2>&1 || { tail -20 "$SCALE_DIR/migrate.log" >&2; exit 1; }
log "migrated and seeded the primary"
evenload_mail_fake

# --- the built app, twice ------------------------------------------------------------------------
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib models proxy.ts instrumentation-client.ts next.config.mjs -newer .next/BUILD_ID -print -quit 2>/dev/null)" ]; then
  log "building the app"
  npx next build >&2
fi
node scripts/build-workers.mjs >&2
start_app() { # $1 name, $2 port
  DB_READ_HOSTS="127.0.0.1:$SCALE_REPLICA_PORT" EVENLOAD_TRUSTED_PROXIES=127.0.0.1 EVENLOAD_OUTBOX=1 \
    setsid node_modules/.bin/tsx scripts/serve.ts -H 127.0.0.1 -p "$2" </dev/null >"$SCALE_DIR/$1.log" 2>&1 &
  echo $! >"$SCALE_DIR/$1.pid"
  disown $! # killed on purpose by a check: no job report from bash
}
start_app app1 "$SCALE_APP1_PORT"
start_app app2 "$SCALE_APP2_PORT"
for port in "$SCALE_APP1_PORT" "$SCALE_APP2_PORT"; do
  for _ in $(seq 1 300); do curl -fsS "http://127.0.0.1:$port/api/health" >/dev/null 2>&1 && break; sleep 0.2; done
  curl -fsS "http://127.0.0.1:$port/api/health" >/dev/null || { log "the app on port $port did not become healthy"; tail -20 "$SCALE_DIR"/app*.log >&2; exit 1; }
done
log "app instances on 127.0.0.1:$SCALE_APP1_PORT and :$SCALE_APP2_PORT"

# --- HAProxy in front ----------------------------------------------------------------------------
sed -e "s/@LB_PORT@/$SCALE_LB_PORT/" -e "s/@APP1_PORT@/$SCALE_APP1_PORT/" -e "s/@APP2_PORT@/$SCALE_APP2_PORT/" \
  scripts/scale-check/haproxy.cfg >"$SCALE_DIR/haproxy.cfg"
"$(haproxy_bin)" -c -q -f "$SCALE_DIR/haproxy.cfg"
setsid "$(haproxy_bin)" -db -f "$SCALE_DIR/haproxy.cfg" </dev/null >"$SCALE_DIR/haproxy.log" 2>&1 &
echo $! >"$SCALE_DIR/haproxy.pid"
for _ in $(seq 1 50); do curl -fsS "http://127.0.0.1:$SCALE_LB_PORT/api/health" >/dev/null 2>&1 && break; sleep 0.2; done
log "HAProxy on 127.0.0.1:$SCALE_LB_PORT"

# --- the checks ----------------------------------------------------------------------------------
npx tsx --conditions=react-server scripts/scale-check/run.ts
