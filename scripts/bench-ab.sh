#!/usr/bin/env bash
# `npm run bench:ab -- <other checkout> [path …]`: this checkout against another on the list bench's kept library
# (scripts/bench-ab.ts). The library must have been seeded by `npm run bench` first.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_debian_packages
ensure_node_modules
lists_dir="${BENCH_LISTS_DIR:-.data/bench-lists}"
[ -d "$lists_dir" ] || { echo "bench:ab: no library in $lists_dir; run npm run bench once first" >&2; exit 2; }
export DB_NAME=torquetrail_bench DB_USER=torquetrail_bench DB_PASSWORD=bench-only LOG_LEVEL=silent
db_start "$lists_dir" "$(free_port)"
export DB_HOST=127.0.0.1 DB_PORT DB_POOL_MAX="${DB_POOL_MAX:-20}"
trap 'db_stop' EXIT
db_ensure_schema "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
npx tsx scripts/bench-ab.ts "$@"
