#!/usr/bin/env bash
# `npm run test:cluster`: a three-node MariaDB Galera cluster, HAProxy and two app instances on
# loopback; four clients sign off 100 calcs while a database node and an app instance are killed
# (scripts/cluster/run.ts). Everything lives in .data/cluster-PID and is removed afterwards.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_debian_packages with-cluster
ensure_node_modules

dir="$(pwd)/.data/cluster-$$"
mkdir -p "$dir"
: >"$dir/pids"
# Every process the run started is in $dir/pids, so even a killed run leaves nothing behind.
cleanup() {
  local pid
  while read -r pid; do [ -n "$pid" ] && kill -9 "$pid" 2>/dev/null; done <"$dir/pids"
  fakes_stop
  if [ "${KEEP_CLUSTER_DATA:-}" = 1 ]; then log "cluster files kept in $dir"; else rm -rf "$dir"; fi
}
trap cleanup EXIT
trap 'exit 130' INT TERM

# Attachments go to s3rver and mail to the fake SMTP server, as in npm test.
export SMTP_HOST=127.0.0.1 SMTP_PORT=$(free_port) S3_ENDPOINT="http://127.0.0.1:$(free_port)" S3_BUCKET=torquetrail-cluster
fakes_start "$dir/fakes"
log "cluster test: three Galera nodes, HAProxy, two app instances (files in $dir)"
node --import tsx scripts/cluster/run.ts "$dir"
