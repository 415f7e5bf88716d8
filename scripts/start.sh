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

# Mail goes to a local fake SMTP server and attachments to s3rver, unless the environment names
# real ones. A busy default port (another checkout) moves to a free one for this run.
export SMTP_HOST=${SMTP_HOST:-127.0.0.1} S3_BUCKET=${S3_BUCKET:-torquetrail-attachments}
if [ -z "${SMTP_PORT:-}" ]; then SMTP_PORT=2525; port_in_use 2525 && SMTP_PORT=$(free_port); fi
if [ -z "${S3_ENDPOINT:-}" ]; then s3_port=4569; port_in_use 4569 && s3_port=$(free_port); S3_ENDPOINT="http://127.0.0.1:$s3_port"; fi
export SMTP_PORT S3_ENDPOINT
fakes_start .data/fakes
trap 'fakes_stop; db_stop' EXIT

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
trap 'kill -TERM $app 2>/dev/null; wait $app 2>/dev/null; fakes_stop; db_stop' INT TERM
wait $app || true
