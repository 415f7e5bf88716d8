#!/usr/bin/env bash
# `npm test`: a throw-away MariaDB, a fresh client build, then every jest project; ends "N passed, N failed".
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

ensure_debian_packages with-browser
# The npm packages and the throw-away MariaDB need nothing of each other: in a fresh clone the database's folder is
# made and started while npm ci waits on the disk.
ensure_node_modules &
modules_pid=$!

dir=".data/test-$$"
export DB_NAME=torquetrail_test DB_USER=torquetrail_test DB_PASSWORD=test-only
db_start "$dir" "$(free_port)"
export DB_HOST=127.0.0.1 DB_PORT
trap 'db_stop; rm -rf "$dir"' EXIT
db_ensure_schema "$DB_NAME" "$DB_USER" "$DB_PASSWORD"
# The audit-tampering specs break the chain on purpose in a database of their own (test/support/tamper-db.ts).
db_ensure_schema "${DB_NAME}_tamper" "$DB_USER" "$DB_PASSWORD"
wait "$modules_pid" || die "the npm packages could not be installed (see above)"

# Throw-away fake SMTP and S3 on free ports for anything that uses the configured ones. No server
# process sends mail during tests: the mail specs drive the sender themselves.
export SMTP_HOST=127.0.0.1 SMTP_PORT=$(free_port) S3_ENDPOINT="http://127.0.0.1:$(free_port)" S3_BUCKET=torquetrail-test MAIL_SENDER=false
fakes_start "$dir/fakes"
trap 'fakes_stop; db_stop; rm -rf "$dir"' EXIT

# Types, lint and format first; each counts as one test in the closing line, and a failure fails npm test, but the
# jest projects still run so one run shows everything. The client build for the end-to-end tests runs beside them:
# all five are independent, and side by side they keep both cores busy (see DEVELOPERS.md, "Tests").
log "building the client for the end-to-end tests (beside the static checks)"
npx ng build --configuration production >/dev/null 2>"$dir/ng-build.log" &
build_pid=$!
checks="$dir/static-checks.txt"
bash scripts/static-checks.sh "$checks"
checks_status=$?
wait "$build_pid"
build_status=$?
cat "$dir/ng-build.log" >&2 # its warnings and errors, after the checks' output rather than inside it
[ "$build_status" -eq 0 ] || die "client build failed"
# Where the time goes (issue 14's 6-minute target is for the whole of npm test from a fresh clone).
log "packages, database, checks and client build ready after ${SECONDS} s"

export NODE_ENV=test DB_ACQUIRE_MS=${DB_ACQUIRE_MS:-300000}
# Server-Timing phases need Node's async context tracking, which costs the API specs (test clients in the server's
# own process) about 25 of their 200 CPU-seconds; server-timing.spec.ts switches them on for itself.
export SERVER_TIMING_PHASES=${SERVER_TIMING_PHASES:-false}
results="$dir/jest-results.json"
# jest's default on two cores is one worker, but API and browser specs mostly wait on MariaDB and Chromium.
# Measured here (6 API spec files, 89 tests, same busy machine, one run after the other): 1 worker 376 s,
# 3 workers 267 s, all green both times; the whole suite from a fresh clone, quiet: 3 workers 706 and 622 s, 4 workers 704 s.
# TEST_WORKERS overrides it (1 runs everything in sequence).
npx jest --ci --maxWorkers="${TEST_WORKERS:-3}" --json --outputFile="$results" "$@"
status=$?
[ "$status" -eq 0 ] && status=$checks_status
log "npm test took ${SECONDS} s in all"
# The promised closing line, printed last so nothing follows it: jest's tests plus one per static check.
node -e '
  const fs = require("fs");
  const [results, checks] = process.argv.slice(1);
  const lines = fs.existsSync(checks) ? fs.readFileSync(checks, "utf8").split("\n") : [];
  let passed = lines.filter((l) => l.startsWith("passed ")).length;
  let failed = lines.filter((l) => l.startsWith("failed ")).length;
  if (fs.existsSync(results)) {
    const r = require(results);
    passed += r.numPassedTests;
    failed += r.numFailedTests + r.numRuntimeErrorTestSuites;
  } else failed += 1;
  console.log(`\n${passed} passed, ${failed} failed`);
' "$(pwd)/$results" "$(pwd)/$checks"
exit $status
