#!/usr/bin/env bash
# `npm start`: set up everything on a fresh machine, then run Torquetrail (API and app in one process).
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

ensure_debian_packages
ensure_node_modules

export DB_NAME=${DB_NAME:-torquetrail}
export DB_USER=${DB_USER:-torquetrail}
export DB_PASSWORD=${DB_PASSWORD:-torquetrail-dev}
port=$(cat .data/db/port 2>/dev/null || echo "${DB_PORT:-3406}")
db_start .data/db "$port"
export DB_HOST=127.0.0.1 DB_PORT
trap 'db_stop' EXIT
db_ensure_schema "$DB_NAME" "$DB_USER" "$DB_PASSWORD"

log "running migrations"
npx tsx server/db/migrate.ts up
log "loading demo data (first run only)"
npx tsx server/db/seed.ts
if [ ! -f dist/torquetrail/browser/index.html ] || [ -n "$(find src shared -newer dist/torquetrail/browser/index.html -print -quit)" ]; then
  log "building the client"
  npx ng build --configuration production >/dev/null || die "client build failed"
fi

export NODE_ENV=${NODE_ENV:-production}
# Run the server as a child (not exec) so the EXIT trap stops MariaDB after Ctrl-C.
node --import tsx server/main.ts &
app=$!
trap 'kill -TERM $app 2>/dev/null; wait $app 2>/dev/null; db_stop' INT TERM
wait $app || true
