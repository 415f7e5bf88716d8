#!/usr/bin/env bash
# Type, lint and format checks: `npm run check`, and the first step of `npm test`. Each check prints its findings
# and one line "passed|failed <check> (<s> s)"; with a file argument, those lines are also appended to it, so
# scripts/test.sh counts each check as one test in its closing "N passed, N failed" line. Exits 1 if any failed.
# The client (tsconfig.app.json) is type-checked twice over already: by the spec check below, which includes every
# file under src/, and by `ng build`, which npm test runs; `npm run typecheck` checks it on its own as well.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
results="${1:-/dev/null}"
cache=node_modules/.cache/torquetrail-checks
mkdir -p "$cache"
failed=0

check() {
  local name="$1" start=$SECONDS
  shift
  if "$@"; then
    echo "passed $name ($((SECONDS - start)) s)" | tee -a "$results"
  else
    printf '\033[1;31m[torquetrail]\033[0m failed %s (%s s): %s\n' "$name" "$((SECONDS - start))" "$*" >&2
    echo "failed $name" >>"$results"
    failed=1
  fi
}

log "static checks: types (server, client and specs), ESLint, Prettier"
# --incremental keeps tsc's work between runs in the cache folder; a fresh clone checks everything.
check "types: server, shared, scripts, migrations, test (tsconfig.server.json)" \
  npx tsc --noEmit -p tsconfig.server.json --incremental --tsBuildInfoFile "$cache/server.tsbuildinfo"
# Jest compiles component specs as CommonJS file by file; a whole-program check must resolve Angular's packages the
# way the build does (their types are only reachable through package exports), hence the bundler resolution here.
check "types: client and its specs (tsconfig.spec.json)" \
  npx tsc --noEmit -p tsconfig.spec.json --module preserve --moduleResolution bundler \
  --incremental --tsBuildInfoFile "$cache/spec.tsbuildinfo"
check "lint: ESLint (npm run lint)" npx eslint . --cache --cache-location "$cache/eslint"
check "format: Prettier (npm run format to fix)" npx prettier --check . --log-level warn --cache
exit $failed
