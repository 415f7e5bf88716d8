#!/usr/bin/env bash
# Shared set-up steps for `npm start` and `npm test`: packages, a private MariaDB, migrations.
# Everything here is idempotent so that a second run, or a run after a killed one, just works.

# The S3 client is pinned to a release that runs on Node 20 (TOOLCHAIN.md); its notice that later
# releases will need Node 22 is known and only clutters every log line of ours.
export AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED="${AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED:-true}"

log() { printf '\033[1;36m[torquetrail]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[torquetrail]\033[0m %s\n' "$*" >&2; exit 1; }

# Debian packages the product needs on this machine; installed once, non-interactively.
ensure_debian_packages() {
  local missing=()
  command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ] || missing+=(mariadb-server mariadb-client)
  if [ "${1:-}" = "with-browser" ]; then
    command -v chromium >/dev/null 2>&1 || missing+=(chromium)
    command -v pdftoppm >/dev/null 2>&1 || missing+=(poppler-utils)
  fi
  if [ "${1:-}" = "with-cluster" ]; then
    # The Galera test: galera-4 comes with mariadb-server; state transfer needs mariadb-backup and socat.
    [ -f /usr/lib/galera/libgalera_smm.so ] || missing+=(galera-4)
    command -v mariadb-backup >/dev/null 2>&1 || missing+=(mariadb-backup)
    command -v socat >/dev/null 2>&1 || missing+=(socat)
    command -v haproxy >/dev/null 2>&1 || [ -x /usr/sbin/haproxy ] || missing+=(haproxy)
  fi
  [ -f /usr/share/fonts/truetype/dejavu/DejaVuSans.ttf ] || missing+=(fonts-dejavu-core)
  [ ${#missing[@]} -eq 0 ] && return 0
  log "installing Debian packages: ${missing[*]}"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null || die "apt-get update failed"
  apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null || die "apt-get install ${missing[*]} failed"
}

# npm packages: install when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error || die "npm ci failed"
  fi
}

free_port() {
  node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})'
}

# db_start DATADIR PORT — a private MariaDB on 127.0.0.1 whose files live in DATADIR.
db_start() {
  local dir="$1" port="$2"
  mkdir -p "$dir"
  dir=$(cd "$dir" && pwd)
  DB_SOCKET="$dir/mysqld.sock"
  # Unix sockets are limited to 107 bytes; deep checkouts fall back to a short path.
  if [ ${#DB_SOCKET} -gt 100 ]; then DB_SOCKET="/tmp/tt-$(echo "$dir" | md5sum | cut -c1-12).sock"; fi
  DB_PID="$dir/mysqld.pid"
  if [ ! -d "$dir/data/mysql" ]; then
    log "initialising MariaDB data folder $dir/data"
    mariadb-install-db --user=root --datadir="$dir/data" --auth-root-authentication-method=normal \
      --skip-test-db >"$dir/install.log" 2>&1 || die "mariadb-install-db failed (see $dir/install.log)"
  fi
  # A killed run leaves a pid file and socket behind: clear them if their process is gone.
  if [ -f "$DB_PID" ] && kill -0 "$(cat "$DB_PID")" 2>/dev/null; then
    log "MariaDB already running (pid $(cat "$DB_PID"))"
    DB_PORT=$(cat "$dir/port" 2>/dev/null || echo "$port")
    return 0
  fi
  rm -f "$DB_PID" "$DB_SOCKET"
  echo "$port" >"$dir/port"
  # A pool of threads (one group per core) runs the statements of the app's pooled connections instead of a thread
  # each: at 32 clients on two cores MariaDB spent a quarter to a third less CPU a statement (DEVELOPERS.md, "Measuring
  # speed"); a statement that waits on a lock or a sleep hands its slot to another.
  /usr/sbin/mariadbd --no-defaults --user=root --datadir="$dir/data" --bind-address=127.0.0.1 --port="$port" \
    --socket="$DB_SOCKET" --pid-file="$DB_PID" --log-error="$dir/error.log" \
    --innodb-buffer-pool-size=256M --innodb-log-file-size=96M --max-allowed-packet=64M --skip-name-resolve \
    --thread-handling=pool-of-threads \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci 2>>"$dir/error.log" &
  local i
  for i in $(seq 1 120); do
    mariadb-admin --no-defaults --socket="$DB_SOCKET" -uroot ping >/dev/null 2>&1 && break
    sleep 0.25
  done
  mariadb-admin --no-defaults --socket="$DB_SOCKET" -uroot ping >/dev/null 2>&1 || die "MariaDB did not start (see $dir/error.log)"
  DB_PORT="$port"
}

# db_ensure_schema NAME USER PASSWORD — the database and an application account limited to it.
db_ensure_schema() {
  mariadb --no-defaults --socket="$DB_SOCKET" -uroot <<SQL || die "could not create database $1"
CREATE DATABASE IF NOT EXISTS \`$1\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$2'@'127.0.0.1' IDENTIFIED BY '$3';
GRANT ALL PRIVILEGES ON \`$1\`.* TO '$2'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

db_stop() {
  [ -n "${DB_PID:-}" ] && [ -f "$DB_PID" ] || return 0
  local pid; pid=$(cat "$DB_PID")
  kill "$pid" 2>/dev/null || return 0
  local i
  for i in $(seq 1 80); do kill -0 "$pid" 2>/dev/null || return 0; sleep 0.25; done
  kill -9 "$pid" 2>/dev/null || true
}

# port_in_use PORT — true when something listens on 127.0.0.1:PORT.
port_in_use() {
  node -e 'const s=require("net").connect(+process.argv[1],"127.0.0.1");s.on("connect",()=>process.exit(0));s.on("error",()=>process.exit(1))' "$1"
}

# fakes_start DIR — the fake SMTP server and s3rver (scripts/fake-services.ts) beside the app,
# on SMTP_PORT and the port of S3_ENDPOINT, with their files in DIR. A pid file left by a killed
# run is ignored when its process is gone (or is no longer ours).
fakes_start() {
  local dir="$1" pid
  mkdir -p "$dir"
  FAKES_PID="$dir/fakes.pid"
  if [ -f "$FAKES_PID" ]; then
    pid=$(cat "$FAKES_PID")
    if kill -0 "$pid" 2>/dev/null && grep -q fake-services "/proc/$pid/cmdline" 2>/dev/null; then
      log "fake mail and storage already running (pid $pid)"
      return 0
    fi
    rm -f "$FAKES_PID"
  fi
  FAKE_DATA_DIR="$dir" node --import tsx scripts/fake-services.ts >"$dir/fakes.log" 2>&1 &
  echo $! >"$FAKES_PID"
  local i
  for i in $(seq 1 120); do
    grep -q 'fake services ready' "$dir/fakes.log" 2>/dev/null && return 0
    kill -0 "$(cat "$FAKES_PID")" 2>/dev/null || break
    sleep 0.25
  done
  tail -n 5 "$dir/fakes.log" >&2
  die "the fake mail and storage services did not start (see $dir/fakes.log)"
}

fakes_stop() {
  [ -n "${FAKES_PID:-}" ] && [ -f "$FAKES_PID" ] || return 0
  local pid; pid=$(cat "$FAKES_PID")
  if kill -0 "$pid" 2>/dev/null && grep -q fake-services "/proc/$pid/cmdline" 2>/dev/null; then
    kill "$pid" 2>/dev/null
    local i
    for i in $(seq 1 40); do kill -0 "$pid" 2>/dev/null || break; sleep 0.25; done
  fi
  rm -f "$FAKES_PID"
}
