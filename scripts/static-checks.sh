#!/usr/bin/env bash
# Type, lint and format checks: `npm run check`, and the first step of `npm test`. Each check prints its findings
# and one line "passed|failed <check> (<s> s)"; with a file argument, those lines are also appended to it, so
# scripts/test.sh counts each check as one test in its closing "N passed, N failed" line. Exits 1 if any failed.
# The client (tsconfig.app.json) is type-checked twice over already: by the spec check below, which includes every
# file under src/, and by `ng build`, which npm test runs; `npm run typecheck` checks it on its own as well.
# The four checks are single-threaded and independent, so they run side by side (on two cores, about half the
# time of one after the other); each one's output is held back and printed whole, in the order below.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
results="${1:-/dev/null}"
cache=node_modules/.cache/torquetrail-checks
mkdir -p "$cache"
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
names=()

# check NAME COMMAND...: starts the check in the background; its output and status go to files of its own.
check() {
  local name="$1" n=${#names[@]}
  shift
  names+=("$name")
  (
    start=$SECONDS
    "$@" >"$out/$n.log" 2>&1
    status=$?
    echo "$status $((SECONDS - start)) $*" >"$out/$n.status"
  ) &
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
wait

failed=0
for n in "${!names[@]}"; do
  cat "$out/$n.log"
  read -r status seconds command <"$out/$n.status" 2>/dev/null || { status=1 seconds='?' command='(no status)'; }
  if [ "$status" -eq 0 ]; then
    echo "passed ${names[$n]} ($seconds s)" | tee -a "$results"
  else
    printf '\033[1;31m[torquetrail]\033[0m failed %s (%s s): %s\n' "${names[$n]}" "$seconds" "$command" >&2
    echo "failed ${names[$n]}" >>"$results"
    failed=1
  fi
done
exit $failed
